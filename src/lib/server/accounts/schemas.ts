import { z } from 'zod';
import { canonicalTimeZone, fallbackTimeZone } from '$lib/format/time-zones';
import { MIN_PASSWORD_LENGTH } from './password';
import { passwordWeakness } from './password-policy';

export const email = z
	.string({ error: 'Enter your email address.' })
	.trim()
	.toLowerCase()
	.min(1, 'Enter your email address.')
	.max(254, 'That email address is too long.')
	.pipe(z.email({ error: 'Enter a valid email address, like name@example.com.' }));

export const newPassword = z
	.string({ error: 'Choose a password.' })
	.min(MIN_PASSWORD_LENGTH, `Use at least ${MIN_PASSWORD_LENGTH} characters.`)
	.max(200, 'Use at most 200 characters.');

/** A real IANA zone, stored under the name the zone list uses. */
export const timeZone = z.string({ error: 'Choose your time zone.' }).transform((zone, ctx) => {
	const canonical = canonicalTimeZone(zone.trim());
	if (canonical) return canonical;
	ctx.addIssue({ code: 'custom', message: 'Choose a time zone from the list.' });
	return z.NEVER;
});

const name = z
	.string({ error: 'Tell us your name.' })
	.trim()
	.min(1, 'Tell us your name.')
	.max(80, 'Use at most 80 characters.');

export const signUp = z
	.object({
		name,
		email,
		password: newPassword,
		role: z.enum(['customer', 'tailor'], { error: 'Choose whether you want clothes made or make clothes.' }),
		// Sent by the browser unseen; without JavaScript (or with an odd value) the account starts in UTC.
		timeZone: timeZone.catch(fallbackTimeZone)
	})
	.superRefine((value, ctx) => {
		const weakness = passwordWeakness(value.password, value);
		if (weakness) ctx.addIssue({ code: 'custom', path: ['password'], message: weakness });
	});

export const passwordSignIn = z.object({
	email,
	password: z.string({ error: 'Enter your password.' }).min(1, 'Enter your password.').max(200),
	redirectTo: z.string().optional()
});

export const magicLinkRequest = z.object({ email, redirectTo: z.string().optional() });

export const profileUpdate = z.object({
	name,
	units: z.enum(['cm', 'in'], { error: 'Choose centimetres or inches.' }),
	timeZone
});

/** The new password is also checked against the account's own address and name. */
export function passwordChange(account: { email: string; name: string | null }) {
	return z
		.object({
			currentPassword: z.string().max(200).optional().default(''),
			newPassword,
			confirmPassword: z.string({ error: 'Type the new password again.' })
		})
		.refine((v) => v.newPassword === v.confirmPassword, {
			path: ['confirmPassword'],
			message: 'The two new passwords do not match.'
		})
		.superRefine((value, ctx) => {
			const weakness = passwordWeakness(value.newPassword, { email: account.email, name: account.name ?? undefined });
			if (weakness) ctx.addIssue({ code: 'custom', path: ['newPassword'], message: weakness });
		});
}
