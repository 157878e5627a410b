export type Role = 'customer' | 'tailor' | 'admin';

/** The signed-in user as the root layout sends it to the browser: a whitelisted projection, never the row. */
export type SessionUser = {
	id: string;
	name: string | null;
	email: string;
	role: Role;
	units: 'in' | 'cm';
};
