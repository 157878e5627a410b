import { env } from '$env/dynamic/private';
import { HeadBucketCommand, S3Client } from '@aws-sdk/client-s3';

let configured: { client: S3Client; bucket: string } | null = null;

/**
 * The configured S3 client and the one private bucket that holds uploaded files: the local stand-in
 * when `S3_ENDPOINT` is set, AWS otherwise (credentials from the environment or the instance role).
 */
export function storage(): { client: S3Client; bucket: string } {
	if (configured) return configured;
	if (!env.S3_BUCKET) throw new Error('S3_BUCKET is not set');
	const client = new S3Client({
		region: env.S3_REGION || 'us-east-1',
		...(env.S3_ENDPOINT ? { endpoint: env.S3_ENDPOINT, forcePathStyle: true } : {}),
		...(env.S3_ACCESS_KEY_ID && env.S3_SECRET_ACCESS_KEY
			? { credentials: { accessKeyId: env.S3_ACCESS_KEY_ID, secretAccessKey: env.S3_SECRET_ACCESS_KEY } }
			: {}),
		// Checksums only where S3 demands them: otherwise bodies go out aws-chunked, which
		// S3-compatible stores often refuse.
		requestChecksumCalculation: 'WHEN_REQUIRED',
		responseChecksumValidation: 'WHEN_REQUIRED',
		maxAttempts: 3
	});
	configured = { client, bucket: env.S3_BUCKET };
	return configured;
}

const checkCacheMs = 5000;
let lastCheck: { at: number; result: Promise<string> } | null = null;

async function headBucket(): Promise<string> {
	try {
		const { client, bucket } = storage();
		await client.send(new HeadBucketCommand({ Bucket: bucket }), { abortSignal: AbortSignal.timeout(3000) });
		return 'ok';
	} catch (error) {
		const status = (error as { $metadata?: { httpStatusCode?: number } }).$metadata?.httpStatusCode;
		if (status === 404) return 'bucket missing';
		if (status === 403) return 'access denied';
		return error instanceof Error ? error.message || error.name : 'unreachable';
	}
}

/** 'ok' when the bucket answers (HeadBucket), else what went wrong; remembered a few seconds so health polls stay cheap. */
export function check(): Promise<string> {
	if (!lastCheck || Date.now() - lastCheck.at > checkCacheMs) lastCheck = { at: Date.now(), result: headBucket() };
	return lastCheck.result;
}
