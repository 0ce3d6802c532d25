/**
 * The upload module: photos for milestones now, question photos later. Generic over who owns a
 * file and what it is for (its purpose); who may see it is decided by the route that serves it
 * (src/routes/uploads/[id]/[variant]) through `canSee` in ./access.ts.
 *
 * Use: `const staged = await uploads.stage(file, 'photo')` before the transaction (checks and
 * re-encodes, writes the files), `await uploads.record(tx, staged, { ownerId, purpose })` inside it
 * (checks the owner's allowance, writes the row), and `staged.discard()` if the transaction fails.
 */
import { randomBytes } from 'node:crypto';
import { UPLOAD_LIMITS, UPLOAD_VARIANTS, megabytes, type UploadPurpose, type UploadVariant } from '$lib/uploads';
import { config } from '../config';
import { UserFacingError } from '../errors';
import type { Conn } from '../db/tx';
import { prepareImage } from './image';
import { localDiskStorage, type UploadStorage } from './storage';
import { uploadsRepository, type UploadRow, type UploadsRepository } from './repository';

export type { UploadRow } from './repository';
export type { UploadStorage } from './storage';

export interface StagedUpload {
	storageKey: string;
	contentType: string;
	bytes: number;
	width: number;
	height: number;
	/** Removes the stored files: call it when the transaction that would record them fails. */
	discard(): Promise<void>;
}

const fileKey = (storageKey: string, variant: UploadVariant) => `${storageKey}.${variant}.jpg`;

export function createUploadService(deps: { storage: UploadStorage; repo: UploadsRepository; limits?: typeof UPLOAD_LIMITS }) {
	const limits = deps.limits ?? UPLOAD_LIMITS;
	const removeFiles = (storageKey: string) => Promise.all(UPLOAD_VARIANTS.map((v) => deps.storage.delete(fileKey(storageKey, v)))).then(() => undefined);

	return {
		/** Checks and re-encodes a file and stores its sizes under a random key; refusals name `field`. */
		async stage(file: File | Buffer, field: string): Promise<StagedUpload> {
			if (!Buffer.isBuffer(file) && file.size > limits.fileBytes) {
				throw new UserFacingError(field, `The photo is ${megabytes(file.size)}; photos up to ${megabytes(limits.fileBytes)} are accepted`);
			}
			const bytes = Buffer.isBuffer(file) ? file : Buffer.from(await file.arrayBuffer());
			const image = await prepareImage(bytes, field, limits);
			const storageKey = randomBytes(18).toString('base64url');
			try {
				for (const v of UPLOAD_VARIANTS) await deps.storage.put(fileKey(storageKey, v), image.variants[v]);
			} catch (e) {
				await removeFiles(storageKey);
				throw e;
			}
			return {
				storageKey,
				contentType: image.contentType,
				bytes: UPLOAD_VARIANTS.reduce((n, v) => n + image.variants[v].length, 0),
				width: image.width,
				height: image.height,
				discard: () => removeFiles(storageKey)
			};
		},

		/** Writes the upload's row inside the caller's transaction, within the owner's allowance. */
		async record(tx: Conn, staged: StagedUpload, owner: { ownerId: number; purpose: UploadPurpose; field: string }): Promise<UploadRow> {
			await deps.repo.lockOwner(tx, owner.ownerId);
			const used = await deps.repo.bytesUsed(tx, owner.ownerId);
			if (used + staged.bytes > limits.accountBytes) {
				throw new UserFacingError(owner.field, `Your photos use ${megabytes(used)} of the ${megabytes(limits.accountBytes)} each account may store: delete some before adding more`);
			}
			const { storageKey, contentType, bytes, width, height } = staged;
			return deps.repo.insert(tx, { ownerId: owner.ownerId, purpose: owner.purpose, storageKey, contentType, bytes, width, height });
		},

		/** The stored bytes of one size, or null when the files are gone. */
		read: (upload: UploadRow, variant: UploadVariant) => deps.storage.get(fileKey(upload.storageKey, variant)),

		/** Deletes the row inside the caller's transaction; returns what removes the files once it commits. */
		async remove(tx: Conn, uploadId: number): Promise<() => Promise<void>> {
			const row = await deps.repo.delete(tx, uploadId);
			return row ? () => removeFiles(row.storageKey) : async () => {};
		},

		byId: (id: number) => deps.repo.byId(id)
	};
}
export type UploadService = ReturnType<typeof createUploadService>;

export const uploads = createUploadService({ storage: localDiskStorage(config.uploadDir), repo: uploadsRepository });
