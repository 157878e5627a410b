import { RateLimiterRes } from 'rate-limiter-flexible';
import { rateLimiter } from '../services/rate-limiter';
import * as rules from './constants';
import type { Gate, LimitRule } from './constants';
import { leasedLimit } from './lease';

export * from './constants';

const allowed: Gate = { allowed: true };

/** Takes one point from every key in one atomic step per key; refused when any key is over its limit. */
async function consume(checks: { name: string; rule: LimitRule; key: string }[]): Promise<Gate> {
	const outcomes = await Promise.allSettled(checks.map((c) => rateLimiter(c.name, c.rule).consume(c.key)));
	let retryAfterMs = 0;
	for (const outcome of outcomes) {
		if (outcome.status === 'fulfilled') continue;
		if (!(outcome.reason instanceof RateLimiterRes)) throw outcome.reason;
		retryAfterMs = Math.max(retryAfterMs, outcome.reason.msBeforeNext);
	}
	return retryAfterMs > 0
		? { allowed: false, retryAfterSeconds: Math.max(1, Math.ceil(retryAfterMs / 1000)) }
		: allowed;
}

async function forget(name: string, rule: LimitRule, key: string) {
	await rateLimiter(name, rule).delete(key);
}

const normalise = (email: string) => email.trim().toLowerCase();

export function passwordSignIn({ email, address }: { email: string; address: string }) {
	return consume([
		{ name: 'password-account', rule: rules.PASSWORD_SIGN_IN_PER_ACCOUNT, key: normalise(email) },
		{ name: 'password-address', rule: rules.PASSWORD_SIGN_IN_PER_ADDRESS, key: address }
	]);
}

/** A right password clears the account's count (the address keeps its count). */
export function passwordSignInSucceeded({ email }: { email: string }) {
	return forget('password-account', rules.PASSWORD_SIGN_IN_PER_ACCOUNT, normalise(email));
}

export function signInLink({ email, address }: { email: string; address: string }) {
	return consume([
		{ name: 'link-email', rule: rules.SIGN_IN_LINK_PER_EMAIL, key: normalise(email) },
		{ name: 'link-address', rule: rules.SIGN_IN_LINK_PER_ADDRESS, key: address }
	]);
}

export function signUp({ email, address }: { email: string; address: string }) {
	return consume([
		{ name: 'sign-up-email', rule: rules.SIGN_UP_PER_EMAIL, key: normalise(email) },
		{ name: 'sign-up-address', rule: rules.SIGN_UP_PER_ADDRESS, key: address }
	]);
}

export function passwordChange({ userId, address }: { userId: string; address: string }) {
	return consume([
		{ name: 'password-change-account', rule: rules.PASSWORD_CHANGE_PER_ACCOUNT, key: userId },
		{ name: 'password-change-address', rule: rules.PASSWORD_CHANGE_PER_ADDRESS, key: address }
	]);
}

const publicApiGate = leasedLimit(
	(key, points) => rateLimiter('api-address', rules.PUBLIC_API_PER_ADDRESS).consume(key, points),
	{ limit: rules.PUBLIC_API_PER_ADDRESS.points, size: rules.PUBLIC_API_LEASE }
);

/** The public API's flood limit for `address`: a plain answer while its lease lasts, else a promise of one. */
export function publicApi({ address }: { address: string }): Gate | Promise<Gate> {
	return publicApiGate(address);
}

/** "3 minutes" / "1 minute", for messages on forms. */
export function minutesText(seconds: number) {
	const minutes = Math.max(1, Math.ceil(seconds / 60));
	return `${minutes} minute${minutes === 1 ? '' : 's'}`;
}
