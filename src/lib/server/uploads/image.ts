/**
 * Turning an uploaded file into the images we store: the type decided from the bytes, a pixel
 * limit against decompression bombs, and a re-encode with sharp that drops every piece of
 * metadata (EXIF, GPS position, XMP, ICC) and turns the picture upright.
 */
import sharp from 'sharp';
import { fileTypeFromBuffer } from 'file-type';
import { ACCEPTED_IMAGE_TYPES, UPLOAD_LIMITS, megabytes, type UploadVariant } from '$lib/uploads';
import { UserFacingError } from '../errors';

export interface PreparedImage {
	/** Stored bytes per size, JPEG. */
	variants: Record<UploadVariant, Buffer>;
	contentType: 'image/jpeg';
	width: number;
	height: number;
}

const SIDE: Record<UploadVariant, number> = { display: UPLOAD_LIMITS.displayPx, thumbnail: UPLOAD_LIMITS.thumbnailPx };

/**
 * Checks and re-encodes one image. Refusals name `field` (the form input) and say why, before
 * anything is stored.
 */
export async function prepareImage(bytes: Buffer, field: string, limits = UPLOAD_LIMITS): Promise<PreparedImage> {
	if (bytes.length === 0) throw new UserFacingError(field, 'The file is empty: choose a photo');
	if (bytes.length > limits.fileBytes) {
		throw new UserFacingError(field, `The photo is ${megabytes(bytes.length)}; photos up to ${megabytes(limits.fileBytes)} are accepted`);
	}
	const type = await fileTypeFromBuffer(bytes);
	if (!type || !(ACCEPTED_IMAGE_TYPES as readonly string[]).includes(type.mime)) {
		throw new UserFacingError(field, 'This file is not a JPEG, PNG or WebP photo (its contents were checked, not its name)');
	}
	const options = { limitInputPixels: limits.pixels, failOn: 'error' as const };
	let width: number, height: number;
	try {
		const meta = await sharp(bytes, options).metadata();
		width = meta.autoOrient?.width ?? meta.width ?? 0;
		height = meta.autoOrient?.height ?? meta.height ?? 0;
	} catch (e) {
		if (/pixel limit/i.test(String(e))) throw tooManyPixels(field, limits.pixels);
		throw new UserFacingError(field, type.mime.startsWith('image/hei') ? 'This HEIC photo could not be read here: save it as JPEG and try again' : 'This photo could not be read: it may be damaged');
	}
	if (width * height > limits.pixels || width === 0 || height === 0) throw tooManyPixels(field, limits.pixels);
	try {
		const encode = (variant: UploadVariant) =>
			sharp(bytes, options)
				.rotate()
				.resize({ width: SIDE[variant], height: SIDE[variant], fit: 'inside', withoutEnlargement: true })
				.jpeg({ quality: 82 })
				.toBuffer();
		const [display, thumbnail] = await Promise.all([encode('display'), encode('thumbnail')]);
		const shown = await sharp(display).metadata();
		return { variants: { display, thumbnail }, contentType: 'image/jpeg', width: shown.width ?? width, height: shown.height ?? height };
	} catch {
		throw new UserFacingError(field, 'This photo could not be read: it may be damaged');
	}
}

function tooManyPixels(field: string, pixels: number) {
	return new UserFacingError(field, `The picture is too large in pixels: up to ${Math.round(pixels / 1_000_000)} megapixels are accepted`);
}
