// Photos stored through the S3 client in the local stand-in that `npm test` starts (S3_* variables),
// uploaded and fetched through the built server like a browser or an API client would.
import { eq } from 'drizzle-orm';
import sharp from 'sharp';
import { afterAll, afterEach, beforeAll, describe, expect, it, vi } from 'vitest';
import { demoId } from '../../scripts/demo/ids';
import { commissionPhoto, portfolioPhoto, quote } from '../../src/lib/server/db/schema';
import {
	commissionPhotos,
	deletePhoto,
	processUpload,
	readPhoto,
	signedUrl,
	storePhoto
} from '../../src/lib/server/photos';
import { check } from '../../src/lib/server/services/storage';
import { createCommission, createUser, createWorkroom, type Person } from '../factories';
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
} from '../factories/images';
import { testDb } from './db';
import { baseUrl, newClient, signIn, type Client } from './http';

const { db, pool } = testDb();
afterAll(() => pool.end());

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

/** A signed-in client for a person made by the factories. */
async function signedIn(person: Person) {
	const client = newClient();
	const response = await signIn(client, person.email, person.password);
	expect(response.status).toBe(303);
	return client;
}

function headersOf(client: Client | null, extra: Record<string, string> = {}) {
	const cookie = client ? [...client.jar].map(([name, value]) => `${name}=${value}`).join('; ') : '';
	return {
		origin: baseUrl,
		'x-forwarded-for': client?.address ?? '198.18.0.1',
		...(cookie ? { cookie } : {}),
		...extra
	};
}

/** POSTs one file as multipart `file`, named as given (the name must not matter). */
async function upload(client: Client | null, path: string, bytes: Uint8Array, name = 'photo.jpg') {
	const body = new FormData();
	body.append('file', new Blob([new Uint8Array(bytes)], { type: 'image/jpeg' }), name);
	return fetch(baseUrl + path, { method: 'POST', headers: headersOf(client), body });
}

async function sendJson(client: Client | null, method: string, path: string, body?: unknown) {
	return fetch(baseUrl + path, {
		method,
		headers: headersOf(client, body === undefined ? {} : { 'content-type': 'application/json' }),
		body: body === undefined ? undefined : JSON.stringify(body)
	});
}

const fetchAs = (client: Client | null, path: string, extra: Record<string, string> = {}) =>
	fetch(baseUrl + path, { headers: headersOf(client, extra) });

type Created = { id: string; url: string; thumbUrl: string; width: number; height: number };
type ApiError = { error: { code: string; message: string; issues: unknown[] } };

const png = (width = 120, height = 80) => solid(width, height).png().toBuffer();

