import piexif from 'piexifjs';
import sharp from 'sharp';
import { describe, expect, it } from 'vitest';
import {
	heicHeader,
	htmlPage,
	isRedOverBlue,
	leftoverMetadata,
	overFifteenMegabytes,
	pixelBomb,
	sidewaysPhoneJpeg,
	solid,
	svgDrawing,
	truncatedJpeg,
	webpChunks,
	windowsProgram
} from '../../../../tests/factories/images';
import { PhotoRefused, processUpload, type PhotoRefusalCode } from './process';

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
		['an HTML page named .jpg', htmlPage, 'text_not_image'],
		['a Windows program named photo.png', windowsProgram, 'not_an_image'],
		['a GIF', () => solid(8, 8).gif().toBuffer(), 'other_image_format'],
		['an empty file', () => new Uint8Array(0), 'damaged'],
		['an SVG drawing', svgDrawing, 'svg'],
		['an HEIC photo', heicHeader, 'heic'],
		['a file over 15 MB', overFifteenMegabytes, 'too_large'],
		['a PNG claiming 100 000 × 100 000 pixels', pixelBomb, 'too_many_pixels'],
		['a JPEG cut off half-way', truncatedJpeg, 'damaged'],
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
		const tagged = await sidewaysPhoneJpeg();
		const before = await sharp(tagged).metadata();
		expect(before).toMatchObject({ orientation: 6, width: 400, height: 200 });
		expect(before.exif?.includes(Buffer.from('Merrowgate Optics'))).toBe(true);
		expect(before.icc).toBeDefined();
		expect(before.xmp).toBeDefined();
		expect(piexif.load(tagged.toString('binary')).GPS?.[piexif.GPSIFD.GPSLatitudeRef]).toBe('N');

		const photo = await processUpload(tagged);
		expect(photo).toMatchObject({ width: 200, height: 400 });
		for (const bytes of [photo.bytes, photo.thumbBytes]) {
			expect(await leftoverMetadata(bytes)).toMatchObject({
				format: 'webp',
				exif: false,
				xmp: false,
				icc: false,
				iptc: false,
				orientation: undefined
			});
			expect(webpChunks(bytes)?.every((name) => ['VP8 ', 'VP8L', 'VP8X', 'ALPH'].includes(name))).toBe(true);
		}
		// Orientation 6 means the stored left edge is the top of the scene: red above, blue below.
		expect(await isRedOverBlue(photo.bytes)).toBe(true);
	});
});
