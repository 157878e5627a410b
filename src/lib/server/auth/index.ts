import { DrizzleAdapter } from '@auth/drizzle-adapter';
import { AuthError, CredentialsSignin, SvelteKitAuth } from '@auth/sveltekit';
import Credentials from '@auth/sveltekit/providers/credentials';
import Nodemailer from '@auth/sveltekit/providers/nodemailer';
import { env } from '$env/dynamic/private';
import { db } from '../db';
import { account, session, user, verificationToken } from '../db/schema';
import * as accounts from '../accounts';
import * as mail from '../mail';
import { passwordSignIn } from '../accounts/schemas';

export class AccountSuspended extends CredentialsSignin {
	code = 'suspended';
}

export const SIGN_IN_LINK_MAX_AGE_SECONDS = 24 * 60 * 60;

export const { handle, signIn, signOut } = SvelteKitAuth(() =>
	Promise.resolve({
		adapter: DrizzleAdapter(db, {
			usersTable: user,
			accountsTable: account,
			sessionsTable: session,
			verificationTokensTable: verificationToken
		}),
		// Credentials sign-in requires JWT sessions; the user row is re-read on every request in hooks.
		session: { strategy: 'jwt', maxAge: 30 * 24 * 60 * 60 },
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
					const result = await accounts.verifyCredentials(parsed.data);
					if (result.ok) return result.user;
					if (result.reason === 'suspended') throw new AccountSuspended();
					return null;
				}
			}),
			Nodemailer({
				server: env.SMTP_URL,
				from: env.MAIL_FROM,
				maxAge: SIGN_IN_LINK_MAX_AGE_SECONDS,
				async sendVerificationRequest({ identifier, url }) {
					await mail.send(mail.signInLinkMail(identifier, url));
				}
			})
		],
		callbacks: {
			async signIn({ user: signingIn, account: via }) {
				// Sign-in links are for existing, active accounts; sign-up is where accounts are made.
				if (via?.provider !== 'nodemailer') return true;
				const found = signingIn.email ? await accounts.findByEmail({ email: signingIn.email }) : null;
				if (!found) return false;
				return found.suspendedAt ? '/sign-in?suspended=1' : true;
			},
			jwt({ token, user: signedIn, account: via }) {
				if (signedIn?.id) {
					token.sub = signedIn.id;
					token.signedInWith = via?.provider;
					token.signedInAt = Date.now();
				}
				return token;
			},
			session({ session: current, token }) {
				if (token.sub) current.user.id = token.sub;
				current.signedInWith = token.signedInWith;
				current.signedInAt = token.signedInAt;
				return current;
			}
		}
	})
);
