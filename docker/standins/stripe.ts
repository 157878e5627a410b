/**
 * A stand-in for Stripe on loopback, for the official `stripe` SDK pointed at it with
 * `new Stripe(key, { host: '127.0.0.1', port, protocol: 'http' })`. It answers Stripe's v1 API for what
 * Tackline uses (see `stripe-store.ts`), in Stripe's request encoding and response shapes, honours
 * `Idempotency-Key`, signs and retries webhooks (`stripe-webhooks.ts`), and serves the hosted payment
 * page and Connect onboarding page (`stripe-pages.ts`). State lives in memory.
 *
 * A control API on the same server drives faults and inspection for tests (`stripe-controller.ts`):
 *   GET    /__standin/health
 *   GET    /__standin/faults            POST /__standin/faults {errorRate, errorStatus, latencyMs, timeoutRate,
 *                                           hangMs, paths, dropWebhooks, duplicateWebhooks}   DELETE: none
 *   GET    /__standin/events?type=…     events with their webhook deliveries
 *   POST   /__standin/events/:id/resend deliver an event again
 *   GET    /__standin/idle              resolves once no webhook delivery is pending
 *   POST   /__standin/webhooks {endpoints:[{url,secret,events?}]}
 *   POST   /__standin/settle            pending funds become available now
 *   POST   /__standin/settings {availabilityDelaySeconds}
 *   POST   /__standin/reset             forget every object, event, key and fault
 */
import { randomBytes } from 'node:crypto';
import { existsSync, readFileSync, renameSync, writeFileSync } from 'node:fs';
import { createServer, type IncomingMessage, type ServerResponse } from 'node:http';
import type { AddressInfo } from 'node:net';
import { decodeForm, FormDecodeError, type FormObject } from './stripe-form';
import { checkoutPage, messagePage, onboardingPage } from './stripe-pages';
import { StripeApiError, StripeStore, newId, type StripeObject } from './stripe-store';
import { WebhookDispatcher, type WebhookEndpoint } from './stripe-webhooks';

export const STANDIN_API_VERSION = '2026-10-28.endive';

export type StripeFaults = {
	/** Share (0–1) of matching API requests answered with `errorStatus` (500) without doing anything. */
	errorRate: number;
	errorStatus: number;
	/** Delay before every matching API request. */
	latencyMs: number;
	/** Share of matching requests that are carried out but never answered (the client times out). */
	timeoutRate: number;
	/** How long an unanswered request is held before the connection is dropped. */
	hangMs: number;
	/** Paths the faults apply to: prefixes such as `/v1/transfers`, optionally led by a method (`POST /v1/refunds`). Empty: all of `/v1`. */
	paths: string[];
	/** Share of webhook deliveries dropped, and delivered twice. */
	dropWebhooks: number;
	duplicateWebhooks: number;
};

const noFaults = (): StripeFaults => ({
	errorRate: 0,
	errorStatus: 500,
	latencyMs: 0,
	timeoutRate: 0,
	hangMs: 30_000,
	paths: [],
	dropWebhooks: 0,
	duplicateWebhooks: 0
});

export type StripeStandinOptions = {
	port?: number;
	host?: string;
	/** The secret key clients must present; `sk_test_…`. */
	secretKey?: string;
	webhooks?: WebhookEndpoint[];
	webhookRetryBaseMs?: number;
	webhookMaxAttempts?: number;
	availabilityDelaySeconds?: number;
	/** The signing secret for endpoints added by `setWebhookUrl` (a fresh `whsec_…` by default). */
	webhookSecret?: string;
	/** Loads this file at start if it exists, and keeps it up to date: state that outlives a restart. */
	stateFile?: string;
	/** Loads this file at start without writing to it: a copy of another stand-in's state (tests). */
	initialStateFile?: string;
};

type Stored = { fingerprint: string; status: number; body: string };
type Handler = (match: string[], params: FormObject, context: { account: string | null }) => unknown;

class HttpJsonError extends Error {
	constructor(
		readonly status: number,
		message: string
	) {
		super(message);
	}
}

