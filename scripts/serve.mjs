// The production server: SvelteKit's adapter-node handler behind the security headers, so the
// static files it serves itself (/_app, favicon) carry them too, and a clean stop on SIGTERM:
// no new connections, in-flight requests finish, then the app closes its database pool and job
// queue ('sveltekit:shutdown', handled in hooks.server.ts) and the process exits.
// Reads HOST, PORT, ORIGIN, ADDRESS_HEADER, XFF_DEPTH as adapter-node does; SHUTDOWN_TIMEOUT (s, default 10).
import http from 'node:http';
import { resolve } from 'node:path';
import { pathToFileURL } from 'node:url';
import { environmentOrExit, DEFAULTS } from '../src/lib/server/env.js';
import { SECURITY_HEADERS } from '../src/lib/server/security-headers.js';

const env = environmentOrExit();
const { handler } = await import(pathToFileURL(resolve(process.env.BUILD_DIR ?? 'build', 'handler.js')).href);
const host = process.env.HOST || DEFAULTS.host;
const port = env.port ?? DEFAULTS.appPort;
const shutdownTimeoutMs = Number(process.env.SHUTDOWN_TIMEOUT ?? 10) * 1000;

let stopping = false;
const server = http.createServer((req, res) => {
	for (const [name, value] of SECURITY_HEADERS) res.setHeader(name, value);
	// While stopping, a keep-alive connection is closed as soon as its request is answered.
	res.on('finish', () => stopping && server.closeIdleConnections());
	handler(req, res, () => {
		res.statusCode = 404;
		res.end('Not found');
	});
});

server.listen(port, host, () => console.log(`Listening on http://${host}:${port}`));

function stop(reason) {
	if (stopping) return;
	stopping = true;
	server.closeIdleConnections();
	const force = setTimeout(() => server.closeAllConnections(), shutdownTimeoutMs);
	force.unref();
	server.close(() => {
		process.emit('sveltekit:shutdown', reason);
		// The app's listeners end the pool and the queue; if something still holds the loop, leave anyway.
		setTimeout(() => process.exit(0), 5000).unref();
	});
}
process.on('SIGTERM', () => stop('SIGTERM'));
process.on('SIGINT', () => stop('SIGINT'));
