/**
 * Local stand-in for S3 on loopback: the subset the app's SDK client uses — HeadBucket,
 * CreateBucket, PutObject, GetObject (also through presigned URLs), HeadObject, DeleteObject —
 * with Signature V4 checked on every request and no anonymous access. Objects are files under
 * `dataDir/<bucket>/`, named by a hash of the key, with their headers in a JSON file beside them.
 */
import { createHash, randomBytes, randomUUID } from 'node:crypto';
import { existsSync, mkdirSync } from 'node:fs';
import { readFile, rename, rm, writeFile } from 'node:fs/promises';
import { createServer, type IncomingMessage, type ServerResponse } from 'node:http';
import type { AddressInfo } from 'node:net';
import { join } from 'node:path';
import { sha256Hex, verifySignature, type Credentials } from './s3-signature';

type ObjectMeta = {
	key: string;
	size: number;
	etag: string;
	lastModified: string;
	headers: Record<string, string>;
};

const maxObjectBytes = 64 * 1024 * 1024;
const bucketName = /^[a-z0-9][a-z0-9.-]{1,61}[a-z0-9]$/;
// Query parameters that name the operation or carry a presigned signature; any other sub-resource
// (?acl, ?cors, ?list-type, ?uploads…) is outside the subset and answered 501.
const plainQuery = /^(x-id|x-amz-[a-z0-9-]+)$/i;
const storedHeaders = ['content-type', 'cache-control', 'content-disposition', 'content-language'];

class S3Error extends Error {
	constructor(
		readonly status: number,
		readonly code: string,
		message: string
	) {
		super(message);
	}
}

function readBody(req: IncomingMessage): Promise<Buffer> {
	return new Promise((resolve, reject) => {
		const chunks: Buffer[] = [];
		let size = 0;
		req.on('data', (chunk: Buffer) => {
			size += chunk.length;
			if (size > maxObjectBytes) {
				reject(new S3Error(400, 'EntityTooLarge', 'Your proposed upload exceeds the maximum allowed size'));
				req.destroy();
			} else chunks.push(chunk);
		});
		req.on('end', () => resolve(Buffer.concat(chunks)));
		req.on('error', reject);
	});
}

