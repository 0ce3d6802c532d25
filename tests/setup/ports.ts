import { createHash } from 'node:crypto';

/**
 * Ports of a test run, offset by the checkout's path so two checkouts on one machine
 * (a developer's tree and a CI clone) never share a database, mail service or server.
 */
const offset = parseInt(createHash('sha1').update(process.cwd()).digest('hex').slice(0, 6), 16) % 400;

export const testPorts = {
	postgres: Number(process.env.BUNCHLINE_TEST_PG_PORT ?? 55000 + offset),
	smtp: Number(process.env.BUNCHLINE_TEST_SMTP_PORT ?? 56000 + offset * 4),
	app: Number(process.env.BUNCHLINE_E2E_PORT ?? 57000 + offset)
};
