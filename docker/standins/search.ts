/**
 * A stand-in for Meilisearch on loopback: the subset of its HTTP API that the `meilisearch` client calls
 * for Tackline (indexes, settings, documents, tasks, search with filters, geo radius and sort, facets).
 * Everything lives in memory; `stop()` and `start()` let a test take search away and bring it back empty,
 * as a restarted server without a volume would be.
 */
import { randomBytes } from 'node:crypto';
import { createServer, type IncomingMessage, type ServerResponse } from 'node:http';
import type { AddressInfo } from 'node:net';
import { SearchError, SearchIndex, type SearchRequest } from './search-engine';
import type { Doc } from './search-filter';

type Task = {
	uid: number;
	batchUid: number;
	indexUid: string | null;
	status: 'enqueued' | 'processing' | 'succeeded' | 'failed';
	type: string;
	canceledBy: null;
	details: Record<string, unknown>;
	error: { message: string; code: string; type: string; link: string } | null;
	duration: string;
	enqueuedAt: string;
	startedAt: string;
	finishedAt: string;
};

class HttpError extends Error {
	constructor(
		readonly status: number,
		readonly code: string,
		message: string
	) {
		super(message);
	}
}

const errorBody = (code: string, message: string, type = 'invalid_request') => ({
	message,
	code,
	type,
	link: `https://docs.meilisearch.com/errors#${code}`
});

async function readBody(req: IncomingMessage): Promise<unknown> {
	const chunks: Buffer[] = [];
	let size = 0;
	for await (const chunk of req) {
		size += (chunk as Buffer).length;
		if (size > 100 * 1024 * 1024) throw new HttpError(413, 'payload_too_large', 'The payload is too large.');
		chunks.push(chunk as Buffer);
	}
	if (size === 0) return undefined;
	try {
		return JSON.parse(Buffer.concat(chunks).toString('utf8'));
	} catch {
		throw new HttpError(400, 'malformed_payload', 'The JSON payload could not be parsed.');
	}
}

