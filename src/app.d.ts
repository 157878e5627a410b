import type { SessionUser } from '$lib/types/user';
import type { Database } from '$lib/server/db/client';

declare global {
	namespace NodeJS {
		interface Process {
			/** Emitted by adapter-node after a graceful shutdown has drained requests. */
			on(event: 'sveltekit:shutdown', listener: (reason: 'SIGINT' | 'SIGTERM' | 'IDLE') => void): this;
		}
	}
	namespace App {
		interface Error {
			message: string;
			code?: string;
		}
		/** The root layout gives every page the signed-in person (or null). */
		interface PageData {
			user: SessionUser | null;
			/** Messages waiting unread for the signed-in person (0 when signed out). */
			unreadMessages?: number;
		}
		interface Locals {
			/** The database handle routes pass to domain functions (routes never import db/ themselves). */
			db: Database;
			user: SessionUser | null;
			/** The live session of the signed-in user (ended by sign-out, a password change or an admin). */
			sessionId: string | null;
			/** The session belongs to a suspended account: treated as signed out. */
			suspended: boolean;
			/** Set once the route has called requireUser/requireRole; the area gate checks it. */
			guarded: boolean;
			/** Signed in through an emailed link in the last few minutes (may reset the password). */
			recentLinkSignIn: boolean;
			/** The count of committed changes, read with the session before anything else (see freshness/). */
			dataVersion: string | null;
			/** When the session's token ends, in ms since the epoch. */
			sessionEndsAt: number | null;
			/** The answer shows work still running (a draft being nested): the kept-answers layer leaves it. */
			unkept?: boolean;
		}
	}
}

export {};
