/**
 * Files for upload tests, made here rather than kept as fixtures: real images of every accepted kind,
 * and the things an upload must refuse (by content, whatever the name says).
 */
import { crc32 } from 'node:zlib';
import piexif from 'piexifjs';
import sharp from 'sharp';

export const red = { r: 220, g: 20, b: 20 };
export const blue = { r: 20, g: 20, b: 220 };

export function solid(width: number, height: number, background = red) {
	return sharp({ create: { width, height, channels: 3, background } });
}

/** A photo-like image: noise spreads the compressed data over the whole file. */
export function noisy(width: number, height: number) {
	return sharp({
		create: { width, height, channels: 3, background: '#000', noise: { type: 'gaussian', mean: 128, sigma: 40 } }
	});
}

/** Left half red, right half blue: which way is up survives re-encoding. */
export async function halves(width: number, height: number) {
	const right = await solid(width / 2, height, blue)
		.png()
		.toBuffer();
	return solid(width, height, red).composite([{ input: right, left: width / 2, top: 0 }]);
}

function pngChunk(type: string, data: Buffer) {
	const length = Buffer.alloc(4);
	length.writeUInt32BE(data.length);
	const body = Buffer.concat([Buffer.from(type, 'latin1'), data]);
	const crc = Buffer.alloc(4);
	crc.writeUInt32BE(crc32(body));
	return Buffer.concat([length, body, crc]);
}

/** A valid PNG header that claims 100 000 × 100 000 pixels (40 GB decoded) in a few dozen bytes. */
export function pixelBomb() {
	const header = Buffer.alloc(13);
	header.writeUInt32BE(100_000, 0);
	header.writeUInt32BE(100_000, 4);
	header.set([8, 2, 0, 0, 0], 8); // 8-bit RGB, deflate, no filter method change, no interlace
	return Buffer.concat([
		Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]),
		pngChunk('IHDR', header),
		pngChunk('IDAT', Buffer.from([0x78, 0x9c, 0x03, 0x00, 0x00, 0x00, 0x00, 0x01])),
		pngChunk('IEND', Buffer.alloc(0))
	]);
}

/** The smallest start of an HEIC file: an ISO-BMFF `ftyp` box with the `heic` brand. */
export function heicHeader() {
	const box = Buffer.alloc(32);
	box.writeUInt32BE(24, 0);
	box.write('ftypheic', 4, 'latin1');
	box.write('mif1heic', 16, 'latin1');
	return box;
}

/** The start of a Windows program: the `MZ` header pointing at a PE signature. */
export function windowsProgram() {
	return Buffer.concat([Buffer.from('MZ'), Buffer.alloc(58), Buffer.from([0x80, 0, 0, 0]), Buffer.alloc(200)]);
}

export const htmlPage = () => Buffer.from('<!doctype html><title>hi</title><p>hello');

export const svgDrawing = () =>
	Buffer.from('<?xml version="1.0"?>\n<svg xmlns="http://www.w3.org/2000/svg" width="10" height="10"/>');

/** A JPEG padded past 15 MB. */
export async function overFifteenMegabytes() {
	return Buffer.concat([await solid(8, 8).jpeg().toBuffer(), Buffer.alloc(15 * 1024 * 1024)]);
}

export async function truncatedJpeg() {
	const whole = await noisy(600, 400).jpeg().toBuffer();
	return whole.subarray(0, Math.floor(whole.length / 2));
}

/**
 * A 400 × 200 JPEG as a phone held sideways saves it: EXIF orientation 6 (so it shows 200 × 400, red
 * above blue), GPS coordinates, the camera make "Merrowgate Optics", an XMP packet and a P3 colour profile.
 */
export async function sidewaysPhoneJpeg() {
	const plain = await (
		await halves(400, 200)
	)
		.withIccProfile('p3')
		.withXmp(
			'<x:xmpmeta xmlns:x="adobe:ns:meta/"><rdf:RDF xmlns:rdf="http://www.w3.org/1999/02/22-rdf-syntax-ns#"/></x:xmpmeta>'
		)
		.jpeg({ quality: 95 })
		.toBuffer();
	const exif = piexif.dump({
		'0th': { [piexif.ImageIFD.Orientation]: 6, [piexif.ImageIFD.Make]: 'Merrowgate Optics' },
		GPS: {
			[piexif.GPSIFD.GPSLatitudeRef]: 'N',
			[piexif.GPSIFD.GPSLatitude]: [
				[52, 1],
				[12, 1],
				[3456, 100]
			],
			[piexif.GPSIFD.GPSLongitudeRef]: 'W',
			[piexif.GPSIFD.GPSLongitude]: [
				[1, 1],
				[34, 1],
				[1234, 100]
			]
		}
	});
	return Buffer.from(piexif.insert(exif, plain.toString('binary')), 'binary');
}

/** The RIFF chunk names inside a WebP file: only image data chunks means no metadata at all. */
export function webpChunks(bytes: Uint8Array) {
	const buffer = Buffer.from(bytes);
	if (buffer.toString('latin1', 0, 4) !== 'RIFF' || buffer.toString('latin1', 8, 12) !== 'WEBP') return null;
	const names: string[] = [];
	for (let offset = 12; offset + 8 <= buffer.length;) {
		names.push(buffer.toString('latin1', offset, offset + 4));
		const size = buffer.readUInt32LE(offset + 4);
		offset += 8 + size + (size % 2);
	}
	return names;
}

/** Red over blue (top half red, bottom half blue), as the sideways photo looks upright. */
export async function isRedOverBlue(bytes: Uint8Array) {
	const { data, info } = await sharp(bytes).raw().toBuffer({ resolveWithObject: true });
	const pixel = (x: number, y: number) =>
		Array.from(data.subarray((y * info.width + x) * info.channels, (y * info.width + x) * info.channels + 3));
	const [top, bottom] = [
		pixel(Math.floor(info.width / 2), Math.floor(info.height / 8)),
		pixel(Math.floor(info.width / 2), Math.floor((info.height * 7) / 8))
	];
	return top[0] > 150 && top[2] < 80 && bottom[2] > 150 && bottom[0] < 80;
}

/** What sharp reads of an image: format, size, and whether any kind of metadata is in it. */
export async function leftoverMetadata(bytes: Uint8Array) {
	const meta = await sharp(bytes).metadata();
	return {
		format: meta.format,
		width: meta.width,
		height: meta.height,
		exif: meta.exif !== undefined,
		xmp: meta.xmp !== undefined,
		icc: meta.icc !== undefined,
		iptc: meta.iptc !== undefined,
		orientation: meta.orientation
	};
}
