/**
 * The Stripe stand-in's state and rules, kept in memory: customers, Connect Express accounts and
 * onboarding links, Checkout Sessions and what paying them creates (PaymentIntents, Charges, balance
 * transactions), Transfers and their reversals, Refunds, the balance of the platform and of each
 * connected account, and Events. Objects are stored in Stripe's response shape; `view()` hands out copies.
 * Stripe's own fees are none here: the platform keeps exactly what it does not transfer.
 */
import { randomBytes } from 'node:crypto';
import type { FormObject, FormValue } from './stripe-form';

export type StripeObject = { id: string; object: string; created: number; [key: string]: unknown };
export type StripeEvent = StripeObject & {
	type: string;
	api_version: string;
	data: { object: StripeObject; previous_attributes?: Record<string, unknown> };
	request: { id: string | null; idempotency_key: string | null };
	pending_webhooks: number;
	account?: string;
};

/** The parameters a customer may be created or updated with. */
const customerParams = [
	'email',
	'name',
	'description',
	'phone',
	'metadata',
	'address',
	'preferred_locales',
	'shipping'
];

export class StripeApiError extends Error {
	constructor(
		readonly status: number,
		readonly type: string,
		message: string,
		readonly code?: string,
		readonly param?: string,
		readonly extra: Record<string, unknown> = {}
	) {
		super(message);
	}
	body() {
		return {
			error: {
				type: this.type,
				message: this.message,
				...(this.code ? { code: this.code } : {}),
				...(this.param ? { param: this.param } : {}),
				...(this.code ? { doc_url: `https://docs.stripe.com/error-codes/${this.code.replace(/_/g, '-')}` } : {}),
				...this.extra
			}
		};
	}
}

const invalid = (message: string, param?: string, code?: string) =>
	new StripeApiError(400, 'invalid_request_error', message, code, param);
const missing = (kind: string, id: string, param = 'id') =>
	new StripeApiError(404, 'invalid_request_error', `No such ${kind}: '${id}'`, 'resource_missing', param);

const alphabet = '0123456789ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz';
export function newId(prefix: string, length = 24): string {
	const bytes = randomBytes(length);
	let out = '';
	for (const b of bytes) out += alphabet[b % alphabet.length];
	return `${prefix}_${out}`;
}
const now = () => Math.floor(Date.now() / 1000);

// ---------- parameter reading ----------

export function checkParams(params: FormObject, allowed: string[]) {
	for (const key of Object.keys(params))
		if (!allowed.includes(key)) throw invalid(`Received unknown parameter: ${key}`, key, 'parameter_unknown');
}
function str(params: FormObject, name: string, required: true): string;
function str(params: FormObject, name: string, required?: false): string | undefined;
function str(params: FormObject, name: string, required = false): string | undefined {
	const value = params[name];
	if (value === undefined || value === '') {
		if (required) throw invalid(`Missing required param: ${name}.`, name, 'parameter_missing');
		return undefined;
	}
	if (typeof value !== 'string') throw invalid(`Invalid string: ${name}`, name, 'parameter_invalid_string');
	if (value.length > 5000) throw invalid(`Invalid string: ${name} is too long`, name, 'parameter_invalid_string');
	return value;
}
function int(params: FormObject, name: string, required: true, min?: number): number;
function int(params: FormObject, name: string, required?: false, min?: number): number | undefined;
function int(params: FormObject, name: string, required = false, min = 0): number | undefined {
	const value = str(params, name, required as false);
	if (value === undefined) return undefined;
	if (!/^-?\d+$/.test(value) || !Number.isSafeInteger(Number(value)))
		throw invalid(`Invalid integer: ${value}`, name, 'parameter_invalid_integer');
	const n = Number(value);
	if (n < min) throw invalid(`This value must be greater than or equal to ${min}.`, name, 'parameter_invalid_integer');
	return n;
}
function obj(params: FormObject, name: string): FormObject | undefined {
	const value = params[name];
	if (value === undefined || value === '') return undefined;
	if (typeof value !== 'object' || Array.isArray(value)) throw invalid(`Invalid object: ${name}`, name);
	return value;
}
function currencyParam(params: FormObject, name: string, required: true): string;
function currencyParam(params: FormObject, name: string, required?: false): string | undefined;
function currencyParam(params: FormObject, name: string, required = false) {
	const value = str(params, name, required as false);
	if (value === undefined) return undefined;
	if (!/^[a-zA-Z]{3}$/.test(value)) throw invalid(`Invalid currency: ${value}.`, name);
	return value.toLowerCase();
}
function enumParam<T extends string>(params: FormObject, name: string, values: readonly T[]): T | undefined {
	const value = str(params, name);
	if (value === undefined) return undefined;
	if (!values.includes(value as T))
		throw invalid(`Invalid ${name}: must be one of ${values.join(', ')}`, name, 'parameter_invalid_string');
	return value as T;
}
function bool(params: FormObject, name: string): boolean | undefined {
	const value = str(params, name);
	if (value === undefined) return undefined;
	if (value !== 'true' && value !== 'false') throw invalid(`Invalid boolean: ${value}`, name);
	return value === 'true';
}
/** Metadata as Stripe keeps it: up to 50 keys of 40 characters, values of 500; an empty value removes a key. */
function metadataParam(
	params: FormObject,
	name: string,
	existing: Record<string, string> = {}
): Record<string, string> {
	const value = params[name];
	if (value === undefined) return { ...existing };
	if (value === '') return {};
	if (typeof value !== 'object' || Array.isArray(value)) throw invalid(`Invalid hash`, name);
	const out = { ...existing };
	for (const [key, v] of Object.entries(value)) {
		if (typeof v !== 'string') throw invalid(`Invalid metadata value for ${key}`, `${name}[${key}]`);
		if (key.length > 40) throw invalid(`Metadata keys can have up to 40 characters.`, `${name}[${key}]`);
		if (v.length > 500) throw invalid(`Metadata values can have up to 500 characters.`, `${name}[${key}]`);
		if (v === '') delete out[key];
		else out[key] = v;
	}
	if (Object.keys(out).length > 50) throw invalid('Metadata can have up to 50 keys.', name);
	return out;
}
const asArray = (value: FormValue | undefined): FormValue[] =>
	value === undefined ? [] : Array.isArray(value) ? value : typeof value === 'object' ? Object.values(value) : [value];

// ---------- test cards ----------

export type CardOutcome =
	| { ok: true; brand: string; last4: string }
	| { ok: false; code: string; declineCode?: string; message: string; brand: string; last4: string; charge: boolean };

function luhn(digits: string) {
	let sum = 0;
	for (let i = 0; i < digits.length; i++) {
		let d = Number(digits[digits.length - 1 - i]);
		if (i % 2 === 1) d = d * 2 > 9 ? d * 2 - 9 : d * 2;
		sum += d;
	}
	return sum % 10 === 0;
}

