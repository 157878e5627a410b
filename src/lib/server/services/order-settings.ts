import { env } from '$env/dynamic/private';

const defaultAutoReleaseDays = 7;

function wholeNumber(raw: string | undefined, fallback: number, { min, max }: { min: number; max: number }) {
	const value = Number(raw ?? fallback);
	return Number.isInteger(value) && value >= min && value <= max ? value : fallback;
}

/**
 * How many days after the tailor marks an order delivered the money is released on its own, when the customer
 * neither confirms nor asks for an alteration (`AUTO_RELEASE_DAYS`, default 7, from 1 to 60).
 */
export function autoReleaseDays(): number {
	return wholeNumber(env.AUTO_RELEASE_DAYS, defaultAutoReleaseDays, { min: 1, max: 60 });
}

/**
 * How the jobs that move money retry a call the processor did not answer: the first delay in seconds, doubled
 * (with jitter) on each attempt (`MONEY_RETRY_DELAY_SECONDS`, default 1), up to `MONEY_RETRY_LIMIT` attempts
 * (default 20 — the doubling makes that weeks); admins are alerted after `MONEY_ALERT_AFTER` failures (default 5).
 */
export function moneyRetry() {
	return {
		retryLimit: wholeNumber(env.MONEY_RETRY_LIMIT, 20, { min: 1, max: 100 }),
		retryDelaySeconds: wholeNumber(env.MONEY_RETRY_DELAY_SECONDS, 1, { min: 1, max: 3600 }),
		alertAfter: wholeNumber(env.MONEY_ALERT_AFTER, 5, { min: 1, max: 100 })
	};
}
