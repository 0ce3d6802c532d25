import { sveltekit } from '@sveltejs/kit/vite';
import tailwindcss from '@tailwindcss/vite';
import { defineConfig } from 'vitest/config';

export default defineConfig({
	plugins: [tailwindcss(), sveltekit()],
	server: { host: '127.0.0.1' },
	test: {
		projects: [
			{
				extends: true,
				test: { name: 'unit', include: ['tests/unit/**/*.test.ts'], environment: 'node' }
			},
			{
				extends: true,
				test: {
					name: 'integration',
					include: ['tests/integration/**/*.test.ts'],
					globalSetup: ['tests/setup/database.ts', 'tests/setup/mail.ts', 'tests/setup/worker.ts'],
					fileParallelism: false,
					testTimeout: 30_000,
					hookTimeout: 60_000
				}
			},
			{
				extends: true,
				test: {
					// Attacks on the running production build and its services, each test named with its OWASP ASVS 5.0 requirement.
					name: 'security',
					include: ['tests/security/**/*.test.ts'],
					globalSetup: ['tests/setup/database.ts', 'tests/setup/mail.ts', 'tests/setup/worker.ts', 'tests/setup/server.ts'],
					fileParallelism: false,
					testTimeout: 60_000,
					hookTimeout: 180_000
				}
			},
			{
				extends: true,
				test: {
					name: 'e2e',
					include: ['tests/e2e/**/*.test.ts'],
					// A real browser on a shared 2-core machine: one retry absorbs a scheduling hiccup, not a bug that repeats.
					retry: 1,
					globalSetup: ['tests/setup/database.ts', 'tests/setup/mail.ts', 'tests/setup/worker.ts', 'tests/setup/server.ts'],
					fileParallelism: false,
					testTimeout: 60_000,
					hookTimeout: 180_000
				}
			}
		]
	}
});