/** Stripe's published test card numbers; any other well-formed number is declined as a live card. */
export function cardOutcome(input: string): CardOutcome {
	const digits = input.replace(/[\s-]/g, '');
	const brand = digits.startsWith('4')
		? 'visa'
		: /^(5[1-5]|2[2-7])/.test(digits)
			? 'mastercard'
			: /^3[47]/.test(digits)
				? 'amex'
				: 'unknown';
	const last4 = digits.slice(-4);
	if (!/^\d{12,19}$/.test(digits) || !luhn(digits))
		return {
			ok: false,
			code: 'incorrect_number',
			message: 'Your card number is incorrect.',
			brand,
			last4,
			charge: false
		};
	const declined = (declineCode: string, message: string, code = 'card_declined'): CardOutcome => ({
		ok: false,
		code,
		declineCode: code === 'card_declined' ? declineCode : undefined,
		message,
		brand,
		last4,
		charge: true
	});
	switch (digits) {
		case '4242424242424242':
		case '4000056655665556':
		case '5555555555554444':
		case '378282246310005':
			return { ok: true, brand, last4 };
		case '4000000000000002':
			return declined('generic_decline', 'Your card was declined.');
		case '4000000000009995':
			return declined('insufficient_funds', 'Your card has insufficient funds.');
		case '4000000000009987':
			return declined('lost_card', 'Your card was declined.');
		case '4000000000009979':
			return declined('stolen_card', 'Your card was declined.');
		case '4000000000000069':
			return declined('expired_card', 'Your card has expired.', 'expired_card');
		case '4000000000000127':
			return declined('incorrect_cvc', "Your card's security code is incorrect.", 'incorrect_cvc');
		case '4000000000000119':
			return declined(
				'processing_error',
				'An error occurred while processing your card. Try again in a little bit.',
				'processing_error'
			);
		default:
			return declined(
				'test_mode_live_card',
				'Your card was declined. Your request was in test mode, but used a non test (live) card.'
			);
	}
}

// ---------- the store ----------

type BalanceTx = StripeObject & { amount: number; currency: string; available_on: number };
type LinkToken = { account: string; refreshUrl: string; returnUrl: string; expiresAt: number; used: boolean };
type RequestContext = { id: string | null; idempotencyKey: string | null; account: string | null };

const PLATFORM = '';
const countryCurrency: Record<string, string> = {
	US: 'usd',
	GB: 'gbp',
	FR: 'eur',
	DE: 'eur',
	IE: 'eur',
	NL: 'eur',
	ES: 'eur',
	IT: 'eur',
	BE: 'eur',
	JP: 'jpy',
	CA: 'cad',
	AU: 'aud',
	NZ: 'nzd',
	CH: 'chf',
	SE: 'sek',
	NO: 'nok',
	DK: 'dkk',
	KE: 'kes',
	NG: 'ngn',
	ZA: 'zar',
	GH: 'ghs',
	IN: 'inr',
	SG: 'sgd'
};

export type StoreOptions = {
	apiVersion: string;
	/** Base URL of the stand-in, for hosted page and onboarding links. */
	publicUrl: () => string;
	/** How long a charge's funds stay pending before they are available (Stripe: days; default 0). */
	availabilityDelaySeconds?: number;
	onEvent?: (event: StripeEvent) => void;
};

export class StripeStore {
	private objects = new Map<string, StripeObject>();
	private seq = new Map<string, number>();
	private counter = 0;
	/** Which balance (platform '' or a connected account id) a balance transaction belongs to. */
	private btOwner = new Map<string, string>();
	private lineItems = new Map<string, StripeObject[]>();
	private links = new Map<string, LinkToken>();
	private events: StripeEvent[] = [];
	availabilityDelaySeconds: number;
	request: RequestContext = { id: null, idempotencyKey: null, account: null };

	constructor(private options: StoreOptions) {
		this.availabilityDelaySeconds = options.availabilityDelaySeconds ?? 0;
	}

	reset() {
		this.objects.clear();
		this.seq.clear();
		this.btOwner.clear();
		this.lineItems.clear();
		this.links.clear();
		this.events = [];
	}

	/** Everything the store holds, as JSON, for `npm start` to keep across restarts. */
	snapshot(): unknown {
		return {
			version: 1,
			counter: this.counter,
			objects: [...this.objects.values()].map((o) => [this.seq.get(o.id), o]),
			btOwner: [...this.btOwner],
			lineItems: [...this.lineItems],
			links: [...this.links],
			events: this.events.map((e) => e.id)
		};
	}
	restore(snapshot: unknown) {
		const state = snapshot as {
			version: number;
			counter: number;
			objects: [number, StripeObject][];
			btOwner: [string, string][];
			lineItems: [string, StripeObject[]][];
			links: [string, LinkToken][];
			events: string[];
		};
		if (state.version !== 1) throw new Error(`Unknown Stripe stand-in state version ${state.version}`);
		this.reset();
		this.counter = state.counter;
		for (const [seq, o] of state.objects) {
			this.objects.set(o.id, o);
			this.seq.set(o.id, seq);
		}
		this.btOwner = new Map(state.btOwner);
		this.lineItems = new Map(state.lineItems);
		this.links = new Map(state.links);
		this.events = state.events.map((id) => this.objects.get(id) as StripeEvent);
	}

	private put<T extends StripeObject>(o: T): T {
		if (!this.seq.has(o.id)) this.seq.set(o.id, ++this.counter);
		this.objects.set(o.id, o);
		return o;
	}
	private get(kind: string, object: string, id: string, param = 'id'): StripeObject {
		const o = this.objects.get(id);
		if (!o || o.object !== object) throw missing(kind, id, param);
		return o;
	}
	/** A copy in response shape, with values that depend on the clock worked out now. */
	view(o: StripeObject): StripeObject {
		const copy = structuredClone(o);
		if (o.object === 'balance_transaction')
			copy.status = (o as BalanceTx).available_on <= now() ? 'available' : 'pending';
		if (o.object === 'transfer')
			copy.reversals = this.listOf(this.reversalsOf(o.id), `/v1/transfers/${o.id}/reversals`);
		if (o.object === 'account')
			copy.external_accounts = this.listOf(
				(o.bank_accounts as StripeObject[]) ?? [],
				`/v1/accounts/${o.id}/external_accounts`
			);
		delete copy.bank_accounts;
		delete copy._pid;
		return copy;
	}
	private listOf(items: StripeObject[], url: string, hasMore = false) {
		return { object: 'list', data: items.map((i) => this.view(i)), has_more: hasMore, url };
	}
	byId(id: string): StripeObject | undefined {
		return this.objects.get(id);
	}

	/** Expands `a.b.c` paths in place: ids become objects; `line_items` and `refunds` are lists on request. */
	expand(target: Record<string, unknown>, paths: string[]) {
		for (const path of paths) this.expandPath(target, path.split('.'), path);
		return target;
	}
	private expandPath(target: Record<string, unknown>, [head, ...rest]: string[], full: string) {
		if (!head) return;
		if (target.object === 'list' && head === 'data') {
			for (const item of target.data as Record<string, unknown>[]) this.expandPath(item, rest, full);
			return;
		}
		if (target.object === 'checkout.session' && head === 'line_items')
			target.line_items = this.listOf(
				this.lineItems.get(target.id as string) ?? [],
				`/v1/checkout/sessions/${String(target.id)}/line_items`
			);
		else if (target.object === 'charge' && head === 'refunds')
			target.refunds = this.listOf(
				this.all('refund', (r) => r.charge === target.id),
				`/v1/charges/${String(target.id)}/refunds`
			);
		else {
			const value = target[head];
			if (typeof value === 'string') {
				const found = this.objects.get(value);
				if (found) target[head] = this.view(found);
			} else if (value === undefined || (value !== null && typeof value !== 'object'))
				throw invalid(`This property cannot be expanded (${full}).`, 'expand');
		}
		const next = target[head];
		if (rest.length && next && typeof next === 'object') this.expandPath(next as Record<string, unknown>, rest, full);
	}

