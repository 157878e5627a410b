import { hash, verify } from '@node-rs/argon2';

// OWASP's minimum recommendation for argon2id: 19 MiB memory, 2 iterations, 1 lane.
const options = { memoryCost: 19456, timeCost: 2, parallelism: 1 } as const;

export const MIN_PASSWORD_LENGTH = 10;

export function hashPassword(password: string): Promise<string> {
	return hash(password, options);
}

export async function verifyPassword(passwordHash: string, password: string): Promise<boolean> {
	try {
		return await verify(passwordHash, password);
	} catch {
		return false;
	}
}

let dummyHash: Promise<string> | null = null;

/** Spends the same time as a real check, so an unknown address answers as slowly as a known one. */
export async function verifyAgainstNothing(password: string): Promise<false> {
	dummyHash ??= hashPassword('no account has this password');
	await verifyPassword(await dummyHash, password);
	return false;
}
