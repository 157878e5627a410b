import { randomBytes } from 'node:crypto';
import { DeleteObjectCommand, GetObjectCommand, NoSuchKey, PutObjectCommand } from '@aws-sdk/client-s3';
import { getSignedUrl } from '@aws-sdk/s3-request-presigner';
import { storage } from '../services/storage';
import type { ProcessedPhoto } from './process';

/** Where a stored photo and its thumbnail live in the bucket. */
export type PhotoKeys = { key: string; thumbKey: string };

export const defaultUrlSeconds = 300;
const maxUrlSeconds = 3600;
const keyPattern = /^photos\/[0-9a-f]{32}\/(full|thumb)\.webp$/;

function assertPhotoKey(key: string) {
	if (!keyPattern.test(key)) throw new Error('Not a photo key');
}

async function put(key: string, body: Uint8Array) {
	const { client, bucket } = storage();
	await client.send(
		new PutObjectCommand({
			Bucket: bucket,
			Key: key,
			Body: body,
			ContentType: 'image/webp',
			// A key never gets new content, and only the signed-in viewer's browser may keep a copy.
			CacheControl: 'private, max-age=3600, immutable'
		})
	);
}

/** Stores a processed photo and its thumbnail under a fresh random key; nothing the user sent is in it. */
export async function storePhoto(photo: Pick<ProcessedPhoto, 'bytes' | 'thumbBytes'>): Promise<PhotoKeys> {
	const id = randomBytes(16).toString('hex');
	const keys = { key: `photos/${id}/full.webp`, thumbKey: `photos/${id}/thumb.webp` };
	try {
		await Promise.all([put(keys.key, photo.bytes), put(keys.thumbKey, photo.thumbBytes)]);
	} catch (error) {
		await deletePhoto(keys).catch(() => undefined);
		throw error;
	}
	return keys;
}

/**
 * A short-lived URL that fetches one stored photo. Hand it only to someone allowed to see the photo:
 * whoever holds it can fetch the image until it expires.
 */
export async function signedUrl(key: string, seconds = defaultUrlSeconds): Promise<string> {
	assertPhotoKey(key);
	if (!Number.isInteger(seconds) || seconds < 1 || seconds > maxUrlSeconds)
		throw new Error(`A photo URL lives between 1 and ${maxUrlSeconds} seconds`);
	const { client, bucket } = storage();
	return getSignedUrl(client, new GetObjectCommand({ Bucket: bucket, Key: key }), { expiresIn: seconds });
}

/**
 * The stored WebP as a stream, for a same-origin route that has checked who may see it (pages allow
 * images only from their own origin); null when it is gone.
 */
export async function readPhoto(key: string): Promise<{ body: ReadableStream<Uint8Array>; size: number } | null> {
	assertPhotoKey(key);
	const { client, bucket } = storage();
	try {
		const object = await client.send(new GetObjectCommand({ Bucket: bucket, Key: key }));
		if (!object.Body) return null;
		return { body: object.Body.transformToWebStream() as ReadableStream<Uint8Array>, size: object.ContentLength ?? 0 };
	} catch (error) {
		if (error instanceof NoSuchKey) return null;
		throw error;
	}
}

/** Removes a photo and its thumbnail; removing one that is already gone is not an error. */
export async function deletePhoto(keys: { key: string; thumbKey: string | null }): Promise<void> {
	const { client, bucket } = storage();
	await Promise.all(
		[keys.key, keys.thumbKey]
			.filter((key) => key !== null)
			.map((key) => client.send(new DeleteObjectCommand({ Bucket: bucket, Key: key })))
	);
}