	private all(object: string, filter: (o: StripeObject) => boolean = () => true): StripeObject[] {
		return [...this.objects.values()]
			.filter((o) => o.object === object && filter(o))
			.sort((a, b) => this.seq.get(b.id)! - this.seq.get(a.id)!);
	}

	/** A list page, newest first, with `limit`, `starting_after` and `ending_before`. */
	/**
	 * A list filtered by equality on each of `fields` the request names (`?customer=cus_…` keeps objects whose
	 * `customer` is that id); `also` narrows further and `extra` names more accepted parameters.
	 */
	listMatching(
		object: string,
		params: FormObject,
		url: string,
		fields: string[],
		{ also = () => true, extra = [] }: { also?: (o: StripeObject) => boolean; extra?: string[] } = {}
	) {
		const wanted = fields.map((field) => [field, str(params, field)] as const).filter(([, value]) => value);
		return this.list(object, params, url, (o) => also(o) && wanted.every(([field, value]) => o[field] === value), [
			...fields,
			...extra
		]);
	}
	list(object: string, params: FormObject, url: string, filter: (o: StripeObject) => boolean, extra: string[] = []) {
		checkParams(params, ['limit', 'starting_after', 'ending_before', 'created', ...extra]);
		const limit = int(params, 'limit') ?? 10;
		if (limit < 1 || limit > 100)
			throw invalid('Limit must be between 1 and 100.', 'limit', 'parameter_invalid_integer');
		let items = this.all(object, filter);
		if (typeof params.created === 'string') {
			const exact = int(params, 'created');
			items = items.filter((o) => o.created === exact);
		}
		const created = typeof params.created === 'string' ? undefined : obj(params, 'created');
		if (created) {
			for (const [op, v] of Object.entries(created)) {
				const n = Number(v);
				items = items.filter((o) =>
					op === 'gt' ? o.created > n : op === 'gte' ? o.created >= n : op === 'lt' ? o.created < n : o.created <= n
				);
			}
		}
		const after = str(params, 'starting_after');
		const before = str(params, 'ending_before');
		let page: StripeObject[];
		let hasMore: boolean;
		if (after) {
			const i = items.findIndex((o) => o.id === after);
			if (i < 0) throw missing(object, after, 'starting_after');
			page = items.slice(i + 1, i + 1 + limit);
			hasMore = items.length > i + 1 + limit;
		} else if (before) {
			const i = items.findIndex((o) => o.id === before);
			if (i < 0) throw missing(object, before, 'ending_before');
			page = items.slice(Math.max(0, i - limit), i);
			hasMore = i - limit > 0;
		} else {
			page = items.slice(0, limit);
			hasMore = items.length > limit;
		}
		return this.listOf(page, url, hasMore);
	}

	// ---------- events ----------

	private emit(type: string, object: StripeObject, previous?: Record<string, unknown>, account?: string) {
		const event: StripeEvent = {
			id: newId('evt'),
			object: 'event',
			api_version: this.options.apiVersion,
			created: now(),
			data: { object: this.view(object), ...(previous ? { previous_attributes: previous } : {}) },
			livemode: false,
			pending_webhooks: 0,
			request: { id: this.request.id, idempotency_key: this.request.idempotencyKey },
			type,
			...(account ? { account } : {})
		};
		this.events.push(event);
		this.put(event);
		this.options.onEvent?.(event);
		return event;
	}
	allEvents(): StripeEvent[] {
		return [...this.events];
	}
	listEvents(params: FormObject) {
		const type = str(params, 'type');
		const types = asArray(params.types) as string[];
		const match = (t: string) =>
			(!type || (type.endsWith('*') ? t.startsWith(type.slice(0, -1)) : t === type)) &&
			(types.length === 0 || types.includes(t));
		return this.list('event', params, '/v1/events', (e) => match((e as StripeEvent).type), [
			'type',
			'types',
			'delivery_success'
		]);
	}
	event(id: string) {
		return this.get('event', 'event', id);
	}

	// ---------- balance ----------

	private balanceTx(
		owner: string,
		amount: number,
		currency: string,
		type: string,
		source: string,
		availableOn: number,
		description: string | null = null
	) {
		const bt: BalanceTx = {
			id: newId('txn'),
			object: 'balance_transaction',
			amount,
			available_on: availableOn,
			created: now(),
			currency,
			description,
			exchange_rate: null,
			fee: 0,
			fee_details: [],
			net: amount,
			reporting_category:
				type === 'charge'
					? 'charge'
					: type === 'refund'
						? 'refund'
						: type.startsWith('transfer')
							? type === 'transfer'
								? 'transfer'
								: 'transfer_reversal'
							: 'charge',
			source,
			status: 'pending',
			type
		};
		this.btOwner.set(bt.id, owner);
		return this.put(bt);
	}
	private balanceTxs(owner: string) {
		return this.all('balance_transaction', (b) => this.btOwner.get(b.id) === owner) as BalanceTx[];
	}
	/** The platform's balance, or a connected account's (`Stripe-Account`). */
	balance(account: string | null) {
		const owner = account ?? PLATFORM;
		if (account) this.get('account', 'account', account, 'Stripe-Account');
		const t = now();
		const sums = new Map<string, { available: number; pending: number }>();
		for (const bt of this.balanceTxs(owner)) {
			const s = sums.get(bt.currency) ?? { available: 0, pending: 0 };
			if (bt.available_on <= t) s.available += bt.amount;
			else s.pending += bt.amount;
			sums.set(bt.currency, s);
		}
		if (sums.size === 0) sums.set('usd', { available: 0, pending: 0 });
		const entries = [...sums.entries()].sort(([a], [b]) => a.localeCompare(b));
		return {
			object: 'balance',
			available: entries.map(([currency, s]) => ({
				amount: s.available,
				currency,
				source_types: { card: s.available }
			})),
			pending: entries.map(([currency, s]) => ({ amount: s.pending, currency, source_types: { card: s.pending } })),
			...(account ? {} : { connect_reserved: entries.map(([currency]) => ({ amount: 0, currency })) }),
			livemode: false
		};
	}
	private available(owner: string, currency: string) {
		const t = now();
		return this.balanceTxs(owner)
			.filter((b) => b.currency === currency && b.available_on <= t)
			.reduce((sum, b) => sum + b.amount, 0);
	}
	private total(owner: string, currency: string) {
		return this.balanceTxs(owner)
			.filter((b) => b.currency === currency)
			.reduce((sum, b) => sum + b.amount, 0);
	}
	/** Makes every pending amount available now, as if the payout delay had passed. */
	settle() {
		const t = now();
		for (const o of this.objects.values())
			if (o.object === 'balance_transaction' && (o as BalanceTx).available_on > t) (o as BalanceTx).available_on = t;
	}
	listBalanceTransactions(params: FormObject, account: string | null) {
		const owner = account ?? PLATFORM;
		return this.listMatching(
			'balance_transaction',
			params,
			'/v1/balance_transactions',
			['source', 'type', 'currency'],
			{
				also: (b) => this.btOwner.get(b.id) === owner,
				extra: ['payout']
			}
		);
	}
	balanceTransaction(id: string) {
		return this.get('balance transaction', 'balance_transaction', id);
	}

