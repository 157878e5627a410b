import { z } from 'zod';
import { MIN_PASSWORD_LENGTH } from '../auth/password';

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

export const signUp = z.object({
	name: z
		.string({ error: 'Tell us your name.' })
		.trim()
		.min(1, 'Tell us your name.')
		.max(80, 'Use at most 80 characters.'),
	email,
	password: newPassword,
	role: z.enum(['customer', 'tailor'], { error: 'Choose whether you want clothes made or make clothes.' })
});

export const passwordSignIn = z.object({
	email,
	password: z.string({ error: 'Enter your password.' }).min(1, 'Enter your password.').max(200),
	redirectTo: z.string().optional()
});

export const magicLinkRequest = z.object({ email, redirectTo: z.string().optional() });

const timeZones = new Set(Intl.supportedValuesOf('timeZone').concat('UTC'));

export const profileUpdate = z.object({
	name: signUp.shape.name,
	units: z.enum(['cm', 'in'], { error: 'Choose centimetres or inches.' }),
	timeZone: z
		.string({ error: 'Choose your time zone.' })
		.refine((zone) => timeZones.has(zone), 'Choose a time zone from the list.')
});

export const passwordChange = z
	.object({
		currentPassword: z.string().max(200).optional().default(''),
		newPassword,
		confirmPassword: z.string({ error: 'Type the new password again.' })
	})
	.refine((v) => v.newPassword === v.confirmPassword, {
		path: ['confirmPassword'],
		message: 'The two new passwords do not match.'
	});
