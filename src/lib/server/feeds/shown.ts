/** A new feed's address as the pages show it once: both links and a QR code of the webcal:// one. */
import QRCode from 'qrcode';

export async function feedShownOnce(feed: { https: string; webcal: string }, scope: string) {
	return { ...feed, scope, qrSvg: await QRCode.toString(feed.webcal, { type: 'svg', margin: 1, errorCorrectionLevel: 'M' }) };
}