	// ---------- customers ----------

	createCustomer(params: FormObject) {
		checkParams(params, customerParams);
		const customer: StripeObject = {
			id: newId('cus', 14),
			object: 'customer',
			address: obj(params, 'address') ?? null,
			balance: 0,
			created: now(),
			currency: null,
			default_source: null,
			delinquent: false,
			description: str(params, 'description') ?? null,
			email: str(params, 'email') ?? null,
			invoice_prefix: randomBytes(4).toString('hex').toUpperCase(),
			invoice_settings: { custom_fields: null, default_payment_method: null, footer: null, rendering_options: null },
			livemode: false,
			metadata: metadataParam(params, 'metadata'),
			name: str(params, 'name') ?? null,
			phone: str(params, 'phone') ?? null,
			preferred_locales: asArray(params.preferred_locales),
			shipping: obj(params, 'shipping') ?? null,
			tax_exempt: 'none',
			test_clock: null
		};
		return this.put(customer);
	}
	customer(id: string) {
		const c = this.objects.get(id);
		if (c?.object === 'customer' && c.deleted) return { id, object: 'customer', deleted: true };
		return this.get('customer', 'customer', id);
	}
	updateCustomer(id: string, params: FormObject) {
		checkParams(params, customerParams);
		const c = this.get('customer', 'customer', id);
		if (c.deleted) throw missing('customer', id);
		for (const key of ['email', 'name', 'description', 'phone'])
			if (params[key] !== undefined) c[key] = str(params, key) ?? null;
		if (params.address !== undefined) c.address = obj(params, 'address') ?? null;
		c.metadata = metadataParam(params, 'metadata', c.metadata as Record<string, string>);
		return c;
	}
	deleteCustomer(id: string) {
		const c = this.get('customer', 'customer', id);
		c.deleted = true;
		return { id, object: 'customer', deleted: true };
	}
	listCustomers(params: FormObject) {
		const email = str(params, 'email');
		return this.list('customer', params, '/v1/customers', (c) => !c.deleted && (!email || c.email === email), [
			'email'
		]);
	}

	// ---------- Connect accounts ----------

	createAccount(params: FormObject) {
		checkParams(params, [
			'type',
			'country',
			'email',
			'business_type',
			'capabilities',
			'metadata',
			'business_profile',
			'default_currency',
			'controller',
			'individual',
			'company',
			'settings',
			'tos_acceptance'
		]);
		const controller = obj(params, 'controller');
		const type = enumParam(params, 'type', ['express', 'standard', 'custom'] as const);
		if (!type && !controller) throw invalid('Missing required param: type.', 'type', 'parameter_missing');
		if (type && type !== 'express')
			throw invalid(`This stand-in supports Express accounts only, not '${type}'.`, 'type', 'parameter_invalid_string');
		const country = (str(params, 'country') ?? 'US').toUpperCase();
		if (!/^[A-Z]{2}$/.test(country))
			throw invalid(`Country '${country}' is unknown.`, 'country', 'country_unsupported');
		const requested = obj(params, 'capabilities') ?? {};
		const capabilities: Record<string, string> = {};
		for (const [name, value] of Object.entries(requested)) {
			if (!['transfers', 'card_payments'].includes(name))
				throw invalid(`Received unknown capability: ${name}`, `capabilities[${name}]`, 'parameter_unknown');
			if (typeof value === 'object' && !Array.isArray(value) && value.requested === 'true')
				capabilities[name] = 'inactive';
		}
		if (!capabilities.transfers) capabilities.transfers = 'inactive';
		const due = [
			'business_type',
			'external_account',
			'individual.first_name',
			'individual.last_name',
			'tos_acceptance.date',
			'tos_acceptance.ip'
		];
		const account: StripeObject = {
			id: newId('acct', 16),
			object: 'account',
			business_profile: {
				mcc: null,
				name: null,
				product_description: null,
				support_email: null,
				support_phone: null,
				url: null,
				...(obj(params, 'business_profile') ?? {})
			},
			business_type: str(params, 'business_type') ?? null,
			capabilities,
			charges_enabled: false,
			controller: {
				fees: { payer: 'application' },
				is_controller: true,
				losses: { payments: 'application' },
				requirement_collection: 'stripe',
				stripe_dashboard: { type: 'express' },
				type: 'application'
			},
			country,
			created: now(),
			default_currency: currencyParam(params, 'default_currency') ?? countryCurrency[country] ?? 'usd',
			details_submitted: false,
			email: str(params, 'email') ?? null,
			bank_accounts: [],
			future_requirements: {
				alternatives: [],
				current_deadline: null,
				currently_due: [],
				disabled_reason: null,
				errors: [],
				eventually_due: [],
				past_due: [],
				pending_verification: []
			},
			metadata: metadataParam(params, 'metadata'),
			payouts_enabled: false,
			requirements: {
				alternatives: [],
				current_deadline: null,
				currently_due: due,
				disabled_reason: 'requirements.past_due',
				errors: [],
				eventually_due: due,
				past_due: due,
				pending_verification: []
			},
			settings: {
				payouts: {
					debit_negative_balances: true,
					schedule: { delay_days: 2, interval: 'daily' },
					statement_descriptor: null
				}
			},
			tos_acceptance: { date: null, ip: null, user_agent: null },
			type: 'express'
		};
		return this.put(account);
	}
	account(id: string) {
		const a = this.objects.get(id);
		if (a?.object === 'account' && a.deleted) throw missing('account', id);
		return this.get('account', 'account', id);
	}
	updateAccount(id: string, params: FormObject) {
		checkParams(params, ['email', 'metadata', 'business_profile', 'business_type', 'default_currency', 'settings']);
		const a = this.account(id);
		const before = { email: a.email, metadata: a.metadata };
		if (params.email !== undefined) a.email = str(params, 'email') ?? null;
		if (params.business_type !== undefined) a.business_type = str(params, 'business_type') ?? null;
		if (params.business_profile !== undefined)
			a.business_profile = { ...(a.business_profile as object), ...(obj(params, 'business_profile') ?? {}) };
		a.metadata = metadataParam(params, 'metadata', a.metadata as Record<string, string>);
		this.emit('account.updated', a, before, a.id);
		return a;
	}
	deleteAccount(id: string) {
		const a = this.account(id);
		a.deleted = true;
		return { id, object: 'account', deleted: true };
	}
	listAccounts(params: FormObject) {
		return this.list('account', params, '/v1/accounts', (a) => !a.deleted);
	}