export async function startS3Standin(options: { port: number; dataDir: string; bucket: string; host?: string }) {
	const host = options.host ?? '127.0.0.1';
	const credentials: Credentials = {
		accessKeyId: `STANDIN${randomBytes(6).toString('hex').toUpperCase()}`,
		secretAccessKey: randomBytes(30).toString('base64url'),
		region: 'us-east-1'
	};
	const bucketDir = (bucket: string) => join(options.dataDir, bucket);
	const objectPath = (bucket: string, key: string) =>
		join(bucketDir(bucket), createHash('sha256').update(key).digest('hex'));
	mkdirSync(bucketDir(options.bucket), { recursive: true });

	async function readMeta(bucket: string, key: string): Promise<ObjectMeta> {
		try {
			return JSON.parse(await readFile(`${objectPath(bucket, key)}.json`, 'utf8')) as ObjectMeta;
		} catch {
			throw new S3Error(404, 'NoSuchKey', 'The specified key does not exist.');
		}
	}

	async function putObject(
		req: IncomingMessage,
		res: ServerResponse,
		bucket: string,
		key: string,
		payloadHash: string
	) {
		if (payloadHash.startsWith('STREAMING-'))
			throw new S3Error(
				501,
				'NotImplemented',
				'aws-chunked uploads are not supported; set requestChecksumCalculation to WHEN_REQUIRED'
			);
		const body = await readBody(req);
		if (payloadHash !== 'UNSIGNED-PAYLOAD' && payloadHash !== sha256Hex(body))
			throw new S3Error(
				400,
				'XAmzContentSHA256Mismatch',
				'The provided x-amz-content-sha256 header does not match what was computed.'
			);
		const etag = `"${createHash('md5').update(body).digest('hex')}"`;
		const headers = Object.fromEntries(
			storedHeaders.flatMap((name) => (typeof req.headers[name] === 'string' ? [[name, req.headers[name]]] : []))
		);
		headers['content-type'] ??= 'binary/octet-stream';
		const meta: ObjectMeta = { key, size: body.length, etag, lastModified: new Date().toUTCString(), headers };
		const path = objectPath(bucket, key);
		const temp = `${path}.${randomUUID()}.tmp`;
		await writeFile(temp, body);
		await rename(temp, path);
		await writeFile(`${path}.json`, JSON.stringify(meta));
		res.writeHead(200, { etag }).end();
	}

	async function getObject(res: ServerResponse, bucket: string, key: string, withBody: boolean) {
		const meta = await readMeta(bucket, key);
		const headers = {
			...meta.headers,
			'content-length': String(meta.size),
			etag: meta.etag,
			'last-modified': meta.lastModified
		};
		if (!withBody) return void res.writeHead(200, headers).end();
		const body = await readFile(objectPath(bucket, key));
		res.writeHead(200, headers).end(body);
	}

	async function handle(req: IncomingMessage, res: ServerResponse) {
		const url = new URL(req.url ?? '/', 'http://stand-in');
		for (const name of url.searchParams.keys())
			if (!plainQuery.test(name)) throw new S3Error(501, 'NotImplemented', `The stand-in does not implement ?${name}`);
		const signature = verifySignature(
			{ method: req.method ?? 'GET', url: req.url ?? '/', headers: req.headers },
			credentials
		);
		if (!signature.ok) throw new S3Error(signature.status, signature.code, signature.message);

		const [, bucket = '', ...keyParts] = url.pathname.split('/');
		const key = decodeURIComponent(keyParts.join('/'));
		if (!bucketName.test(bucket)) throw new S3Error(400, 'InvalidBucketName', 'The specified bucket is not valid.');
		const bucketExists = existsSync(bucketDir(bucket));
		if (!key) {
			if (req.method === 'HEAD') return void res.writeHead(bucketExists ? 200 : 404).end();
			if (req.method === 'PUT') {
				if (bucketExists)
					throw new S3Error(
						409,
						'BucketAlreadyOwnedByYou',
						'Your previous request to create the named bucket succeeded and you already own it.'
					);
				mkdirSync(bucketDir(bucket));
				return void res.writeHead(200, { location: `/${bucket}` }).end();
			}
			throw new S3Error(501, 'NotImplemented', 'Only HeadBucket and CreateBucket are implemented on buckets');
		}
		if (!bucketExists) throw new S3Error(404, 'NoSuchBucket', 'The specified bucket does not exist');
		if (key.length > 1024) throw new S3Error(400, 'KeyTooLongError', 'Your key is too long');
		switch (req.method) {
			case 'PUT':
				return putObject(req, res, bucket, key, signature.payloadHash);
			case 'GET':
			case 'HEAD':
				return getObject(res, bucket, key, req.method === 'GET');
			case 'DELETE': {
				const path = objectPath(bucket, key);
				await Promise.all([rm(path, { force: true }), rm(`${path}.json`, { force: true })]);
				return void res.writeHead(204).end();
			}
			default:
				throw new S3Error(405, 'MethodNotAllowed', 'The specified method is not allowed against this resource.');
		}
	}

	const server = createServer((req, res) => {
		handle(req, res).catch((error: unknown) => {
			const s3Error = error instanceof S3Error ? error : new S3Error(500, 'InternalError', String(error));
			if (res.headersSent) return void res.destroy();
			const requestId = randomBytes(8).toString('hex').toUpperCase();
			if (req.method === 'HEAD') return void res.writeHead(s3Error.status, { 'x-amz-request-id': requestId }).end();
			const xml = `<?xml version="1.0" encoding="UTF-8"?>\n<Error><Code>${s3Error.code}</Code><Message>${s3Error.message.replace(/[<&]/g, '')}</Message><RequestId>${requestId}</RequestId></Error>`;
			res.writeHead(s3Error.status, { 'content-type': 'application/xml', 'x-amz-request-id': requestId }).end(xml);
		});
	});
	await new Promise<void>((resolve, reject) => {
		server.once('error', reject);
		server.listen(options.port, host, () => resolve());
	});
	const { port } = server.address() as AddressInfo;

	return {
		env: {
			S3_ENDPOINT: `http://${host}:${port}`,
			S3_BUCKET: options.bucket,
			S3_REGION: credentials.region,
			S3_ACCESS_KEY_ID: credentials.accessKeyId,
			S3_SECRET_ACCESS_KEY: credentials.secretAccessKey
		},
		stop: () =>
			new Promise<void>((resolve) => {
				server.close(() => resolve());
				server.closeAllConnections();
			})
	};
}
