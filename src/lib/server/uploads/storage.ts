/**
 * Where uploaded files live, behind a small interface so an object store can take over when
 * several app instances run. The default keeps them on local disk under config.uploadDir.
 */
import { mkdir, readFile, rename, rm, writeFile } from 'node:fs/promises';
import { randomBytes } from 'node:crypto';
import path from 'node:path';

export interface UploadStorage {
	/** Stores the bytes under the key; a failed write leaves nothing behind. */
	put(key: string, bytes: Buffer): Promise<void>;
	/** The bytes, or null when nothing is stored under the key. */
	get(key: string): Promise<Buffer | null>;
	delete(key: string): Promise<void>;
}

const KEY = /^[A-Za-z0-9_-]{16,64}\.[a-z]+\.[a-z]+$/;

/** Files under one folder, two characters of the key as a subfolder so no folder grows huge. */
export function localDiskStorage(root: string): UploadStorage {
	const where = (key: string) => {
		// Keys are made by this module; anything else is a bug, never a path to follow.
		if (!KEY.test(key)) throw new Error(`Not an upload key: ${key}`);
		return path.join(root, key.slice(0, 2), key);
	};
	return {
		async put(key, bytes) {
			const file = where(key);
			await mkdir(path.dirname(file), { recursive: true });
			const temp = `${file}.${randomBytes(6).toString('hex')}.part`;
			try {
				await writeFile(temp, bytes, { flag: 'wx' });
				await rename(temp, file);
			} catch (e) {
				await rm(temp, { force: true });
				throw e;
			}
		},
		async get(key) {
			try {
				return await readFile(where(key));
			} catch (e) {
				if ((e as NodeJS.ErrnoException).code === 'ENOENT') return null;
				throw e;
			}
		},
		async delete(key) {
			await rm(where(key), { force: true });
		}
	};
}