	createAccountLink(params: FormObject) {
		checkParams(params, ['account', 'type', 'refresh_url', 'return_url', 'collect', 'collection_options']);
		const accountId = str(params, 'account', true);
		const type = enumParam(params, 'type', ['account_onboarding', 'account_update'] as const);
		if (!type) throw invalid('Missing required param: type.', 'type', 'parameter_missing');
		const a = this.get('account', 'account', accountId, 'account');
		if (a.deleted) throw missing('account', accountId, 'account');
		const returnUrl = str(params, 'return_url', true);
		const refreshUrl = str(params, 'refresh_url', true);
		for (const [name, value] of [
			['return_url', returnUrl],
			['refresh_url', refreshUrl]
		] as const)
			if (!URL.canParse(value)) throw invalid(`Not a valid URL`, name, 'url_invalid');
		const token = randomBytes(18).toString('base64url');
		const created = now();
		this.links.set(token, { account: accountId, refreshUrl, returnUrl, expiresAt: created + 300, used: false });
		return {
			object: 'account_link',
			created,
			expires_at: created + 300,
			url: `${this.options.publicUrl()}/setup/e/${accountId}/${token}`
		};
	}
	/** The onboarding link behind a URL, or null when it is used or expired (Stripe then sends people to `refresh_url`). */
	link(account: string, token: string): (LinkToken & { valid: boolean }) | null {
		const link = this.links.get(token);
		if (!link || link.account !== account) return null;
		return { ...link, valid: !link.used && link.expiresAt > now() };
	}
	/** Finishes onboarding through a link: details submitted, capabilities active, charges and payouts enabled. */
	completeOnboarding(token: string, details: { name: string; complete: boolean }) {
		const link = this.links.get(token);
		if (!link || link.used || link.expiresAt <= now()) return null;
		link.used = true;
		const a = this.account(link.account);
		const previous = {
			charges_enabled: a.charges_enabled,
			payouts_enabled: a.payouts_enabled,
			details_submitted: a.details_submitted,
			capabilities: structuredClone(a.capabilities),
			requirements: structuredClone(a.requirements)
		};
		if (details.name) a.business_profile = { ...(a.business_profile as object), name: details.name };
		if (details.complete) {
			const capabilities = a.capabilities as Record<string, string>;
			for (const key of Object.keys(capabilities)) capabilities[key] = 'active';
			a.charges_enabled = true;
			a.payouts_enabled = true;
			a.details_submitted = true;
			a.tos_acceptance = { date: now(), ip: '127.0.0.1', user_agent: null };
			a.requirements = {
				alternatives: [],
				current_deadline: null,
				currently_due: [],
				disabled_reason: null,
				errors: [],
				eventually_due: [],
				past_due: [],
				pending_verification: []
			};
			if ((a.bank_accounts as StripeObject[]).length === 0)
				(a.bank_accounts as StripeObject[]).push({
					id: newId('ba'),
					object: 'bank_account',
					account: a.id,
					bank_name: 'STRIPE TEST BANK',
					country: a.country,
					currency: a.default_currency,
					default_for_currency: true,
					last4: '6789',
					status: 'new',
					created: now()
				});
		} else a.details_submitted = true;
		this.emit('account.updated', a, previous, a.id);
		return link;
	}

	// ---------- Checkout Sessions ----------

