import { env } from '$env/dynamic/private';

const defaultBasisPoints = 1000;

/**
 * The platform fee rate in basis points, from `PLATFORM_FEE_PERCENT` (default 10, up to two decimals, 0–50).
 * Read as a decimal string so that "12.5" is exactly 1250 and never passes through a float.
 */
export function platformFeeBasisPoints(): number {
	const raw = env.PLATFORM_FEE_PERCENT?.trim();
	if (!raw) return defaultBasisPoints;
	const match = /^(\d{1,2})(?:\.(\d{1,2}))?$/.exec(raw);
	if (!match) return defaultBasisPoints;
	const basisPoints = Number(match[1]) * 100 + Number((match[2] ?? '').padEnd(2, '0'));
	return basisPoints <= 5000 ? basisPoints : defaultBasisPoints;
}
