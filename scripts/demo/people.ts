import type { NewUser } from '../../src/lib/server/db/schema';
import { timeZone } from './city';
import { demoId } from './ids';

export const demoPassword = 'tackline-demo';
export const adminEmail = 'admin@tackline.test';

type Person = Pick<NewUser, 'name' | 'email' | 'role'> & { units?: NewUser['units'] };

/** Order matters: the index is the fixed id, so append new people at the end. */
const people: Person[] = [
	{ name: 'Aurélie Standish', email: adminEmail, role: 'admin' },
	{ name: 'Rosalind Fairweather', email: 'customer@tackline.test', role: 'customer' },
	{ name: 'Tamsin Oyelaran', email: 'tamsin.oyelaran@tackline.test', role: 'customer' },
	{ name: 'Felix Garrow', email: 'felix.garrow@tackline.test', role: 'customer', units: 'in' },
	{ name: 'Nadia Kestrel', email: 'nadia.kestrel@tackline.test', role: 'customer' },
	{ name: 'Marguerite Obi', email: 'tailor@tackline.test', role: 'tailor' },
	{ name: 'Tobiah Marsh', email: 'tobiah.marsh@tackline.test', role: 'tailor' },
	{ name: 'Sunniva Crale', email: 'sunniva.crale@tackline.test', role: 'tailor' },
	{ name: 'Reuben Frost', email: 'reuben.frost@tackline.test', role: 'tailor' },
	{ name: 'Hettie Pellow', email: 'hettie.pellow@tackline.test', role: 'tailor' },
	{ name: 'Caius Brennagh', email: 'caius.brennagh@tackline.test', role: 'tailor' },
	{ name: 'Odalys Quill', email: 'odalys.quill@tackline.test', role: 'tailor' },
	{ name: 'Benedek Harrow', email: 'benedek.harrow@tackline.test', role: 'tailor' },
	{ name: 'Yusra Tamblin', email: 'yusra.tamblin@tackline.test', role: 'tailor' },
	{ name: 'Petronella Vance', email: 'petronella.vance@tackline.test', role: 'tailor' },
	{ name: 'Ilse Moorcroft', email: 'ilse.moorcroft@tackline.test', role: 'tailor' },
	{ name: 'Gideon Achterberg', email: 'gideon.achterberg@tackline.test', role: 'tailor' }
];

/** The demo user id for an e-mail address listed above. */
export function personId(email: string): string {
	const index = people.findIndex((p) => p.email === email);
	if (index < 0) throw new Error(`No demo person with e-mail ${email}`);
	return demoId('user', index + 1);
}

export function demoUsers(passwordHash: string, now: Date): NewUser[] {
	return people.map((p) => ({
		...p,
		id: personId(p.email),
		passwordHash,
		emailVerified: now,
		timeZone
	}));
}
