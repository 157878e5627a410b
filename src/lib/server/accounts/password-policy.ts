import { ZxcvbnFactory } from '@zxcvbn-ts/core';
import { adjacencyGraphs, dictionary as commonDictionary } from '@zxcvbn-ts/language-common';
import { dictionary as englishDictionary, translations } from '@zxcvbn-ts/language-en';

const zxcvbn = new ZxcvbnFactory({
	dictionary: { ...commonDictionary, ...englishDictionary },
	graphs: adjacencyGraphs,
	translations
});

/** zxcvbn's scale: 3 is "safely unguessable: moderate protection from offline slow-hash scenario". */
export const MIN_PASSWORD_SCORE = 3;

/** Why a password is too easy to guess, or null when it will do. */
export function passwordWeakness(password: string, context: { email?: string; name?: string } = {}): string | null {
	if (/^(.)\1*$/su.test(password)) return 'Use more than one repeated character.';
	const email = context.email?.trim().toLowerCase();
	if (email && (password.trim().toLowerCase() === email || password.toLowerCase() === email.split('@')[0])) {
		return 'Don’t use your email address as your password.';
	}
	const inputs = [email, email?.split('@')[0], context.name].filter((v): v is string => Boolean(v));
	const result = zxcvbn.check(password.slice(0, 100), inputs);
	if (result.score >= MIN_PASSWORD_SCORE) return null;
	const why = result.feedback.warning ?? 'It would be easy to guess.';
	return `Choose a harder password. ${why} A few unrelated words together work well.`;
}
