import type { Mail } from '../mail';
import { SIGN_IN_LINK_LIFETIME_MINUTES } from '../limits/constants';

function escapeAttribute(value: string) {
	return value.replaceAll('&', '&amp;').replaceAll('"', '&quot;').replaceAll('<', '&lt;');
}

const lifetime = `The link works once and expires in ${SIGN_IN_LINK_LIFETIME_MINUTES} minutes.`;
const ignore = 'If you did not ask for it, you can ignore this email.';

function linkMail(to: string, subject: string, lead: string, url: string): Mail {
	const host = new URL(url).host;
	return {
		to,
		subject,
		text: `Hello,\n\n${lead} at ${host}:\n\n${url}\n\n${lifetime} ${ignore}\n\n— Tackline`,
		html: `<p>Hello,</p><p>${lead} at ${host}:</p><p><a href="${escapeAttribute(url)}">${subject.replace('Your Tackline ', 'Open your ')}</a></p><p>${lifetime} ${ignore}</p><p>— Tackline</p>`
	};
}

export function signInLinkMail(to: string, url: string): Mail {
	return linkMail(to, 'Your Tackline sign-in link', 'Use this link to sign in to Tackline', url);
}

/** A new account's first link: opening it confirms the address and signs the person in. */
export function confirmAddressMail(to: string, url: string): Mail {
	const mail = linkMail(
		to,
		'Your Tackline confirmation link',
		'Welcome to Tackline. Confirm your email address and sign in with this link',
		url
	);
	// Opening this link also confirms the password chosen at sign-up; someone else may have chosen it.
	const notYou =
		'If you did not make a Tackline account, do not open the link. To use Tackline with this address, ask for a sign-in link on the sign-in page instead: that removes any password someone else set.';
	return {
		...mail,
		text: mail.text.replace('\n\n— Tackline', `\n\n${notYou}\n\n— Tackline`),
		html: mail.html?.replace('<p>— Tackline</p>', `<p>${notYou}</p><p>— Tackline</p>`)
	};
}

export function noAccountMail(to: string, origin: string): Mail {
	return {
		to,
		subject: 'Signing in to Tackline',
		text: `Hello,\n\nSomeone asked to sign in to Tackline with this address, but no account uses it. To make one, go to ${origin}/sign-up\n\n${ignore}\n\n— Tackline`
	};
}

export function suspendedAccountMail(to: string): Mail {
	return {
		to,
		subject: 'Signing in to Tackline',
		text: `Hello,\n\nSomeone asked to sign in to Tackline with this address. The account is suspended, so no link was sent. Write to support@tackline.test if you think this is a mistake.\n\n— Tackline`
	};
}

export function accountExistsMail(to: string, origin: string): Mail {
	return {
		to,
		subject: 'You already have a Tackline account',
		text: `Hello,\n\nSomeone tried to create a Tackline account with this address, which already has one. If that was you, sign in at ${origin}/sign-in — with your password, or with a link sent to this address if you have forgotten it.\n\n${ignore}\n\n— Tackline`
	};
}
