import type { Role } from '$lib/types/user';

export type Area = { href: string; label: string; callToAction: string };

/** Each role's own part of Tackline: its name in the navigation, and how public pages point members to it. */
export const areas: Record<Role, Area> = {
	customer: { href: '/commissions', label: 'My commissions', callToAction: 'Go to my commissions' },
	tailor: { href: '/workroom', label: 'Workroom', callToAction: 'Find commissions' },
	admin: { href: '/desk', label: 'Desk', callToAction: 'Open the desk' }
};