export async function startSearchStandin(options: { port: number; masterKey?: string; host?: string }) {
	const host = options.host ?? '127.0.0.1';
	const masterKey = options.masterKey ?? randomBytes(16).toString('hex');
	let indexes = new Map<string, SearchIndex>();
	let tasks: Task[] = [];

	/** Writes run at once; the answer still says `enqueued`, and the task reads as finished when polled. */
	function enqueue(indexUid: string | null, type: string, work: () => Record<string, unknown> | void) {
		const now = new Date().toISOString();
		const task: Task = {
			uid: tasks.length,
			batchUid: tasks.length,
			indexUid,
			status: 'succeeded',
			type,
			canceledBy: null,
			details: {},
			error: null,
			duration: 'PT0S',
			enqueuedAt: now,
			startedAt: now,
			finishedAt: now
		};
		try {
			task.details = work() ?? {};
		} catch (error) {
			if (!(error instanceof SearchError)) throw error;
			task.status = 'failed';
			task.error = errorBody(error.code, error.message);
		}
		tasks.push(task);
		return { taskUid: task.uid, indexUid, status: 'enqueued', type, enqueuedAt: now };
	}

	function indexOrFail(uid: string) {
		const index = indexes.get(uid);
		if (!index) throw new HttpError(404, 'index_not_found', `Index \`${uid}\` not found.`);
		return index;
	}

	function indexOrCreate(uid: string, primaryKey?: string | null) {
		let index = indexes.get(uid);
		if (!index) indexes.set(uid, (index = new SearchIndex(uid, primaryKey ?? null)));
		return index;
	}

	async function route(req: IncomingMessage, url: URL): Promise<[number, unknown]> {
		const method = req.method ?? 'GET';
		const parts = url.pathname.split('/').filter(Boolean).map(decodeURIComponent);
		if (parts[0] === 'health') return [200, { status: 'available' }];

		const auth = req.headers.authorization;
		if (!auth) throw new HttpError(401, 'missing_authorization_header', 'The Authorization header is missing.');
		if (auth !== `Bearer ${masterKey}`) throw new HttpError(403, 'invalid_api_key', 'The provided API key is invalid.');

		if (parts[0] === 'version') return [200, { pkgVersion: '1.12.0', commitSha: 'standin', commitDate: '' }];
		if (parts[0] === 'tasks' && parts.length === 2) {
			const task = tasks[Number(parts[1])];
			if (!task) throw new HttpError(404, 'task_not_found', `Task \`${parts[1]}\` not found.`);
			return [200, task];
		}
		if (parts[0] === 'tasks' && parts.length === 1) return [200, { results: [...tasks].reverse().slice(0, 20) }];
		if (parts[0] !== 'indexes') throw new HttpError(404, 'not_found', 'Not found.');

		const [, uid, section, sub] = parts;
		if (!uid) {
			if (method === 'GET')
				return [
					200,
					{ results: [...indexes.values()].map((i) => i.describe()), offset: 0, limit: 20, total: indexes.size }
				];
			const body = (await readBody(req)) as { uid?: string; primaryKey?: string };
			if (!body?.uid) throw new HttpError(400, 'missing_index_uid', 'An index uid is missing.');
			return [
				202,
				enqueue(body.uid, 'indexCreation', () => {
					if (indexes.has(body.uid!))
						throw new SearchError(`Index \`${body.uid}\` already exists.`, 'index_already_exists');
					indexOrCreate(body.uid!, body.primaryKey);
					return { primaryKey: body.primaryKey ?? null };
				})
			];
		}
		if (!section) {
			if (method === 'GET') return [200, indexOrFail(uid).describe()];
			if (method === 'DELETE') return [202, enqueue(uid, 'indexDeletion', () => void indexes.delete(uid))];
			if (method === 'PATCH') {
				const body = (await readBody(req)) as { primaryKey?: string };
				return [202, enqueue(uid, 'indexUpdate', () => void (indexOrFail(uid).primaryKey = body?.primaryKey ?? null))];
			}
		}
		if (section === 'settings') {
			if (method === 'GET') return [200, indexOrFail(uid).settings];
			const body = ((await readBody(req)) ?? {}) as Record<string, string[]>;
			const patch = sub
				? { [sub.replace(/-(\w)/g, (_, c: string) => c.toUpperCase())]: body as unknown as string[] }
				: body;
			return [202, enqueue(uid, 'settingsUpdate', () => void indexOrCreate(uid).updateSettings(patch))];
		}
		if (section === 'stats') {
			const index = indexOrFail(uid);
			return [200, { numberOfDocuments: index.documents.size, isIndexing: false, fieldDistribution: {} }];
		}
		if (section === 'search') {
			const request: SearchRequest =
				method === 'GET'
					? {
							q: url.searchParams.get('q'),
							filter: url.searchParams.get('filter'),
							sort: url.searchParams.get('sort')?.split(','),
							limit: Number(url.searchParams.get('limit') ?? 20),
							offset: Number(url.searchParams.get('offset') ?? 0)
						}
					: ((await readBody(req)) ?? {});
			try {
				return [200, indexOrFail(uid).search(request)];
			} catch (error) {
				if (error instanceof SearchError) throw new HttpError(400, error.code, error.message);
				throw error;
			}
		}
		if (section === 'documents') {
			if (sub === 'delete-batch') {
				const ids = (await readBody(req)) as (string | number)[];
				return [202, enqueue(uid, 'documentDeletion', () => indexOrFail(uid).deleteDocuments(ids))];
			}
			if (sub === 'delete') {
				const body = (await readBody(req)) as { filter: string };
				return [202, enqueue(uid, 'documentDeletion', () => indexOrFail(uid).deleteWhere(body.filter))];
			}
			if (sub && method === 'GET') {
				const doc = indexOrFail(uid).documents.get(sub);
				if (!doc) throw new HttpError(404, 'document_not_found', `Document \`${sub}\` not found.`);
				return [200, doc];
			}
			if (sub && method === 'DELETE')
				return [202, enqueue(uid, 'documentDeletion', () => indexOrFail(uid).deleteDocuments([sub]))];
			if (method === 'DELETE') return [202, enqueue(uid, 'documentDeletion', () => indexOrFail(uid).clear())];
			if (method === 'GET') {
				const docs = [...indexOrFail(uid).documents.values()];
				const offset = Number(url.searchParams.get('offset') ?? 0);
				const limit = Number(url.searchParams.get('limit') ?? 20);
				return [200, { results: docs.slice(offset, offset + limit), offset, limit, total: docs.length }];
			}
			const body = await readBody(req);
			const docs = (Array.isArray(body) ? body : [body]) as Doc[];
			const primaryKey = url.searchParams.get('primaryKey') ?? undefined;
			return [
				202,
				enqueue(uid, 'documentAdditionOrUpdate', () => {
					indexOrCreate(uid, primaryKey).addDocuments(docs, { primaryKey, merge: method === 'PUT' });
					return { receivedDocuments: docs.length, indexedDocuments: docs.length };
				})
			];
		}
		throw new HttpError(404, 'not_found', 'Not found.');
	}

	const server = createServer((req, res: ServerResponse) => {
		const url = new URL(req.url ?? '/', `http://${host}`);
		route(req, url)
			.then(([status, body]) => res.writeHead(status, { 'content-type': 'application/json' }).end(JSON.stringify(body)))
			.catch((error: unknown) => {
				const http = error instanceof HttpError ? error : new HttpError(500, 'internal', String(error));
				const type =
					http.status === 401 || http.status === 403 ? 'auth' : http.status >= 500 ? 'internal' : 'invalid_request';
				res
					.writeHead(http.status, { 'content-type': 'application/json' })
					.end(JSON.stringify(errorBody(http.code, http.message, type)));
			});
	});

	let port = options.port;
	async function start() {
		await new Promise<void>((resolve, reject) => {
			server.once('error', reject);
			server.listen(port, host, () => resolve());
		});
		port = (server.address() as AddressInfo).port;
	}
	await start();

	return {
		env: { MEILI_HOST: `http://${host}:${port}`, MEILI_MASTER_KEY: masterKey },
		/** Stops answering; the indexes are forgotten, as a restarted server without a volume forgets them. */
		stop: () =>
			new Promise<void>((resolve) => {
				server.close(() => resolve());
				server.closeAllConnections();
				indexes = new Map();
				tasks = [];
			}),
		/** Listens again on the same port. */
		start
	};
}
