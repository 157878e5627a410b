import { crc32 } from 'node:zlib';
import piexif from 'piexifjs';
import sharp from 'sharp';
import { describe, expect, it } from 'vitest';
import { PhotoRefused, maxUploadBytes, processUpload, type PhotoRefusalCode } from './process';

const red = { r: 220, g: 20, b: 20 };
const blue = { r: 20, g: 20, b: 220 };

function solid(width: number, height: number, background = red) {
	return sharp({ create: { width, height, channels: 3, background } });
}

/** A photo-like image: noise spreads the compressed data over the whole file. */
function noisy(width: number, height: number) {
	return sharp({
		create: { width, height, channels: 3, background: '#000', noise: { type: 'gaussian', mean: 128, sigma: 40 } }
	});
}

/** Left half red, right half blue: which way is up survives re-encoding. */
async function halves(width: number, height: number) {
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
function pixelBomb() {
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
function heicHeader() {
	const box = Buffer.alloc(32);
	box.writeUInt32BE(24, 0);
	box.write('ftypheic', 4, 'latin1');
	box.write('mif1heic', 16, 'latin1');
	return box;
}

/** The RIFF chunk names inside a WebP file. */
function webpChunks(bytes: Uint8Array) {
	const buffer = Buffer.from(bytes);
	expect(buffer.toString('latin1', 0, 4)).toBe('RIFF');
	expect(buffer.toString('latin1', 8, 12)).toBe('WEBP');
	const names: string[] = [];
	for (let offset = 12; offset + 8 <= buffer.length;) {
		names.push(buffer.toString('latin1', offset, offset + 4));
		const size = buffer.readUInt32LE(offset + 4);
		offset += 8 + size + (size % 2);
	}
	return names;
}

async function refusal(bytes: Uint8Array): Promise<PhotoRefused> {
	const error = await processUpload(bytes).then(
		() => null,
		(e: unknown) => e
	);
	expect(error).toBeInstanceOf(PhotoRefused);
	return error as PhotoRefused;
}

// Image work is slow on a busy two-core machine; these never wait on anything else.
describe('processUpload refuses what is not a photo it can safely read', { timeout: 30_000 }, () => {
	const cases: [string, () => Promise<Uint8Array> | Uint8Array, PhotoRefusalCode][] = [
		[
			'an HTML page named .jpg',
			() => new Uint8Array(Buffer.from('<!doctype html><title>hi</title><p>hello')),
			'text_not_image'
		],
		[
			'a Windows program named photo.png',
			() => Buffer.concat([Buffer.from('MZ'), Buffer.alloc(58), Buffer.from([0x80, 0, 0, 0]), Buffer.alloc(200)]),
			'not_an_image'
		],
		['a GIF', () => solid(8, 8).gif().toBuffer(), 'other_image_format'],
		['an empty file', () => new Uint8Array(0), 'damaged'],
		[
			'an SVG drawing',
			() =>
				new Uint8Array(
					Buffer.from('<?xml version="1.0"?>\n<svg xmlns="http://www.w3.org/2000/svg" width="10" height="10"/>')
				),
			'svg'
		],
		['an HEIC photo', heicHeader, 'heic'],
		[
			'a file over 15 MB',
			async () => Buffer.concat([await solid(8, 8).jpeg().toBuffer(), Buffer.alloc(maxUploadBytes)]),
			'too_large'
		],
		['a PNG claiming 100 000 × 100 000 pixels', pixelBomb, 'too_many_pixels'],
		[
			'a JPEG cut off half-way',
			async () => {
				const whole = await noisy(600, 400).jpeg().toBuffer();
				return whole.subarray(0, Math.floor(whole.length / 2));
			},
			'damaged'
		],
		[
			'a JPEG start followed by garbage',
			() => Buffer.concat([Buffer.from([0xff, 0xd8, 0xff, 0xe0]), Buffer.alloc(2000, 0x5a)]),
			'damaged'
		]
	];

	it.each(cases)('%s', async (_name, make, code) => {
		const error = await refusal(await make());
		expect(error.code).toBe(code);
	});

	it('gives each kind of refusal its own message', async () => {
		const messages = new Set<string>();
		for (const [, make] of cases) messages.add((await refusal(await make())).message);
		expect(messages.size).toBe(new Set(cases.map(([, , code]) => code)).size);
	});

	it('tells an iPhone user how to send a JPEG instead of HEIC', async () => {
		const { message } = await refusal(heicHeader());
		expect(message).toContain('JPEG');
		expect(message).toContain('Settings → Camera → Formats → Most Compatible');
	});
});

describe('processUpload re-encodes', { timeout: 30_000 }, () => {
	it('goes by content, not name: a PNG saved as setup.exe is read as a PNG', async () => {
		const file = new File([await solid(120, 80).png().toBuffer()], 'setup.exe', { type: 'application/x-msdownload' });
		const photo = await processUpload(new Uint8Array(await file.arrayBuffer()));
		expect(photo).toMatchObject({ width: 120, height: 80 });
		expect((await sharp(photo.bytes).metadata()).format).toBe('webp');
	});

	it('accepts WebP input', async () => {
		const photo = await processUpload(await solid(50, 40).webp().toBuffer());
		expect(photo).toMatchObject({ width: 50, height: 40 });
	});

	it('fits the photo in 2048 px and the thumbnail in 480 px, keeping the proportions', async () => {
		const photo = await processUpload(await solid(2400, 800).jpeg().toBuffer());
		expect(photo).toMatchObject({ width: 2048, height: 683 });
		const thumb = await sharp(photo.thumbBytes).metadata();
		expect([thumb.format, thumb.width, thumb.height]).toEqual(['webp', 480, 160]);
	});

	it('never enlarges a small photo', async () => {
		const photo = await processUpload(await solid(300, 200).png().toBuffer());
		const thumb = await sharp(photo.thumbBytes).metadata();
		expect([photo.width, photo.height, thumb.width, thumb.height]).toEqual([300, 200, 300, 200]);
	});

	it('turns a sideways phone photo upright and drops its location, camera data, XMP and colour profile', async () => {
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
		const tagged = Buffer.from(piexif.insert(exif, plain.toString('binary')), 'binary');
		const before = await sharp(tagged).metadata();
		expect(before).toMatchObject({ orientation: 6, width: 400, height: 200 });
		expect(before.exif?.includes(Buffer.from('Merrowgate Optics'))).toBe(true);
		expect(before.icc).toBeDefined();
		expect(before.xmp).toBeDefined();
		expect(piexif.load(tagged.toString('binary')).GPS?.[piexif.GPSIFD.GPSLatitudeRef]).toBe('N');

		const photo = await processUpload(tagged);
		expect(photo).toMatchObject({ width: 200, height: 400 });
		for (const bytes of [photo.bytes, photo.thumbBytes]) {
			const after = await sharp(bytes).metadata();
			expect(after.format).toBe('webp');
			expect(after.exif).toBeUndefined();
			expect(after.xmp).toBeUndefined();
			expect(after.icc).toBeUndefined();
			expect(after.iptc).toBeUndefined();
			expect(after.orientation).toBeUndefined();
			expect(webpChunks(bytes).every((name) => ['VP8 ', 'VP8L', 'VP8X', 'ALPH'].includes(name))).toBe(true);
		}
		// Orientation 6 means the stored left edge is the top of the scene: red above, blue below.
		const { data, info } = await sharp(photo.bytes).raw().toBuffer({ resolveWithObject: true });
		const pixel = (x: number, y: number) =>
			Array.from(data.subarray((y * info.width + x) * info.channels, (y * info.width + x) * info.channels + 3));
		const [top, bottom] = [pixel(100, 50), pixel(100, 350)];
		expect(top[0]).toBeGreaterThan(150);
		expect(top[2]).toBeLessThan(80);
		expect(bottom[2]).toBeGreaterThan(150);
		expect(bottom[0]).toBeLessThan(80);
	});
});
