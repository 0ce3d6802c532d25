import { describe, expect, it } from 'vitest';
import sharp from 'sharp';
import { prepareImage } from '../../../src/lib/server/uploads/image';
import { UPLOAD_LIMITS } from '../../../src/lib/uploads';
import { gpsOf, metadataGroups, oversizedJpeg, phonePhotoWithGps, pixelBombPng, scriptAsJpeg } from '../../helpers/images';

describe('checking and re-encoding an uploaded image', () => {
	it('the phone photo fixture does carry a GPS position', async () => {
		expect(gpsOf(await phonePhotoWithGps())?.Latitude).toBeCloseTo(51.5034, 3);
	});

	it('re-encodes to JPEG without GPS or camera details, in a display size and a thumbnail', async () => {
		const prepared = await prepareImage(await phonePhotoWithGps(2400, 1800), 'photo');
		for (const bytes of Object.values(prepared.variants)) {
			expect(gpsOf(bytes)).toBeUndefined();
			expect(metadataGroups(bytes)).toEqual([]);
		}
		const display = await sharp(prepared.variants.display).metadata();
		const thumb = await sharp(prepared.variants.thumbnail).metadata();
		expect(display.format).toBe('jpeg');
		expect(Math.max(display.width!, display.height!)).toBe(UPLOAD_LIMITS.displayPx);
		expect(Math.max(thumb.width!, thumb.height!)).toBe(UPLOAD_LIMITS.thumbnailPx);
		expect(prepared.width).toBe(UPLOAD_LIMITS.displayPx);
	});

	it('refuses a script named .jpg, by its bytes', async () => {
		await expect(prepareImage(scriptAsJpeg(), 'photo')).rejects.toMatchObject({ field: 'photo', message: expect.stringMatching(/not a JPEG, PNG or WebP/) });
	});

	it('refuses a file over the size limit', async () => {
		await expect(prepareImage(await oversizedJpeg(UPLOAD_LIMITS.fileBytes), 'photo')).rejects.toMatchObject({ field: 'photo', message: expect.stringMatching(/up to 10 MB/) });
	});

	it('refuses a small PNG that would decode to a quarter of a billion pixels', async () => {
		const bomb = pixelBombPng();
		expect(bomb.length).toBeLessThan(200_000);
		await expect(prepareImage(bomb, 'photo')).rejects.toMatchObject({ field: 'photo', message: expect.stringMatching(/megapixels/) });
	});

	it('refuses a truncated JPEG as damaged', async () => {
		const photo = await phonePhotoWithGps();
		await expect(prepareImage(photo.subarray(0, 400), 'photo')).rejects.toMatchObject({ field: 'photo' });
	});
});
