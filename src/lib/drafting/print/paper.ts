/** PDF user space is 72 points to the inch (ISO 32000-1, 8.3.2.3). */
export const ptPerMm = 72 / 25.4;

export const papers = ['a4', 'letter', 'a0', 'roll36'] as const;
export type PaperId = (typeof papers)[number];

export interface Paper {
	id: PaperId;
	label: string;
	widthMm: number;
	/** Null for a roll: one page as long as the pattern. */
	heightMm: number | null;
	/** Edge a home printer or plotter cannot reach; nothing is drawn there. */
	marginMm: number;
	/** Strip printed on both neighbouring tiles, to lay one over the other. */
	overlapMm: number;
}

/** ISO 216 A4 and A0; ANSI letter (8½ × 11 in); a 36 in plotter roll. */
export const paperSizes: Readonly<Record<PaperId, Paper>> = {
	a4: { id: 'a4', label: 'A4', widthMm: 210, heightMm: 297, marginMm: 10, overlapMm: 15 },
	letter: { id: 'letter', label: 'US Letter', widthMm: 215.9, heightMm: 279.4, marginMm: 10, overlapMm: 15 },
	a0: { id: 'a0', label: 'A0', widthMm: 841, heightMm: 1189, marginMm: 10, overlapMm: 15 },
	roll36: { id: 'roll36', label: '36 in roll', widthMm: 914.4, heightMm: null, marginMm: 10, overlapMm: 0 }
};

/** Home printers print on tiles; A0 and the roll are single large sheets for a plotter or copy shop. */
export const isTiled = (paper: Paper) => paper.widthMm < 300;