	createCheckoutSession(params: FormObject) {
		checkParams(params, [
			'mode',
			'line_items',
			'success_url',
			'cancel_url',
			'customer',
			'customer_email',
			'metadata',
			'payment_intent_data',
			'client_reference_id',
			'expires_at',
			'locale',
			'submit_type',
			'payment_method_types',
			'currency',
			'billing_address_collection',
			'customer_creation',
			'allow_promotion_codes',
			'ui_mode',
			'custom_text'
		]);
		const mode = str(params, 'mode', true);
		if (mode !== 'payment')
			throw invalid(`This stand-in supports mode 'payment' only, not '${mode}'.`, 'mode', 'parameter_invalid_string');
		const ui = str(params, 'ui_mode');
		if (ui && ui !== 'hosted') throw invalid(`Only the hosted ui_mode is supported.`, 'ui_mode');
		const successUrl = str(params, 'success_url', true);
		const cancelUrl = str(params, 'cancel_url') ?? null;
		for (const [name, value] of [
			['success_url', successUrl],
			['cancel_url', cancelUrl]
		] as const)
			if (value !== null && !URL.canParse(value.replace('{CHECKOUT_SESSION_ID}', 'x')))
				throw invalid(`Not a valid URL`, name, 'url_invalid');
		const customer = str(params, 'customer');
		const customerEmail = str(params, 'customer_email');
		if (customer && customerEmail)
			throw invalid('You may only specify one of these parameters: customer, customer_email.', 'customer_email');
		if (customer) this.get('customer', 'customer', customer, 'customer');
		const rawItems = asArray(params.line_items);
		if (rawItems.length === 0) throw invalid('Missing required param: line_items.', 'line_items', 'parameter_missing');
		const sessionId = newId('cs_test', 58);
		let currency: string | null = null;
		const items = rawItems.map((raw, i) => {
			const name = `line_items[${i}]`;
			if (typeof raw !== 'object' || Array.isArray(raw)) throw invalid('Invalid line item', name);
			checkParams(raw, ['price_data', 'quantity', 'price', 'adjustable_quantity', 'tax_rates']);
			if (raw.price) throw missing('price', JSON.stringify(raw.price), `${name}[price]`);
			const priceData = obj(raw, 'price_data');
			if (!priceData)
				throw invalid(`Missing required param: ${name}[price_data].`, `${name}[price_data]`, 'parameter_missing');
			checkParams(priceData, [
				'currency',
				'unit_amount',
				'unit_amount_decimal',
				'product_data',
				'product',
				'tax_behavior'
			]);
			const itemCurrency = currencyParam(priceData, 'currency', true);
			if (currency && currency !== itemCurrency)
				throw invalid('All line items must use the same currency.', `${name}[price_data][currency]`);
			currency = itemCurrency;
			const unitAmount = int(priceData, 'unit_amount', true, 0);
			const quantity = int(raw, 'quantity', true, 1);
			const productData = obj(priceData, 'product_data');
			const productName = productData ? str(productData, 'name') : undefined;
			if (!productName)
				throw invalid(
					`Missing required param: ${name}[price_data][product_data][name].`,
					`${name}[price_data][product_data][name]`,
					'parameter_missing'
				);
			const amount = unitAmount * quantity;
			return {
				id: newId('li', 24),
				object: 'item',
				amount_discount: 0,
				amount_subtotal: amount,
				amount_tax: 0,
				amount_total: amount,
				created: now(),
				currency: itemCurrency,
				description: productName,
				price: {
					id: newId('price'),
					object: 'price',
					active: false,
					billing_scheme: 'per_unit',
					created: now(),
					currency: itemCurrency,
					livemode: false,
					lookup_key: null,
					metadata: {},
					nickname: null,
					product: newId('prod', 14),
					recurring: null,
					tax_behavior: 'unspecified',
					type: 'one_time',
					unit_amount: unitAmount,
					unit_amount_decimal: String(unitAmount)
				},
				quantity
			} satisfies StripeObject;
		});
		const total = items.reduce((sum, i) => sum + i.amount_total, 0);
		// Stripe's three-decimal currencies charge whole tens of the minor unit.
		if (currency && ['bhd', 'jod', 'kwd', 'omr', 'tnd'].includes(currency) && total % 10 !== 0)
			throw invalid(
				`Amounts in ${(currency as string).toUpperCase()} must end in 0 (whole tens of the minor unit).`,
				'line_items',
				'invalid_amount'
			);
		if (total < 1)
			throw invalid('The Checkout Session total must be greater than zero.', 'line_items', 'amount_too_small');
		const pid = obj(params, 'payment_intent_data') ?? {};
		checkParams(pid, [
			'transfer_group',
			'metadata',
			'description',
			'receipt_email',
			'statement_descriptor',
			'statement_descriptor_suffix',
			'capture_method',
			'setup_future_usage'
		]);
		const capture = str(pid, 'capture_method');
		if (capture && capture !== 'automatic' && capture !== 'automatic_async')
			throw invalid('Only automatic capture is supported by this stand-in.', 'payment_intent_data[capture_method]');
		const created = now();
		const expiresAt = int(params, 'expires_at') ?? created + 24 * 3600;
		if (expiresAt < created + 30 * 60 - 5 || expiresAt > created + 24 * 3600 + 5)
			throw invalid(
				'The `expires_at` timestamp must be between 30 minutes and 24 hours from Checkout Session creation.',
				'expires_at'
			);
		const session: StripeObject = {
			id: sessionId,
			object: 'checkout.session',
			after_expiration: null,
			allow_promotion_codes: null,
			amount_subtotal: total,
			amount_total: total,
			automatic_tax: { enabled: false, liability: null, status: null },
			billing_address_collection: str(params, 'billing_address_collection') ?? null,
			cancel_url: cancelUrl,
			client_reference_id: str(params, 'client_reference_id') ?? null,
			created,
			currency,
			customer: customer ?? null,
			customer_creation: customer ? null : 'if_required',
			customer_details: null,
			customer_email: customerEmail ?? null,
			expires_at: expiresAt,
			livemode: false,
			locale: str(params, 'locale') ?? null,
			metadata: metadataParam(params, 'metadata'),
			mode: 'payment',
			payment_intent: null,
			payment_link: null,
			payment_method_types: ['card'],
			payment_status: 'unpaid',
			status: 'open',
			submit_type: str(params, 'submit_type') ?? null,
			success_url: successUrl,
			total_details: { amount_discount: 0, amount_shipping: 0, amount_tax: 0 },
			ui_mode: 'hosted',
			url: `${this.options.publicUrl()}/c/pay/${sessionId}`,
			// Kept for the PaymentIntent made when the customer pays; not part of Stripe's response.
			_pid: {
				transfer_group: str(pid, 'transfer_group') ?? null,
				metadata: metadataParam(pid, 'metadata'),
				description: str(pid, 'description') ?? null,
				receipt_email: str(pid, 'receipt_email') ?? null
			}
		};
		this.lineItems.set(sessionId, items);
		return this.put(session);
	}
	/** A session, expired first if its time has passed. */
	checkoutSession(id: string) {
		const s = this.get('checkout session', 'checkout.session', id);
		if (s.status === 'open' && (s.expires_at as number) <= now()) this.expireSessionNow(s);
		return s;
	}
	private expireSessionNow(s: StripeObject) {
		s.status = 'expired';
		this.emit('checkout.session.expired', s);
	}
	expireCheckoutSession(id: string) {
		const s = this.checkoutSession(id);
		if (s.status !== 'open')
			throw invalid(
				`Only Checkout Sessions with a status in ["open"] can be expired. This Checkout Session has a status of "${String(s.status)}".`,
				undefined,
				'checkout_session_not_open'
			);
		this.expireSessionNow(s);
		return s;
	}
	listCheckoutSessions(params: FormObject) {
		return this.listMatching(
			'checkout.session',
			params,
			'/v1/checkout/sessions',
			['payment_intent', 'customer', 'status'],
			{
				extra: ['customer_details']
			}
		);
	}
	sessionLineItems(id: string, params: FormObject) {
		this.checkoutSession(id);
		const items = this.lineItems.get(id) ?? [];
		checkParams(params, ['limit', 'starting_after', 'ending_before']);
		return this.listOf(items, `/v1/checkout/sessions/${id}/line_items`);
	}
	/** The e-mail a session already knows: `customer_email`, or its customer's. */
	sessionEmail(s: StripeObject): string | null {
		if (typeof s.customer_email === 'string') return s.customer_email;
		const customer = typeof s.customer === 'string' ? this.objects.get(s.customer) : undefined;
		return typeof customer?.email === 'string' ? customer.email : null;
	}
	lineItemsOf(id: string) {
		return (this.lineItems.get(id) ?? []).map((i) => this.view(i));
	}