describe('commission photo uploads through the API', { timeout: 60_000 }, () => {
	let owner: Person;
	let ownerClient: Client;
	let photosPath: string;

	beforeAll(async () => {
		owner = await createUser(db);
		ownerClient = await signedIn(owner);
		const draft = await createCommission(db, { status: 'draft', customerId: owner.id });
		photosPath = `/api/v1/commissions/${draft.id}/photos`;
	});

	it('takes a real PNG named setup.exe as a PNG, and serves the owner the re-encoded WebP', async () => {
		const response = await upload(ownerClient, photosPath, await png(), 'setup.exe');
		expect(response.status).toBe(201);
		const photo = (await response.json()) as Created;
		expect(photo).toMatchObject({
			width: 120,
			height: 80,
			url: `/photos/${photo.id}/full`,
			thumbUrl: `/photos/${photo.id}/thumb`
		});

		const served = await fetchAs(ownerClient, photo.url);
		expect(served.status).toBe(200);
		expect(served.headers.get('content-type')).toBe('image/webp');
		expect(served.headers.get('cache-control')).toMatch(/^private, max-age=\d+$/);
		const bytes = new Uint8Array(await served.arrayBuffer());
		expect(await sharp(bytes).metadata()).toMatchObject({ format: 'webp', width: 120, height: 80 });

		const etag = served.headers.get('etag');
		expect(etag).toBeTruthy();
		expect((await fetchAs(ownerClient, photo.url, { 'if-none-match': etag! })).status).toBe(304);
		const thumb = await fetchAs(ownerClient, photo.thumbUrl);
		expect(await sharp(new Uint8Array(await thumb.arrayBuffer())).metadata()).toMatchObject({ format: 'webp' });
	});

	const refusals: [string, () => Promise<Uint8Array> | Uint8Array, string, number, string][] = [
		['a Windows program named photo.png', windowsProgram, 'photo.png', 415, 'not_an_image'],
		['an HTML page named photo.jpg', htmlPage, 'photo.jpg', 415, 'text_not_image'],
		['an SVG drawing', svgDrawing, 'drawing.svg', 415, 'svg'],
		['an HEIC photo', heicHeader, 'IMG_0001.HEIC', 415, 'heic'],
		['a file over 15 MB', overFifteenMegabytes, 'big.jpg', 413, 'too_large'],
		['a pixel bomb', pixelBomb, 'bomb.png', 422, 'too_many_pixels'],
		['a truncated JPEG', truncatedJpeg, 'half.jpg', 422, 'damaged']
	];

	it.each(refusals)('refuses %s with its own code', async (_what, make, name, status, code) => {
		const response = await upload(ownerClient, photosPath, await make(), name);
		expect(response.status).toBe(status);
		const body = (await response.json()) as ApiError;
		expect(body.error.code).toBe(code);
		expect(body.error.message.length).toBeGreaterThan(20);
	});

	it('gives every refusal its own message, and tells HEIC senders how to send a JPEG', async () => {
		const messages = new Map<string, string>();
		for (const [, make, name, , code] of refusals) {
			const body = (await (await upload(ownerClient, photosPath, await make(), name)).json()) as ApiError;
			messages.set(code, body.error.message);
		}
		expect(new Set(messages.values()).size).toBe(refusals.length);
		expect(messages.get('heic')).toContain('JPEG');
	});

	it('brings a sideways phone JPEG back upright, with no metadata at all', async () => {
		const response = await upload(ownerClient, photosPath, await sidewaysPhoneJpeg(), 'IMG_2040.JPG');
		expect(response.status).toBe(201);
		const photo = (await response.json()) as Created;
		expect(photo).toMatchObject({ width: 200, height: 400 });
		for (const url of [photo.url, photo.thumbUrl]) {
			const bytes = new Uint8Array(await (await fetchAs(ownerClient, url)).arrayBuffer());
			expect(await leftoverMetadata(bytes)).toEqual({
				format: 'webp',
				width: 200,
				height: 400,
				exif: false,
				xmp: false,
				icc: false,
				iptc: false,
				orientation: undefined
			});
			expect(webpChunks(bytes)?.every((chunk) => ['VP8 ', 'VP8L', 'VP8X', 'ALPH'].includes(chunk))).toBe(true);
			expect(await isRedOverBlue(bytes)).toBe(true);
		}
	});
});

