import { fileTypeFromBuffer } from 'file-type';
import sharp from 'sharp';

export const maxUploadBytes = 15 * 1024 * 1024;
export const maxInputPixels = 50_000_000;
const longestSide = 2048;
const thumbLongestSide = 480;

const accepted = new Set(['image/jpeg', 'image/png', 'image/webp']);

export type PhotoRefusalCode =
	| 'too_large'
	| 'heic'
	| 'svg'
	| 'other_image_format'
	| 'not_an_image'
	| 'text_not_image'
	| 'too_many_pixels'
	| 'damaged';

export const refusalMessages: Record<PhotoRefusalCode, string> = {
	too_large:
		'This file is larger than 15 MB. Please send a smaller photo — most phones offer a smaller size when sharing.',
	heic:
		'This photo is in HEIC format, which Tackline cannot read. Please send it as a JPEG: on an iPhone, choose ' +
		'Settings → Camera → Formats → Most Compatible for new photos, or export an existing photo as JPEG before uploading.',
	svg: 'SVG drawings cannot be used as photos. Please send a JPEG, PNG or WebP image.',
	other_image_format:
		'This image is in a format Tackline does not take (such as GIF, TIFF or BMP). Please save it as a JPEG, PNG or WebP.',
	not_an_image:
		'This file is not a picture at all (it looks like a program, an archive or a document), whatever its name says. ' +
		'Please choose a JPEG, PNG or WebP photo.',
	text_not_image:
		'This file holds text (such as a web page), not a picture, whatever its name says. Please choose a JPEG, PNG or WebP photo.',
	too_many_pixels: 'This image has more than 50 million pixels. Please send a smaller version of it.',
	damaged: 'This image is damaged or incomplete, so it cannot be read. Please save or export it again and retry.'
};

/** HTTP status for each refusal: too big, a type we do not take, or content we cannot use. */
export const refusalStatus: Record<PhotoRefusalCode, 413 | 415 | 422> = {
	too_large: 413,
	heic: 415,
	svg: 415,
	other_image_format: 415,
	not_an_image: 415,
	text_not_image: 415,
	too_many_pixels: 422,
	damaged: 422
};

/** An upload refused for what it is; `code` is stable for API clients, `message` is for people. */
export class PhotoRefused extends Error {
	constructor(readonly code: PhotoRefusalCode) {
		super(refusalMessages[code]);
		this.name = 'PhotoRefused';
	}
}

export type ProcessedPhoto = { width: number; height: number; bytes: Uint8Array; thumbBytes: Uint8Array };

// Re-encoding is CPU-heavy: one image at a time on one libvips thread, so uploads never take every
// core from the requests being served; no operation cache, since no two uploads share work.
sharp.concurrency(1);
sharp.cache(false);
const maxParallel = 1;
let running = 0;
const waiting: (() => void)[] = [];

async function oneAtATime<T>(work: () => Promise<T>): Promise<T> {
	if (running < maxParallel) running += 1;
	else await new Promise<void>((resolve) => waiting.push(resolve)); // the finishing job hands over its slot
	try {
		return await work();
	} finally {
		const next = waiting.shift();
		if (next) next();
		else running -= 1;
	}
}

const svgStart = /^\uFEFF?\s*(<\?xml[^>]*>\s*)?(<!--[\s\S]*?-->\s*)*(<!DOCTYPE svg[^>]*>\s*)?<svg[\s>]/i;

/** No NUL bytes and valid UTF-8 in the first few kilobytes: text, not a damaged binary. */
function looksLikeText(bytes: Uint8Array) {
	const head = bytes.subarray(0, 4096);
	if (head.includes(0)) return false;
	try {
		new TextDecoder('utf-8', { fatal: true }).decode(head.subarray(0, Math.max(0, head.length - 4)));
		return true;
	} catch {
		return false;
	}
}

async function checkType(bytes: Uint8Array) {
	const type = await fileTypeFromBuffer(bytes);
	if (type && accepted.has(type.mime)) return;
	if (type && /^image\/hei[cf]/.test(type.mime)) throw new PhotoRefused('heic');
	const head = new TextDecoder('utf-8', { fatal: false }).decode(bytes.subarray(0, 4096));
	if (svgStart.test(head)) throw new PhotoRefused('svg');
	if (type?.mime.startsWith('image/')) throw new PhotoRefused('other_image_format');
	if (type) throw new PhotoRefused('not_an_image');
	if (looksLikeText(bytes)) throw new PhotoRefused('text_not_image');
	throw new PhotoRefused('damaged');
}

async function reencode(bytes: Uint8Array): Promise<ProcessedPhoto> {
	const input = () => sharp(bytes, { limitInputPixels: maxInputPixels, failOn: 'error' });
	const { width = 0, height = 0 } = await input().metadata();
	if (width * height > maxInputPixels) throw new PhotoRefused('too_many_pixels');
	// No keepMetadata/withMetadata: EXIF (GPS included), XMP, IPTC and the ICC profile are all left
	// behind, after rotate() has applied the EXIF orientation and colours are converted to sRGB.
	const main = await input()
		.rotate()
		.resize({ width: longestSide, height: longestSide, fit: 'inside', withoutEnlargement: true })
		.webp({ quality: 82 })
		.toBuffer({ resolveWithObject: true });
	const thumb = await sharp(main.data)
		.resize({ width: thumbLongestSide, height: thumbLongestSide, fit: 'inside', withoutEnlargement: true })
		.webp({ quality: 75 })
		.toBuffer();
	return {
		width: main.info.width,
		height: main.info.height,
		bytes: new Uint8Array(main.data),
		thumbBytes: new Uint8Array(thumb)
	};
}

/**
 * Checks an uploaded image by its content and re-encodes it: upright, without any metadata, at most
 * 2048 px on its longest side, as WebP, with a 480 px thumbnail. Throws `PhotoRefused` for anything
 * that is not a readable JPEG, PNG or WebP within the size and pixel limits.
 */
export async function processUpload(bytes: Uint8Array): Promise<ProcessedPhoto> {
	if (bytes.byteLength > maxUploadBytes) throw new PhotoRefused('too_large');
	if (bytes.byteLength === 0) throw new PhotoRefused('damaged');
	await checkType(bytes);
	return oneAtATime(async () => {
		try {
			return await reencode(bytes);
		} catch (error) {
			if (error instanceof PhotoRefused) throw error;
			if (error instanceof Error && /pixel limit/i.test(error.message)) throw new PhotoRefused('too_many_pixels');
			throw new PhotoRefused('damaged');
		}
	});
}