	/**
	 * One payment attempt on the hosted page. Success completes the session (charge, PaymentIntent
	 * succeeded, balance credited); a decline leaves it open for another try.
	 */
	payCheckoutSession(id: string, card: string, email: string | null): { ok: true } | { ok: false; message: string } {
		const s = this.checkoutSession(id);
		if (s.status !== 'open') return { ok: false, message: `This checkout is ${String(s.status)}.` };
		const outcome = cardOutcome(card);
		if (!outcome.ok && !outcome.charge) return { ok: false, message: outcome.message };
		const extra = s._pid as {
			transfer_group: string | null;
			metadata: Record<string, string>;
			description: string | null;
			receipt_email: string | null;
		};
		const customerEmail = this.sessionEmail(s) ?? email;
		let pi = s.payment_intent ? this.get('payment intent', 'payment_intent', s.payment_intent as string) : null;
		if (!pi) {
			pi = this.put({
				id: newId('pi'),
				object: 'payment_intent',
				amount: s.amount_total,
				amount_capturable: 0,
				amount_details: { tip: {} },
				amount_received: 0,
				application: null,
				application_fee_amount: null,
				automatic_payment_methods: null,
				canceled_at: null,
				cancellation_reason: null,
				capture_method: 'automatic',
				client_secret: `${newId('pi')}_secret_${randomBytes(12).toString('base64url')}`,
				confirmation_method: 'automatic',
				created: now(),
				currency: s.currency,
				customer: s.customer,
				description: extra.description,
				last_payment_error: null,
				latest_charge: null,
				livemode: false,
				metadata: { ...extra.metadata },
				next_action: null,
				on_behalf_of: null,
				payment_method: null,
				payment_method_types: ['card'],
				receipt_email: extra.receipt_email ?? customerEmail,
				setup_future_usage: null,
				shipping: null,
				statement_descriptor: null,
				status: 'requires_payment_method',
				transfer_data: null,
				transfer_group: extra.transfer_group
			});
			s.payment_intent = pi.id;
			this.emit('payment_intent.created', pi);
		}
		const paymentMethod = newId('pm');
		const chargeAmount = pi.amount as number;
		const charge = this.put({
			id: newId('ch'),
			object: 'charge',
			amount: chargeAmount,
			amount_captured: outcome.ok ? chargeAmount : 0,
			amount_refunded: 0,
			application: null,
			application_fee: null,
			application_fee_amount: null,
			balance_transaction: null as string | null,
			billing_details: { address: null, email: customerEmail, name: null, phone: null },
			calculated_statement_descriptor: 'TACKLINE',
			captured: outcome.ok,
			created: now(),
			currency: pi.currency,
			customer: pi.customer,
			description: pi.description,
			disputed: false,
			failure_balance_transaction: null as string | null,
			failure_code: outcome.ok ? null : outcome.code,
			failure_message: outcome.ok ? null : outcome.message,
			fraud_details: {},
			livemode: false,
			metadata: { ...(pi.metadata as Record<string, string>) },
			on_behalf_of: null,
			outcome: outcome.ok
				? {
						network_status: 'approved_by_network',
						reason: null,
						risk_level: 'normal',
						risk_score: 20,
						seller_message: 'Payment complete.',
						type: 'authorized'
					}
				: {
						network_status: 'declined_by_network',
						reason: outcome.declineCode ?? outcome.code,
						risk_level: 'normal',
						risk_score: 20,
						seller_message: 'The bank did not return any further details with this decline.',
						type: 'issuer_declined'
					},
			paid: outcome.ok,
			payment_intent: pi.id,
			payment_method: paymentMethod,
			payment_method_details: {
				card: {
					brand: outcome.brand,
					checks: { address_line1_check: null, address_postal_code_check: null, cvc_check: 'pass' },
					country: 'US',
					exp_month: 12,
					exp_year: new Date().getUTCFullYear() + 3,
					funding: 'credit',
					last4: outcome.last4,
					network: outcome.brand
				},
				type: 'card'
			},
			receipt_email: pi.receipt_email,
			receipt_url: null,
			refunded: false,
			review: null,
			shipping: null,
			source_transfer: null,
			statement_descriptor: null,
			status: outcome.ok ? 'succeeded' : 'failed',
			transfer_data: null,
			transfer_group: pi.transfer_group
		});
		const piBefore = { status: pi.status, latest_charge: pi.latest_charge };
		pi.latest_charge = charge.id;
		pi.payment_method = paymentMethod;
		if (!outcome.ok) {
			pi.status = 'requires_payment_method';
			pi.last_payment_error = {
				type: 'card_error',
				code: outcome.code,
				...(outcome.declineCode ? { decline_code: outcome.declineCode } : {}),
				message: outcome.message,
				charge: charge.id,
				doc_url: `https://docs.stripe.com/error-codes/${outcome.code.replace(/_/g, '-')}`,
				payment_method: {
					id: paymentMethod,
					object: 'payment_method',
					type: 'card',
					card: { brand: outcome.brand, last4: outcome.last4 }
				}
			};
			this.emit('charge.failed', charge);
			this.emit('payment_intent.payment_failed', pi, piBefore);
			return { ok: false, message: outcome.message };
		}
		const bt = this.balanceTx(
			PLATFORM,
			chargeAmount,
			charge.currency as string,
			'charge',
			charge.id,
			now() + this.availabilityDelaySeconds,
			pi.description as string | null
		);
		charge.balance_transaction = bt.id;
		pi.status = 'succeeded';
		pi.amount_received = chargeAmount;
		pi.last_payment_error = null;
		s.status = 'complete';
		s.payment_status = 'paid';
		s.customer_details = {
			address: null,
			email: customerEmail,
			name: null,
			phone: null,
			tax_exempt: 'none',
			tax_ids: []
		};
		this.emit('charge.succeeded', charge);
		this.emit('payment_intent.succeeded', pi, piBefore);
		this.emit('checkout.session.completed', s);
		return { ok: true };
	}

	// ---------- PaymentIntents and Charges ----------

	paymentIntent(id: string) {
		return this.get('payment_intent', 'payment_intent', id);
	}
	listPaymentIntents(params: FormObject) {
		return this.listMatching('payment_intent', params, '/v1/payment_intents', ['customer']);
	}
	charge(id: string) {
		return this.get('charge', 'charge', id);
	}
	listCharges(params: FormObject) {
		return this.listMatching('charge', params, '/v1/charges', ['payment_intent', 'transfer_group', 'customer']);
	}

	// ---------- Transfers and reversals ----------

	private reversalsOf(transferId: string) {
		return this.all('transfer_reversal', (r) => r.transfer === transferId).reverse();
	}
	/** What is left of a charge to transfer: its amount less refunds and transfers from it (net of reversals). */
	private transferableFrom(charge: StripeObject) {
		const transferred = this.all('transfer', (t) => t.source_transaction === charge.id).reduce(
			(sum, t) => sum + (t.amount as number) - (t.amount_reversed as number),
			0
		);
		return (charge.amount as number) - (charge.amount_refunded as number) - transferred;
	}