describe('commission photo limits and changes', { timeout: 60_000 }, () => {
	it('takes eight photos and refuses the ninth', async () => {
		const owner = await createUser(db);
		const client = await signedIn(owner);
		const draft = await createCommission(db, { status: 'draft', customerId: owner.id });
		const path = `/api/v1/commissions/${draft.id}/photos`;
		const bytes = await png(40, 30);
		for (let i = 0; i < 8; i += 1) expect((await upload(client, path, bytes)).status).toBe(201);
		const ninth = await upload(client, path, bytes);
		expect(ninth.status).toBe(409);
		expect(((await ninth.json()) as ApiError).error.code).toBe('photo_limit');
		expect(await commissionPhotos.photoCount(db, { commissionId: draft.id })).toBe(8);
	});

	it('reorders, describes and removes photos; a removed photo is gone from storage too', async () => {
		const owner = await createUser(db);
		const client = await signedIn(owner);
		const draft = await createCommission(db, { status: 'draft', customerId: owner.id });
		const path = `/api/v1/commissions/${draft.id}/photos`;
		const [a, b] = [
			(await (await upload(client, path, await png(60, 40))).json()) as Created,
			(await (await upload(client, path, await png(40, 60))).json()) as Created
		];

		const reordered = await sendJson(client, 'PATCH', path, { order: [b.id, a.id] });
		expect(reordered.status).toBe(200);
		expect(((await reordered.json()) as { items: Created[] }).items.map((p) => p.id)).toEqual([b.id, a.id]);
		const halfOrder = await sendJson(client, 'PATCH', path, { order: [b.id] });
		expect(halfOrder.status).toBe(400);
		expect(((await halfOrder.json()) as ApiError).error.code).toBe('invalid_order');

		const described = await sendJson(client, 'PATCH', `${path}/${a.id}`, { altText: 'Navy linen, loose weave' });
		expect(described.status).toBe(200);
		expect(await described.json()).toMatchObject({ id: a.id, altText: 'Navy linen, loose weave' });
		expect((await sendJson(client, 'PATCH', `${path}/${a.id}`, { altText: 'x'.repeat(301) })).status).toBe(400);

		const [row] = await db
			.select({ key: commissionPhoto.storageKey, thumbKey: commissionPhoto.thumbKey })
			.from(commissionPhoto)
			.where(eq(commissionPhoto.id, a.id));
		expect(await readPhoto(row.key)).not.toBeNull();
		expect((await sendJson(client, 'DELETE', `${path}/${a.id}`)).status).toBe(204);
		expect((await fetchAs(client, a.url)).status).toBe(404);
		expect(await readPhoto(row.key)).toBeNull();
		expect(await readPhoto(row.thumbKey!)).toBeNull();
		expect((await sendJson(client, 'DELETE', `${path}/${a.id}`)).status).toBe(404);
		const list = (await (await fetchAs(client, path)).json()) as { items: Created[] };
		expect(list.items.map((p) => p.id)).toEqual([b.id]);
	});

	it('lets only the owner change photos, and only while the commission is a draft or open', async () => {
		const owner = await createUser(db);
		const draft = await createCommission(db, { status: 'draft', customerId: owner.id });
		const path = `/api/v1/commissions/${draft.id}/photos`;
		const bytes = await png(40, 30);

		expect((await upload(null, path, bytes)).status).toBe(401);
		expect((await upload(await signedIn(await createWorkroom(db)), path, bytes)).status).toBe(403);
		const stranger = await upload(await signedIn(await createUser(db)), path, bytes);
		expect(stranger.status).toBe(404);
		expect(((await stranger.json()) as ApiError).error.code).toBe('not_found');

		const closed = await createCommission(db, { status: 'closed', customerId: owner.id });
		const refused = await upload(await signedIn(owner), `/api/v1/commissions/${closed.id}/photos`, bytes);
		expect(refused.status).toBe(409);
		expect(((await refused.json()) as ApiError).error.code).toBe('not_editable');
	});
});

describe('who may fetch a commission photo', { timeout: 60_000 }, () => {
	it('shows an open commission’s photos to its owner, admins and signed-in tailors, and nobody else', async () => {
		const owner = await createUser(db);
		const open = await createCommission(db, { status: 'open', customerId: owner.id });
		const photo = (await (
			await upload(await signedIn(owner), `/api/v1/commissions/${open.id}/photos`, await png())
		).json()) as Created;

		expect((await fetchAs(await signedIn(owner), photo.url)).status).toBe(200);
		expect((await fetchAs(await signedIn(await createWorkroom(db)), photo.url)).status).toBe(200);
		expect((await fetchAs(await signedIn(await createUser(db, { role: 'admin' })), photo.thumbUrl)).status).toBe(200);
		expect((await fetchAs(await signedIn(await createUser(db)), photo.url)).status).toBe(404);
		expect((await fetchAs(null, photo.url)).status).toBe(404);
		expect((await fetchAs(null, photo.thumbUrl)).status).toBe(404);
		expect((await fetchAs(null, `/photos/${crypto.randomUUID()}/full`)).status).toBe(404);
	});

	it('keeps a draft’s photos to its owner, and an awarded commission’s to the owner and the chosen tailor', async () => {
		const owner = await createUser(db);
		const draft = await createCommission(db, { status: 'draft', customerId: owner.id });
		const draftPhoto = await commissionPhotos.addWithoutChecks(db, { commissionId: draft.id, file: await png() });
		expect((await fetchAs(await signedIn(await createWorkroom(db)), draftPhoto.url)).status).toBe(404);

		const awarded = await createCommission(db, { status: 'awarded', customerId: owner.id });
		const [chosen, other] = [await createWorkroom(db), await createWorkroom(db)];
		await db.insert(quote).values({
			commissionId: awarded.id,
			tailorId: chosen.id,
			priceMinor: 15000,
			currency: 'EUR',
			deliveryDate: '2027-03-01',
			fabricIncluded: false,
			validUntil: new Date(Date.now() + 86_400_000),
			status: 'accepted'
		});
		const photo = await commissionPhotos.addWithoutChecks(db, { commissionId: awarded.id, file: await png() });
		expect((await fetchAs(await signedIn(owner), photo.url)).status).toBe(200);
		expect((await fetchAs(await signedIn(chosen), photo.url)).status).toBe(200);
		expect((await fetchAs(await signedIn(other), photo.url)).status).toBe(404);
		expect(await commissionPhotos.canView(db, { photoId: photo.id, viewer: { id: other.id, role: 'tailor' } })).toBe(
			false
		);
	});
});

