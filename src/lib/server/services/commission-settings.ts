import { env } from '$env/dynamic/private';

const defaultOpenDays = 30;

/** How many days a published commission stays open for quotes (`COMMISSION_OPEN_DAYS`, default 30). */
export function commissionOpenDays(): number {
	const days = Number(env.COMMISSION_OPEN_DAYS ?? defaultOpenDays);
	return Number.isInteger(days) && days > 0 && days <= 365 ? days : defaultOpenDays;
}
