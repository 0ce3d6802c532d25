/**
 * The upload module's vocabulary and limits, shared by the server (src/lib/server/uploads) and the
 * forms that offer a file input. One source: pages quote these limits, the server enforces them.
 */

/**
 * What an upload is for; the route that serves it asks the purpose's owner who may see it:
 * a milestone's plant, a question (its photos and its answers' photos), or the owner's guides
 * (an image in a guide's Markdown).
 */
export const UPLOAD_PURPOSES = ['milestone-photo', 'question-photo', 'guide-image'] as const;
export type UploadPurpose = (typeof UPLOAD_PURPOSES)[number];

/** Types accepted, decided from the file's bytes (never its name or the browser's word). */
export const ACCEPTED_IMAGE_TYPES = ['image/jpeg', 'image/png', 'image/webp', 'image/heic', 'image/heif'] as const;

export const UPLOAD_LIMITS = {
	/** Per file: a phone photo is 2–8 MB. The server's BODY_SIZE_LIMIT (DEFAULTS.bodySizeLimit in src/lib/server/env.js, 11M) sits just above it. */
	fileBytes: 10 * 1024 * 1024,
	/** Per account, all stored sizes together. */
	accountBytes: 200 * 1024 * 1024,
	/** Decompression-bomb guard: a 48-megapixel phone camera fits; a 1-pixel-deep 50 000² PNG does not. */
	pixels: 50_000_000,
	/** Longest side of the display size and of the thumbnail, px. */
	displayPx: 1600,
	thumbnailPx: 320
} as const;

export const UPLOAD_VARIANTS = ['display', 'thumbnail'] as const;
export type UploadVariant = (typeof UPLOAD_VARIANTS)[number];

export function megabytes(bytes: number): string {
	return `${Math.round(bytes / (1024 * 1024))} MB`;
}