async function readRaw(req: IncomingMessage, limit = 1024 * 1024): Promise<string> {
	const chunks: Buffer[] = [];
	let size = 0;
	for await (const chunk of req) {
		size += (chunk as Buffer).length;
		if (size > limit) throw new StripeApiError(413, 'invalid_request_error', 'Request body too large.');
		chunks.push(chunk as Buffer);
	}
	return Buffer.concat(chunks).toString('utf8');
}

/** Parameters in a canonical order, so the same request matches its stored idempotent answer. */
function canonical(value: unknown): string {
	if (Array.isArray(value)) return `[${value.map(canonical).join(',')}]`;
	if (value && typeof value === 'object')
		return `{${Object.keys(value)
			.sort()
			.map((k) => `${JSON.stringify(k)}:${canonical((value as Record<string, unknown>)[k])}`)
			.join(',')}}`;
	return JSON.stringify(value);
}

export async function startStripeStandin(options: StripeStandinOptions = {}) {
	const host = options.host ?? '127.0.0.1';
	const secretKey = options.secretKey ?? `sk_test_tackline_${randomBytes(12).toString('hex')}`;
	let port = options.port ?? 0;
	let faults = noFaults();
	let idempotency = new Map<string, Stored>();
	const inProgress = new Set<string>();
	const publicUrl = () => `http://${host}:${port}`;
	const defaultWebhookSecret = options.webhookSecret ?? newWebhookSecret();

	const dispatcher = new WebhookDispatcher({
		endpoints: options.webhooks ?? [],
		retryBaseMs: options.webhookRetryBaseMs ?? 1000,
		maxAttempts: options.webhookMaxAttempts ?? 8,
		faults: () => faults
	});
	const store = new StripeStore({
		apiVersion: STANDIN_API_VERSION,
		publicUrl,
		availabilityDelaySeconds: options.availabilityDelaySeconds,
		// After the answer that caused it is on its way, as Stripe sends webhooks asynchronously.
		onEvent: (event) => void setImmediate(() => dispatcher.dispatch(event))
	});

	const loadFrom = [options.stateFile, options.initialStateFile].find((f) => f && existsSync(f));
	if (loadFrom) {
		const state = JSON.parse(readFileSync(loadFrom, 'utf8')) as { store: unknown; idempotency: [string, Stored][] };
		store.restore(state.store);
		idempotency = new Map(state.idempotency);
	}
	const snapshot = () => JSON.stringify({ store: store.snapshot(), idempotency: [...idempotency] });
	let saveTimer: NodeJS.Timeout | null = null;
	function saveNow() {
		if (saveTimer) clearTimeout(saveTimer);
		saveTimer = null;
		if (!options.stateFile) return;
		writeFileSync(`${options.stateFile}.tmp`, snapshot(), { mode: 0o600 });
		renameSync(`${options.stateFile}.tmp`, options.stateFile);
	}
	/** After anything that may change state; written a moment later so bursts are written once. */
	function scheduleSave() {
		if (options.stateFile && !saveTimer) saveTimer = setTimeout(saveNow, 250);
	}

	const onlyPlatform = (context: { account: string | null }) => {
		if (context.account)
			throw new StripeApiError(
				400,
				'invalid_request_error',
				'This stand-in acts on connected accounts for the balance only.',
				undefined,
				'Stripe-Account'
			);
	};
	const id = (m: string[]) => decodeURIComponent(m[1]);
	const routes: [string, RegExp, Handler][] = [
		['GET', /^\/v1\/balance$/, (_m, p, c) => (checkNoParams(p), store.balance(c.account))],
		['GET', /^\/v1\/balance_transactions$/, (_m, p, c) => store.listBalanceTransactions(p, c.account)],
		['GET', /^\/v1\/balance_transactions\/([^/]+)$/, (m) => store.balanceTransaction(id(m))],
		['POST', /^\/v1\/customers$/, (_m, p, c) => (onlyPlatform(c), store.createCustomer(p))],
		['GET', /^\/v1\/customers$/, (_m, p) => store.listCustomers(p)],
		['GET', /^\/v1\/customers\/([^/]+)$/, (m) => store.customer(id(m))],
		['POST', /^\/v1\/customers\/([^/]+)$/, (m, p) => store.updateCustomer(id(m), p)],
		['DELETE', /^\/v1\/customers\/([^/]+)$/, (m) => store.deleteCustomer(id(m))],
		['POST', /^\/v1\/accounts$/, (_m, p, c) => (onlyPlatform(c), store.createAccount(p))],
		['GET', /^\/v1\/accounts$/, (_m, p) => store.listAccounts(p)],
		['GET', /^\/v1\/accounts\/([^/]+)$/, (m) => store.account(id(m))],
		[
			'GET',
			/^\/v1\/account$/,
			(_m, _p, c) => {
				if (!c.account)
					throw new StripeApiError(400, 'invalid_request_error', 'Pass Stripe-Account to read a connected account.');
				return store.account(c.account);
			}
		],
		['POST', /^\/v1\/accounts\/([^/]+)$/, (m, p) => store.updateAccount(id(m), p)],
		['DELETE', /^\/v1\/accounts\/([^/]+)$/, (m) => store.deleteAccount(id(m))],
		['POST', /^\/v1\/account_links$/, (_m, p, c) => (onlyPlatform(c), store.createAccountLink(p))],
		['POST', /^\/v1\/checkout\/sessions$/, (_m, p, c) => (onlyPlatform(c), store.createCheckoutSession(p))],
		['GET', /^\/v1\/checkout\/sessions$/, (_m, p) => store.listCheckoutSessions(p)],
		['GET', /^\/v1\/checkout\/sessions\/([^/]+)$/, (m) => store.checkoutSession(id(m))],
		['GET', /^\/v1\/checkout\/sessions\/([^/]+)\/line_items$/, (m, p) => store.sessionLineItems(id(m), p)],
		['POST', /^\/v1\/checkout\/sessions\/([^/]+)\/expire$/, (m) => store.expireCheckoutSession(id(m))],
		['GET', /^\/v1\/payment_intents$/, (_m, p) => store.listPaymentIntents(p)],
		['GET', /^\/v1\/payment_intents\/([^/]+)$/, (m) => store.paymentIntent(id(m))],
		['GET', /^\/v1\/charges$/, (_m, p) => store.listCharges(p)],
		['GET', /^\/v1\/charges\/([^/]+)$/, (m) => store.charge(id(m))],
		['POST', /^\/v1\/transfers$/, (_m, p, c) => (onlyPlatform(c), store.createTransfer(p))],
		['GET', /^\/v1\/transfers$/, (_m, p) => store.listTransfers(p)],
		['GET', /^\/v1\/transfers\/([^/]+)$/, (m) => store.transfer(id(m))],
		['POST', /^\/v1\/transfers\/([^/]+)$/, (m, p) => store.updateTransfer(id(m), p)],
		['POST', /^\/v1\/transfers\/([^/]+)\/reversals$/, (m, p, c) => (onlyPlatform(c), store.createReversal(id(m), p))],
		['GET', /^\/v1\/transfers\/([^/]+)\/reversals$/, (m, p) => store.listReversals(id(m), p)],
		['GET', /^\/v1\/transfers\/([^/]+)\/reversals\/([^/]+)$/, (m) => store.reversal(id(m), decodeURIComponent(m[2]))],
		['POST', /^\/v1\/refunds$/, (_m, p, c) => (onlyPlatform(c), store.createRefund(p))],
		['GET', /^\/v1\/refunds$/, (_m, p) => store.listRefunds(p)],
		['GET', /^\/v1\/refunds\/([^/]+)$/, (m) => store.refund(id(m))],
		['POST', /^\/v1\/refunds\/([^/]+)$/, (m, p) => store.updateRefund(id(m), p)],
		['GET', /^\/v1\/events$/, (_m, p) => store.listEvents(p)],
		['GET', /^\/v1\/events\/([^/]+)$/, (m) => store.event(id(m))]
	];
	function checkNoParams(params: FormObject) {
		const key = Object.keys(params)[0];
		if (key)
			throw new StripeApiError(
				400,
				'invalid_request_error',
				`Received unknown parameter: ${key}`,
				'parameter_unknown',
				key
			);
	}

	function faultApplies(method: string, path: string) {
		if (faults.paths.length === 0) return true;
		return faults.paths.some((entry) => {
			const [first, second] = entry.trim().split(/\s+/);
			const [m, prefix] = second ? [first.toUpperCase(), second] : [null, first];
			return (!m || m === method) && path.startsWith(prefix);
		});
	}

	function authorise(req: IncomingMessage) {
		const header = req.headers.authorization ?? '';
		let key = '';
		if (header.startsWith('Bearer ')) key = header.slice(7).trim();
		else if (header.startsWith('Basic ')) key = Buffer.from(header.slice(6), 'base64').toString('utf8').split(':')[0];
		if (!key)
			throw new StripeApiError(
				401,
				'invalid_request_error',
				"You did not provide an API key. You need to provide your API key in the Authorization header, using Bearer auth (e.g. 'Authorization: Bearer YOUR_SECRET_KEY')."
			);
		if (key !== secretKey)
			throw new StripeApiError(
				401,
				'invalid_request_error',
				`Invalid API Key provided: ${key.slice(0, 8)}${'*'.repeat(Math.max(0, key.length - 12))}${key.slice(-4)}`,
				'api_key_invalid'
			);
	}

	async function api(req: IncomingMessage, res: ServerResponse, url: URL) {
		const method = req.method ?? 'GET';
		const requestId = newId('req', 14);
		const version = (req.headers['stripe-version'] as string | undefined) ?? STANDIN_API_VERSION;
		const idemKey = (req.headers['idempotency-key'] as string | undefined) ?? null;
		const account = (req.headers['stripe-account'] as string | undefined) ?? null;
		const headers: Record<string, string> = {
			'content-type': 'application/json',
			'request-id': requestId,
			'stripe-version': version,
			'cache-control': 'no-cache, no-store'
		};
		if (idemKey) headers['idempotency-key'] = idemKey;
		const send = (status: number, body: string, extra: Record<string, string> = {}) =>
			res.writeHead(status, { ...headers, ...extra }).end(body);
		const noRetry = (status: number): Record<string, string> =>
			status >= 400 && status < 500 && status !== 409 && status !== 429 ? { 'stripe-should-retry': 'false' } : {};
		const sendError = (error: StripeApiError) =>
			send(error.status, JSON.stringify(error.body(), null, 2), noRetry(error.status));

		let raw: string;
		try {
			authorise(req);
			raw = method === 'POST' ? await readRaw(req) : '';
		} catch (error) {
			return sendError(error instanceof StripeApiError ? error : new StripeApiError(500, 'api_error', String(error)));
		}

		const faulty = faultApplies(method, url.pathname);
		if (faulty && faults.latencyMs > 0) await new Promise((resolve) => setTimeout(resolve, faults.latencyMs));
		if (faulty && Math.random() < faults.errorRate) {
			const status = faults.errorStatus;
			const type = status === 429 ? 'invalid_request_error' : 'api_error';
			const code = status === 429 ? 'rate_limit' : undefined;
			return sendError(
				new StripeApiError(
					status,
					type,
					'An unexpected error occurred (a fault injected by the Stripe stand-in).',
					code
				)
			);
		}
		const hang = faulty && Math.random() < faults.timeoutRate;

		let params: FormObject;
		try {
			params = decodeForm(method === 'POST' ? raw : url.search.slice(1));
		} catch (error) {
			const param = error instanceof FormDecodeError ? error.param : undefined;
			return sendError(
				new StripeApiError(
					400,
					'invalid_request_error',
					`Invalid request parameters${param ? `: ${param}` : ''}`,
					'parameter_invalid_string',
					param
				)
			);
		}
		const expand = [params.expand ?? []].flat().filter((e): e is string => typeof e === 'string');
		delete params.expand;

		const scope = `${account ?? ''}|${idemKey}`;
		const fingerprint = `${method} ${url.pathname} ${canonical(params)} ${canonical(expand)}`;
		const useKey = method === 'POST' && idemKey;
		let status: number;
		let body: string;
		const stored = useKey ? idempotency.get(scope) : undefined;
		if (stored) {
			if (stored.fingerprint !== fingerprint)
				return sendError(
					new StripeApiError(
						400,
						'idempotency_error',
						`Keys for idempotent requests can only be used with the same parameters they were first used with. Try using a key other than '${idemKey}' if you meant to execute a different request.`
					)
				);
			if (hang) return holdOpen(res);
			return send(stored.status, stored.body, { 'idempotent-replayed': 'true', 'original-request': requestId });
		}
		if (useKey && inProgress.has(scope))
			return sendError(
				new StripeApiError(
					409,
					'invalid_request_error',
					'There is currently another in-progress request using this Stripe-Idempotency-Key. Please try again later.',
					'idempotency_key_in_use'
				)
			);

		const route = routes.find(([m, pattern]) => m === method && pattern.test(url.pathname));
		if (!route) {
			const known = routes.some(([, pattern]) => pattern.test(url.pathname));
			return sendError(
				new StripeApiError(
					known ? 405 : 404,
					'invalid_request_error',
					`Unrecognized request URL (${method}: ${url.pathname}).`
				)
			);
		}
		if (useKey) inProgress.add(scope);
		store.request = { id: requestId, idempotencyKey: idemKey, account };
		try {
			const result = route[2](url.pathname.match(route[1])!, params, { account });
			const view =
				(result as StripeObject).object &&
				(result as StripeObject).id &&
				store.byId((result as StripeObject).id) === result
					? store.view(result as StripeObject)
					: structuredClone(result as Record<string, unknown>);
			store.expand(view, expand);
			status = 200;
			body = JSON.stringify(view, null, 2);
		} catch (error) {
			const e =
				error instanceof StripeApiError
					? error
					: new StripeApiError(500, 'api_error', error instanceof Error ? error.message : String(error));
			status = e.status;
			body = JSON.stringify(e.body(), null, 2);
		} finally {
			store.request = { id: null, idempotencyKey: null, account: null };
			if (useKey) inProgress.delete(scope);
		}
		// Stripe keeps the answer of a request that ran (successes, card errors, server errors); a request
		// refused on its parameters is not kept, so it can be corrected and sent again with the same key.
		if (useKey && (status < 400 || status === 402 || status >= 500))
			idempotency.set(scope, { fingerprint, status, body });
		if (hang) return holdOpen(res);
		send(status, body, noRetry(status));
	}

	/** The request was carried out, but its answer never comes: the client's timeout fires. */
	function holdOpen(res: ServerResponse) {
		const timer = setTimeout(() => res.destroy(), faults.hangMs);
		res.on('close', () => clearTimeout(timer));
	}

	async function hostedCheckout(req: IncomingMessage, res: ServerResponse, sessionId: string) {
		const html = (status: number, body: string) =>
			res.writeHead(status, { 'content-type': 'text/html; charset=utf-8', 'cache-control': 'no-store' }).end(body);
		let session: StripeObject;
		try {
			session = store.checkoutSession(sessionId);
		} catch {
			return html(404, messagePage('Checkout not found', 'There is no checkout at this address.', 'alert'));
		}
		const customerEmail = store.sessionEmail(session);
		if (req.method === 'POST') {
			const form = new URLSearchParams(await readRaw(req, 64 * 1024));
			const card = form.get('card') ?? '';
			const email = customerEmail ?? form.get('email')?.trim() ?? '';
			if (!customerEmail && !/^[^\s@]+@[^\s@]+\.[^\s@]+$/.test(email))
				return html(
					400,
					checkoutPage(session, store.lineItemsOf(sessionId), {
						error: 'Enter your email address.',
						card,
						email,
						customerEmail
					})
				);
			store.request = { id: null, idempotencyKey: null, account: null };
			const outcome = store.payCheckoutSession(sessionId, card, customerEmail ? null : email);
			if (outcome.ok) {
				const target = (session.success_url as string).replaceAll('{CHECKOUT_SESSION_ID}', sessionId);
				return res.writeHead(303, { location: target, 'cache-control': 'no-store' }).end();
			}
			return html(
				402,
				checkoutPage(store.checkoutSession(sessionId), store.lineItemsOf(sessionId), {
					error: outcome.message,
					email,
					customerEmail
				})
			);
		}
		if (req.method !== 'GET' && req.method !== 'HEAD')
			return html(405, messagePage('Not allowed', 'Use the form.', 'alert'));
		html(200, checkoutPage(session, store.lineItemsOf(sessionId), { customerEmail }));
	}

	async function onboarding(req: IncomingMessage, res: ServerResponse, accountId: string, token: string) {
		const html = (status: number, body: string) =>
			res.writeHead(status, { 'content-type': 'text/html; charset=utf-8', 'cache-control': 'no-store' }).end(body);
		const link = store.link(accountId, token);
		if (!link) return html(404, messagePage('Link not found', 'This onboarding link is not valid.', 'alert'));
		// A used or expired link sends people to refresh_url, where the platform makes a new one.
		if (!link.valid) return res.writeHead(302, { location: link.refreshUrl }).end();
		if (req.method === 'POST') {
			const form = new URLSearchParams(await readRaw(req, 64 * 1024));
			store.request = { id: null, idempotencyKey: null, account: null };
			store.completeOnboarding(token, {
				name: form.get('name')?.trim() ?? '',
				complete: form.get('action') !== 'later'
			});
			return res.writeHead(303, { location: link.returnUrl }).end();
		}
		html(200, onboardingPage(store.account(accountId)));
	}

	async function control(req: IncomingMessage, url: URL): Promise<[number, unknown]> {
		const method = req.method ?? 'GET';
		const path = url.pathname.slice('/__standin'.length);
		const json = async () => {
			const raw = await readRaw(req);
			try {
				return (raw ? JSON.parse(raw) : {}) as Record<string, unknown>;
			} catch {
				throw new HttpJsonError(400, 'The body is not JSON.');
			}
		};
		if (path === '/health') return [200, { status: 'ok' }];
		if (path === '/faults') {
			if (method === 'DELETE') faults = noFaults();
			else if (method === 'POST') {
				const body = await json();
				const next = { ...noFaults() };
				for (const [key, value] of Object.entries(body)) {
					if (!(key in next)) throw new HttpJsonError(400, `Unknown fault: ${key}`);
					if (key === 'paths') {
						if (!Array.isArray(value) || value.some((v) => typeof v !== 'string'))
							throw new HttpJsonError(400, 'paths must be a list of strings');
						next.paths = value as string[];
					} else {
						const n = typeof value === 'boolean' ? Number(value) : value;
						if (typeof n !== 'number' || !Number.isFinite(n) || n < 0)
							throw new HttpJsonError(400, `${key} must be a number ≥ 0`);
						if (key.endsWith('Rate') || key.endsWith('Webhooks')) {
							if (n > 1) throw new HttpJsonError(400, `${key} is a share from 0 to 1`);
						}
						(next as Record<string, unknown>)[key] = n;
					}
				}
				faults = next;
			}
			return [200, faults];
		}
		if (path === '/events' && method === 'GET') {
			const type = url.searchParams.get('type');
			const events = store.allEvents().filter((e) => !type || e.type === type);
			return [
				200,
				{ events: events.map((e) => ({ ...e, deliveries: dispatcher.deliveries.filter((d) => d.eventId === e.id) })) }
			];
		}
		const resend = path.match(/^\/events\/([^/]+)\/resend$/);
		if (resend && method === 'POST') {
			const event = store.allEvents().find((e) => e.id === resend[1]);
			if (!event) throw new HttpJsonError(404, 'No such event');
			dispatcher.dispatch(event, 'resend');
			return [202, { resent: event.id }];
		}
		if (path === '/deliveries') return [200, { deliveries: dispatcher.deliveries }];
		if (path === '/idle') {
			const timeout = Number(url.searchParams.get('timeoutMs') ?? 10_000);
			// Events are handed to the dispatcher just after the answer that caused them.
			await new Promise((resolve) => setImmediate(resolve));
			const settled = await Promise.race([
				dispatcher.idle().then(() => true),
				new Promise<boolean>((resolve) => setTimeout(() => resolve(false), timeout))
			]);
			return [settled ? 200 : 504, { idle: settled }];
		}
		if (path === '/webhooks' && method === 'POST') {
			const body = await json();
			const endpoints = body.endpoints as WebhookEndpoint[];
			if (
				!Array.isArray(endpoints) ||
				endpoints.some((e) => typeof e?.url !== 'string' || typeof e?.secret !== 'string')
			)
				throw new HttpJsonError(400, 'endpoints must be a list of {url, secret}');
			dispatcher.endpoints = endpoints;
			return [200, { endpoints }];
		}
		if (path === '/settle' && method === 'POST') {
			store.settle();
			return [200, store.balance(null)];
		}
		if (path === '/settings' && method === 'POST') {
			const body = await json();
			const delay = body.availabilityDelaySeconds;
			if (typeof delay !== 'number' || !Number.isInteger(delay) || delay < 0)
				throw new HttpJsonError(400, 'availabilityDelaySeconds must be a whole number ≥ 0');
			store.availabilityDelaySeconds = delay;
			return [200, { availabilityDelaySeconds: delay }];
		}
		if (path === '/reset' && method === 'POST') {
			store.reset();
			dispatcher.reset();
			idempotency = new Map();
			faults = noFaults();
			return [200, { reset: true }];
		}
		throw new HttpJsonError(404, 'Not found');
	}

	const server = createServer((req, res) => {
		const url = new URL(req.url ?? '/', `http://${host}`);
		const path = url.pathname;
		if (req.method !== 'GET' && req.method !== 'HEAD') res.on('finish', scheduleSave);
		const fail = (error: unknown) => {
			if (res.headersSent) return res.destroy();
			const status = error instanceof HttpJsonError || error instanceof StripeApiError ? error.status : 500;
			res
				.writeHead(status, { 'content-type': 'application/json' })
				.end(JSON.stringify({ error: { message: error instanceof Error ? error.message : String(error) } }));
		};
		if (path.startsWith('/v1/')) return void api(req, res, url).catch(fail);
		if (path.startsWith('/__standin/'))
			return void control(req, url)
				.then(([status, body]) =>
					res.writeHead(status, { 'content-type': 'application/json' }).end(JSON.stringify(body))
				)
				.catch(fail);
		const pay = path.match(/^\/c\/pay\/([A-Za-z0-9_]+)$/);
		if (pay) return void hostedCheckout(req, res, pay[1]).catch(fail);
		const setup = path.match(/^\/setup\/e\/([A-Za-z0-9_]+)\/([A-Za-z0-9_-]+)$/);
		if (setup) return void onboarding(req, res, setup[1], setup[2]).catch(fail);
		res
			.writeHead(404, { 'content-type': 'text/html; charset=utf-8' })
			.end(messagePage('Not found', 'Nothing here.', 'alert'));
	});

	async function start() {
		await new Promise<void>((resolve, reject) => {
			server.once('error', reject);
			server.listen(port, host, () => resolve());
		});
		port = (server.address() as AddressInfo).port;
	}
	await start();

	const firstSecret = () => dispatcher.endpoints[0]?.secret ?? defaultWebhookSecret;
	return {
		get port() {
			return port;
		},
		get url() {
			return publicUrl();
		},
		secretKey,
		store,
		dispatcher,
		/** What the app reads (see `src/lib/server/services/payments.ts`). */
		get env(): Record<string, string> {
			return {
				STRIPE_SECRET_KEY: secretKey,
				STRIPE_API_HOST: host,
				STRIPE_API_PORT: String(port),
				STRIPE_API_PROTOCOL: 'http',
				STRIPE_WEBHOOK_SECRET: firstSecret(),
				STRIPE_STANDIN_URL: publicUrl()
			};
		},
		setWebhooks(endpoints: WebhookEndpoint[]) {
			dispatcher.endpoints = endpoints;
		},
		/** Sends every event to this URL, signed with the stand-in's webhook secret (`env.STRIPE_WEBHOOK_SECRET`). */
		setWebhookUrl(url: string) {
			dispatcher.endpoints = [{ url, secret: defaultWebhookSecret }];
		},
		/** Writes the whole state to a file, for another stand-in to start from (`initialStateFile`). */
		saveState(file: string) {
			writeFileSync(file, snapshot(), { mode: 0o600 });
		},
		stop: () =>
			new Promise<void>((resolve) => {
				saveNow();
				dispatcher.reset();
				server.close(() => resolve());
				server.closeAllConnections();
			}),
		/** Listens again on the same port, with the state it had. */
		start
	};
}

export type StripeStandin = Awaited<ReturnType<typeof startStripeStandin>>;

/** A signing secret in Stripe's format, for a webhook endpoint. */
export function newWebhookSecret(): string {
	return `whsec_${randomBytes(24).toString('base64url')}`;
}
