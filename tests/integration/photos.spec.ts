// Photos stored through the S3 client in the local stand-in that `npm test` starts (S3_* variables).
import sharp from 'sharp';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { deletePhoto, processUpload, readPhoto, signedUrl, storePhoto } from '../../src/lib/server/photos';
import { check } from '../../src/lib/server/services/storage';

async function storedPhoto() {
	const photo = await processUpload(
		await sharp({ create: { width: 900, height: 600, channels: 3, background: { r: 40, g: 90, b: 160 } } })
			.jpeg()
			.toBuffer()
	);
	return { photo, keys: await storePhoto(photo) };
}

async function fetchBytes(url: string) {
	const response = await fetch(url);
	return {
		status: response.status,
		type: response.headers.get('content-type'),
		bytes: new Uint8Array(await response.arrayBuffer())
	};
}

afterEach(() => {
	vi.useRealTimers();
});

describe('photo storage', () => {
	it('finds the bucket', async () => {
		expect(await check()).toBe('ok');
	});

	it('stores a photo and its thumbnail under fresh random keys and serves both through signed URLs', async () => {
		const { photo, keys } = await storedPhoto();
		const again = await storePhoto(photo);
		expect(keys.key).toMatch(/^photos\/[0-9a-f]{32}\/full\.webp$/);
		expect(keys.thumbKey).toMatch(/^photos\/[0-9a-f]{32}\/thumb\.webp$/);
		expect(again.key).not.toBe(keys.key);

		const full = await fetchBytes(await signedUrl(keys.key));
		expect(full).toMatchObject({ status: 200, type: 'image/webp' });
		expect(Buffer.from(full.bytes).equals(Buffer.from(photo.bytes))).toBe(true);
		const thumb = await fetchBytes(await signedUrl(keys.thumbKey, 60));
		expect(Buffer.from(thumb.bytes).equals(Buffer.from(photo.thumbBytes))).toBe(true);
		expect(await sharp(thumb.bytes).metadata()).toMatchObject({ format: 'webp', width: 480, height: 320 });
	});

	it('reads a stored photo back as a stream for an authorising route', async () => {
		const { photo, keys } = await storedPhoto();
		const read = await readPhoto(keys.key);
		expect(read?.size).toBe(photo.bytes.byteLength);
		const bytes = new Uint8Array(await new Response(read?.body).arrayBuffer());
		expect(Buffer.from(bytes).equals(Buffer.from(photo.bytes))).toBe(true);
		await deletePhoto(keys);
		expect(await readPhoto(keys.key)).toBeNull();
	});

	it('never serves a photo without a valid signature', async () => {
		const { keys } = await storedPhoto();
		const url = new URL(await signedUrl(keys.key));
		const unsigned = `${url.origin}${url.pathname}`;
		expect((await fetch(unsigned)).status).toBe(403);

		const otherObject = new URL(url);
		otherObject.pathname = url.pathname.replace('/full.webp', '/thumb.webp');
		expect((await fetch(otherObject)).status).toBe(403);

		const longer = new URL(url);
		longer.searchParams.set('X-Amz-Expires', '604800');
		expect((await fetch(longer)).status).toBe(403);
	});

	it('stops serving through a URL once it has expired', async () => {
		const { keys } = await storedPhoto();
		vi.useFakeTimers({ toFake: ['Date'] });
		vi.setSystemTime(Date.now() - 10 * 60 * 1000); // signed ten minutes ago, for five minutes
		const stale = await signedUrl(keys.key, 300);
		vi.useRealTimers();
		const response = await fetch(stale);
		expect(response.status).toBe(403);
		expect(await response.text()).toContain('Request has expired');
		expect((await fetch(await signedUrl(keys.key, 300))).status).toBe(200);
	});

	it('refuses signed URLs that live longer than an hour or keys it did not make', async () => {
		await expect(signedUrl('photos/0123456789abcdef0123456789abcdef/full.webp', 7200)).rejects.toThrow(
			/between 1 and 3600/
		);
		await expect(signedUrl('../secrets.txt')).rejects.toThrow('Not a photo key');
	});

	it('deletes both images of a photo', async () => {
		const { keys } = await storedPhoto();
		await deletePhoto(keys);
		expect((await fetch(await signedUrl(keys.key))).status).toBe(404);
		expect((await fetch(await signedUrl(keys.thumbKey))).status).toBe(404);
		await expect(deletePhoto(keys)).resolves.toBeUndefined();
	});
});