	createTransfer(params: FormObject) {
		checkParams(params, [
			'amount',
			'currency',
			'destination',
			'source_transaction',
			'transfer_group',
			'metadata',
			'description',
			'source_type'
		]);
		const amount = int(params, 'amount', true, 1);
		const currency = currencyParam(params, 'currency', true);
		const destination = str(params, 'destination', true);
		const dest = this.objects.get(destination);
		if (!dest || dest.object !== 'account' || dest.deleted) throw missing('destination', destination, 'destination');
		if ((dest.capabilities as Record<string, string>).transfers !== 'active')
			throw invalid(
				'Your destination account needs to have at least one of the following capabilities enabled: transfers, crypto_transfers, legacy_payments',
				'destination',
				'insufficient_capabilities_for_transfer'
			);
		const sourceId = str(params, 'source_transaction');
		let availableOn = now();
		if (sourceId) {
			const source = this.objects.get(sourceId);
			if (!source || source.object !== 'charge') throw missing('charge', sourceId, 'source_transaction');
			if (source.status !== 'succeeded')
				throw invalid(`The source_transaction ${sourceId} has not succeeded.`, 'source_transaction');
			if (source.currency !== currency)
				throw invalid(
					`The currency of source_transaction's balance transaction (${String(source.currency)}) must be the same as the transfer currency (${currency})`,
					'currency'
				);
			const left = this.transferableFrom(source);
			if (amount > left)
				throw invalid(
					`Amount must be no more than ${left} (what is left of source transaction ${sourceId}).`,
					'amount',
					'amount_too_large'
				);
			const sourceBt = this.objects.get(source.balance_transaction as string) as BalanceTx;
			availableOn = Math.max(now(), sourceBt.available_on);
		} else if (this.available(PLATFORM, currency) < amount) {
			throw invalid(
				'You have insufficient available funds in your Stripe account. Try adding funds directly to your available balance by creating Charges using the 4000000000000077 test card.',
				undefined,
				'balance_insufficient'
			);
		}
		const transfer = this.put({
			id: newId('tr'),
			object: 'transfer',
			amount,
			amount_reversed: 0,
			balance_transaction: null as string | null,
			created: now(),
			currency,
			description: str(params, 'description') ?? null,
			destination,
			destination_payment: newId('py'),
			livemode: false,
			metadata: metadataParam(params, 'metadata'),
			reversed: false,
			source_transaction: sourceId ?? null,
			source_type: 'card',
			transfer_group: str(params, 'transfer_group') ?? null
		});
		const bt = this.balanceTx(PLATFORM, -amount, currency, 'transfer', transfer.id, availableOn);
		transfer.balance_transaction = bt.id;
		this.balanceTx(destination, amount, currency, 'payment', String(transfer.destination_payment), availableOn);
		this.emit('transfer.created', transfer);
		return transfer;
	}
	transfer(id: string) {
		return this.get('transfer', 'transfer', id);
	}
	updateTransfer(id: string, params: FormObject) {
		checkParams(params, ['metadata', 'description']);
		const t = this.transfer(id);
		if (params.description !== undefined) t.description = str(params, 'description') ?? null;
		t.metadata = metadataParam(params, 'metadata', t.metadata as Record<string, string>);
		this.emit('transfer.updated', t);
		return t;
	}
	listTransfers(params: FormObject) {
		return this.listMatching('transfer', params, '/v1/transfers', ['destination', 'transfer_group']);
	}
	createReversal(transferId: string, params: FormObject) {
		checkParams(params, ['amount', 'metadata', 'description', 'refund_application_fee']);
		const t = this.transfer(transferId);
		const left = (t.amount as number) - (t.amount_reversed as number);
		if (left === 0)
			throw invalid(`Transfer ${t.id} has already been fully reversed.`, undefined, 'transfer_already_reversed');
		const amount = int(params, 'amount', false, 1) ?? left;
		if (amount > left)
			throw invalid(
				`You have attempted to reverse more than the amount of the transfer that has not been reversed (${left}).`,
				'amount',
				'amount_too_large'
			);
		const currency = t.currency as string;
		if (this.total(t.destination as string, currency) < amount)
			throw invalid(
				`The destination account does not have enough ${currency} to cover this reversal.`,
				undefined,
				'balance_insufficient'
			);
		const transferBt = this.objects.get(t.balance_transaction as string) as BalanceTx;
		const availableOn = Math.max(now(), transferBt.available_on);
		const reversal = this.put({
			id: newId('trr'),
			object: 'transfer_reversal',
			amount,
			balance_transaction: null as string | null,
			created: now(),
			currency,
			destination_payment_refund: newId('pyr'),
			metadata: metadataParam(params, 'metadata'),
			source_refund: null,
			transfer: t.id
		});
		reversal.balance_transaction = this.balanceTx(
			PLATFORM,
			amount,
			currency,
			'transfer_refund',
			reversal.id,
			availableOn
		).id;
		this.balanceTx(
			t.destination as string,
			-amount,
			currency,
			'payment_refund',
			String(reversal.destination_payment_refund),
			availableOn
		);
		const previous = { amount_reversed: t.amount_reversed, reversed: t.reversed };
		t.amount_reversed = (t.amount_reversed as number) + amount;
		t.reversed = t.amount_reversed === t.amount;
		this.emit('transfer.reversed', t, previous);
		return reversal;
	}
	reversal(transferId: string, id: string) {
		const r = this.get('transfer reversal', 'transfer_reversal', id);
		if (r.transfer !== transferId) throw missing('transfer reversal', id);
		return r;
	}
	listReversals(transferId: string, params: FormObject) {
		this.transfer(transferId);
		return this.list(
			'transfer_reversal',
			params,
			`/v1/transfers/${transferId}/reversals`,
			(r) => r.transfer === transferId
		);
	}

	// ---------- Refunds ----------

	createRefund(params: FormObject) {
		checkParams(params, [
			'payment_intent',
			'charge',
			'amount',
			'reason',
			'metadata',
			'refund_application_fee',
			'reverse_transfer',
			'instructions_email'
		]);
		const piId = str(params, 'payment_intent');
		const chargeId = str(params, 'charge');
		if (!piId && !chargeId)
			throw invalid(
				'One of the following params should be provided for this request: payment_intent or charge.',
				'payment_intent',
				'parameter_missing'
			);
		if (bool(params, 'reverse_transfer'))
			throw invalid(
				'reverse_transfer applies to destination charges only; create a transfer reversal instead.',
				'reverse_transfer'
			);
		let charge: StripeObject;
		if (chargeId) {
			charge = this.get('charge', 'charge', chargeId, 'charge');
			if (piId && charge.payment_intent !== piId)
				throw invalid('The charge does not belong to that PaymentIntent.', 'charge');
		} else {
			const pi = this.get('payment_intent', 'payment_intent', piId!, 'payment_intent');
			if (pi.status !== 'succeeded' || !pi.latest_charge)
				throw invalid(
					`This PaymentIntent (${pi.id}) does not have a successful charge to refund.`,
					'payment_intent',
					'charge_not_refundable'
				);
			charge = this.get('charge', 'charge', pi.latest_charge as string);
		}
		if (charge.status !== 'succeeded')
			throw invalid(`Charge ${charge.id} has not succeeded and cannot be refunded.`, 'charge', 'charge_not_refundable');
		const left = (charge.amount as number) - (charge.amount_refunded as number);
		if (left === 0)
			throw invalid(`Charge ${charge.id} has already been refunded.`, undefined, 'charge_already_refunded');
		const amount = int(params, 'amount', false, 1) ?? left;
		if (amount > left)
			throw invalid(
				`Refund amount (${amount}) is greater than unrefunded amount on charge (${left})`,
				'amount',
				'amount_too_large'
			);
		const reason = enumParam(params, 'reason', ['duplicate', 'fraudulent', 'requested_by_customer'] as const);
		const refund = this.put({
			id: newId('re'),
			object: 'refund',
			amount,
			balance_transaction: null as string | null,
			charge: charge.id,
			created: now(),
			currency: charge.currency,
			destination_details: {
				card: { reference_status: 'pending', reference_type: 'acquirer_reference_number', type: 'refund' },
				type: 'card'
			},
			metadata: metadataParam(params, 'metadata'),
			payment_intent: charge.payment_intent,
			reason: reason ?? null,
			receipt_number: null,
			source_transfer_reversal: null,
			status: 'succeeded',
			transfer_reversal: null
		});
		refund.balance_transaction = this.balanceTx(
			PLATFORM,
			-amount,
			charge.currency as string,
			'refund',
			refund.id,
			now()
		).id;
		const previous = { amount_refunded: charge.amount_refunded, refunded: charge.refunded };
		charge.amount_refunded = (charge.amount_refunded as number) + amount;
		charge.refunded = charge.amount_refunded === charge.amount;
		this.emit('refund.created', refund);
		this.emit('charge.refunded', charge, previous);
		return refund;
	}
	refund(id: string) {
		return this.get('refund', 'refund', id);
	}
	updateRefund(id: string, params: FormObject) {
		checkParams(params, ['metadata']);
		const r = this.refund(id);
		r.metadata = metadataParam(params, 'metadata', r.metadata as Record<string, string>);
		return r;
	}
	listRefunds(params: FormObject) {
		return this.listMatching('refund', params, '/v1/refunds', ['charge', 'payment_intent']);
	}
}
