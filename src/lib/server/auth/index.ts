import { DrizzleAdapter } from '@auth/drizzle-adapter';
import { AuthError, CredentialsSignin, SvelteKitAuth } from '@auth/sveltekit';
import Credentials from '@auth/sveltekit/providers/credentials';
import Nodemailer from '@auth/sveltekit/providers/nodemailer';
import { env } from '$env/dynamic/private';
import { db } from '../db';
import { account, session, user, verificationToken } from '../db/schema';
import * as accounts from '../accounts';
import { passwordSignIn } from '../accounts/schemas';
import { SIGN_IN_LINK_LIFETIME_SECONDS } from '../limits/constants';
import { onPublicOrigin, publicOrigin } from './origin';

export class AccountSuspended extends CredentialsSignin {
	code = 'suspended';
}

export const SESSION_MAX_AGE_SECONDS = 30 * 24 * 60 * 60;

export const { handle, signIn, signOut } = SvelteKitAuth(() =>
	Promise.resolve({
		adapter: DrizzleAdapter(db, {
			usersTable: user,
			accountsTable: account,
			sessionsTable: session,
			verificationTokensTable: verificationToken
		}),
		// Credentials sign-in requires JWT sessions; each token names a session row (accounts/sessions.ts),
		// and hooks re-read the user and that row on every request, so sessions can be ended.
		session: { strategy: 'jwt', maxAge: SESSION_MAX_AGE_SECONDS },
		// Requests reach Auth.js only from our own form actions (see ./endpoints.ts), which pin the host.
		trustHost: true,
		secret: env.AUTH_SECRET,
		basePath: '/auth',
		pages: { signIn: '/sign-in', signOut: '/sign-out', error: '/sign-in', verifyRequest: '/sign-in' },
		// Wrong passwords and stale links are expected outcomes, answered on the page; log them briefly.
		logger: {
			error(error) {
				if (error instanceof CredentialsSignin) return;
				if (error instanceof AuthError && error.type === 'Verification') {
					console.warn('[auth] an expired or already used sign-in link was opened');
					return;
				}
				console.error('[auth]', error);
			}
		},
		providers: [
			Credentials({
				credentials: { email: {}, password: {} },
				async authorize(credentials) {
					const parsed = passwordSignIn.safeParse(credentials);
					if (!parsed.success) return null;
					const result = await accounts.verifyCredentials(db, parsed.data);
					if (result.ok) return result.user;
					if (result.reason === 'suspended') throw new AccountSuspended();
					return null;
				}
			}),
			Nodemailer({
				server: env.SMTP_URL,
				from: env.MAIL_FROM,
				maxAge: SIGN_IN_LINK_LIFETIME_SECONDS,
				async sendVerificationRequest({ identifier, url }) {
					await accounts.mailSignInLink(db, { email: identifier, url: onPublicOrigin(url), origin: publicOrigin() });
				}
			})
		],
		callbacks: {
			async signIn({ user: signingIn, account: via, email }) {
				if (via?.provider !== 'nodemailer') return true;
				// Every link request goes on to the mail step, which words the mail by account; only an
				// opened link for an active account signs in. Sign-up is where accounts are made.
				if (email?.verificationRequest) return true;
				const state = signingIn.email ? await accounts.linkSignInAllowed(db, { email: signingIn.email }) : 'unknown';
				if (state === 'unknown') return false;
				return state === 'suspended' ? '/sign-in?suspended=1' : true;
			},
			redirect({ url }) {
				const origin = publicOrigin();
				const target = new URL(url, origin);
				return target.origin === origin ? target.toString() : origin;
			},
			async jwt({ token, user: signedIn, account: via }) {
				if (signedIn?.id) {
					token.sub = signedIn.id;
					token.signedInWith = via?.provider;
					token.signedInAt = Date.now();
					token.sessionId = await accounts.startSession(db, {
						userId: signedIn.id,
						expires: new Date(Date.now() + SESSION_MAX_AGE_SECONDS * 1000)
					});
				}
				return token;
			},
			session({ session: current, token }) {
				if (token.sub) current.user.id = token.sub;
				current.signedInWith = token.signedInWith;
				current.signedInAt = token.signedInAt;
				current.sessionId = token.sessionId;
				return current;
			}
		},
		events: {
			async signOut(message) {
				const sessionId = 'token' in message ? message.token?.sessionId : undefined;
				if (sessionId) await accounts.endSession(db, { sessionId });
			}
		}
	})
);
