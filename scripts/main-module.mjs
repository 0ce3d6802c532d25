import { realpathSync } from 'node:fs';
import { pathToFileURL } from 'node:url';

/** Whether the module at `metaUrl` is the script node was started with (paths with spaces and links included). */
export function isMainModule(metaUrl) {
	if (!process.argv[1]) return false;
	try {
		return metaUrl === pathToFileURL(realpathSync(process.argv[1])).href;
	} catch {
		return false;
	}
}
