// Augments Auth.js's session and token (this file must not be named auth.d.ts next to an auth.ts).
import '@auth/core/types';
import '@auth/core/jwt';

declare module '@auth/core/types' {
	interface Session {
		/** How this session was signed in: 'credentials' or 'nodemailer' (an emailed link). */
		signedInWith?: string;
		/** When, in milliseconds since the epoch. */
		signedInAt?: number;
		/** The session row this token belongs to; gone once the session is ended. */
		sessionId?: string;
	}
}

declare module '@auth/core/jwt' {
	interface JWT {
		signedInWith?: string;
		signedInAt?: number;
		sessionId?: string;
	}
}
