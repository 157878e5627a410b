/** What an order page shows about fittings: the next booked one and how many offered times are open. */
export type FittingsSummary = {
	href: string;
	/** The next booked fitting still ahead: its times for the viewer (their zone first) and its place. */
	next: { when: string[]; place: string } | null;
	openCount: number;
	/** Whether fittings can be offered and booked on the order now. */
	active: boolean;
	/** `admin`: an administrator reading the order (they change nothing). */
	side: 'customer' | 'tailor' | 'admin';
};
