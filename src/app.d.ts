import type { SessionUser } from '$lib/types/user';

declare global {
	namespace App {
		interface Error {
			message: string;
			code?: string;
		}
		interface Locals {
			user: SessionUser | null;
			/** The session belongs to a suspended account: treated as signed out. */
			suspended: boolean;
		}
	}
}

export {};