describe('photo forms without JavaScript', { timeout: 60_000 }, () => {
	it('uploads several files from the photo step and names each refused one with its reason', async () => {
		const owner = await createUser(db);
		const client = await signedIn(owner);
		const draft = await createCommission(db, { status: 'draft', customerId: owner.id });
		const body = new FormData();
		body.append('file', new Blob([new Uint8Array(await png())]), 'fabric.png');
		body.append('file', new Blob([new Uint8Array(htmlPage())]), 'notes.jpg');
		const response = await fetch(`${baseUrl}/commissions/${draft.id}/edit/photos?/upload`, {
			method: 'POST',
			headers: headersOf(client, { accept: 'text/html' }),
			body
		});
		expect(response.status).toBe(422);
		const page = await response.text();
		expect(page).toContain('notes.jpg');
		expect(page).toContain('holds text (such as a web page)');
		expect(await commissionPhotos.photoCount(db, { commissionId: draft.id })).toBe(1);
	});
});

describe('portfolio photos', { timeout: 60_000 }, () => {
	it('lets a tailor build a portfolio of at most twelve photos that anyone may view', async () => {
		const tailor = await createWorkroom(db);
		const client = await signedIn(tailor);
		const created = await sendJson(client, 'POST', '/api/v1/workroom/portfolio', {
			caption: 'Linen trousers with hand-finished hems',
			garmentType: 'wide-leg-trousers'
		});
		expect(created.status).toBe(201);
		const item = (await created.json()) as { id: string };
		const path = `/api/v1/workroom/portfolio/${item.id}/photos`;
		const bytes = await png(50, 40);
		const first = (await (await upload(client, path, bytes)).json()) as Created;
		expect((await fetchAs(null, first.url)).status).toBe(200);
		for (let i = 1; i < 12; i += 1) expect((await upload(client, path, bytes)).status).toBe(201);
		const thirteenth = await upload(client, path, bytes);
		expect(thirteenth.status).toBe(409);
		expect(((await thirteenth.json()) as ApiError).error.code).toBe('photo_limit');

		const other = await signedIn(await createWorkroom(db));
		expect((await upload(other, path, bytes)).status).toBe(404);
		expect((await sendJson(other, 'DELETE', `${path}/${first.id}`)).status).toBe(404);
		expect((await upload(await signedIn(await createUser(db)), path, bytes)).status).toBe(403);

		const [row] = await db
			.select({ key: portfolioPhoto.storageKey })
			.from(portfolioPhoto)
			.where(eq(portfolioPhoto.id, first.id));
		expect((await sendJson(client, 'DELETE', `/api/v1/workroom/portfolio/${item.id}`)).status).toBe(204);
		expect(await readPhoto(row.key)).toBeNull();
		expect((await fetchAs(null, first.url)).status).toBe(404);
	});

	it('asks a tailor to name the workroom before adding a portfolio piece', async () => {
		const client = await signedIn(await createUser(db, { role: 'tailor' }));
		const response = await sendJson(client, 'POST', '/api/v1/workroom/portfolio', { caption: 'First piece' });
		expect(response.status).toBe(409);
		expect(((await response.json()) as ApiError).error.code).toBe('no_workroom');
	});
});

describe('demo photos', () => {
	it('are real objects in the stand-in, drawn and re-encoded like any upload', async () => {
		const rows = await db
			.select({ key: commissionPhoto.storageKey })
			.from(commissionPhoto)
			.where(eq(commissionPhoto.commissionId, demoId('commission', 1)));
		expect(rows.length).toBeGreaterThan(0);
		const stored = await readPhoto(rows[0].key);
		const bytes = new Uint8Array(await new Response(stored?.body).arrayBuffer());
		expect((await sharp(bytes).metadata()).format).toBe('webp');
	});
});
