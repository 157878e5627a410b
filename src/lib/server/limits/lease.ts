import { RateLimiterRes } from 'rate-limiter-flexible';
import type { Gate } from './constants';

type Lease = { left: number; until: number; blocked: boolean };

/** Takes `points` from the shared counter; resolves with what it left, rejects with RateLimiterRes when over. */
export type Take = (key: string, points: number) => Promise<RateLimiterRes>;

const maxKeys = 10_000;

/**
 * A per-key limit whose points are taken from the shared counter `size` at a time and spent in this process,
 * so that a busy caller costs one database write per `size` requests instead of one each. Every process
 * draws from the same counter in PostgreSQL, so across N processes a caller gets at most the limit plus
 * N × (size − 1) in a window (exactly the limit with one process): right for a flood guard, not for counting
 * sign-in attempts. Once the counter is spent, the key is refused here without asking again until its window
 * ends.
 */
export function leasedLimit(take: Take, { limit, size }: { limit: number; size: number }) {
	const leases = new Map<string, Lease>();
	// Concurrent requests of one key wait for the same renewal rather than each taking a lease.
	const renewing = new Map<string, Promise<Lease>>();

	function forgetExpired(now: number) {
		if (leases.size < maxKeys) return;
		for (const [key, lease] of leases) if (lease.until <= now) leases.delete(key);
		// Still full of live leases: start again rather than grow without bound.
		if (leases.size >= maxKeys) leases.clear();
	}

	async function renew(key: string, now: number): Promise<Lease> {
		try {
			const result = await take(key, size);
			return { left: size, until: now + result.msBeforeNext, blocked: false };
		} catch (reason) {
			if (!(reason instanceof RateLimiterRes)) throw reason;
			// The counter was short of a whole lease: spend what it still had, then refuse until the window ends.
			const left = Math.min(size, Math.max(0, limit - (reason.consumedPoints - size)));
			return { left, until: now + reason.msBeforeNext, blocked: left === 0 };
		}
	}

	const usable = (lease: Lease | undefined, now: number): lease is Lease =>
		Boolean(lease && lease.until > now && (lease.blocked || lease.left > 0));

	/** Spends a point of a usable lease; synchronous, so that no other request sees the point as still there. */
	function spend(lease: Lease, now: number): Gate {
		if (lease.blocked) return { allowed: false, retryAfterSeconds: Math.max(1, Math.ceil((lease.until - now) / 1000)) };
		lease.left -= 1;
		return { allowed: true };
	}

	function renewal(key: string, now: number): Promise<Lease> {
		let pending = renewing.get(key);
		if (!pending) {
			forgetExpired(now);
			pending = renew(key, now).then((lease) => {
				leases.set(key, lease);
				return lease;
			});
			renewing.set(key, pending);
			void pending.finally(() => renewing.delete(key)).catch(() => {});
		}
		return pending;
	}

	async function renewAndSpend(key: string): Promise<Gate> {
		for (;;) {
			const lease = await renewal(key, Date.now());
			// Others who waited on this renewal may have spent it already; then renew again.
			if (usable(lease, Date.now())) return spend(lease, Date.now());
		}
	}

	/** Answers at once (no promise) while the key's lease lasts; asks the shared counter when it runs out. */
	return function gate(key: string): Gate | Promise<Gate> {
		const now = Date.now();
		const held = leases.get(key);
		if (usable(held, now)) return spend(held, now);
		return renewAndSpend(key);
	};
}
