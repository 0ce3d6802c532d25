import type { Config } from 'tailwindcss';

/**
 * Design tokens, taken from the plant: bract maroon, leaf green, pseudostem cream,
 * soil brown, with ripe gold as the one accent. Loaded from src/app.css with @config.
 * Shades are chosen for high contrast outdoors (text pairs pass WCAG AA).
 */
export default {
	content: ['./src/**/*.{html,svelte,ts,md}'],
	theme: {
		extend: {
			colors: {
				bract: { 50: '#fbf1f3', 100: '#f3dce1', 300: '#c77d8c', 500: '#8e2f45', 700: '#6b1f33', 900: '#3f0f1d' },
				leaf: { 50: '#eff7ee', 100: '#d6ebd3', 300: '#8cc083', 500: '#3f7f3a', 700: '#2b5c28', 900: '#173316' },
				cream: { 50: '#fdfbf4', 100: '#f8f2e1', 200: '#efe4c4', 300: '#e2d1a0' },
				soil: { 300: '#a88b74', 500: '#6e5340', 700: '#4a3628', 900: '#2a1e16' },
				gold: { 300: '#f3d27a', 400: '#eabb3b', 500: '#d39e12', 700: '#8a6508' }
			},
			fontFamily: {
				serif: ['Lora', 'Georgia', 'serif'],
				sans: ['"Inter Variable"', 'system-ui', 'sans-serif']
			}
		}
	}
} satisfies Config;
