import { formatLength, type Unit } from '../drafting/units';

/** One control dimension of a stored size band: lower bound inclusive, upper exclusive, in millimetres. */
export interface SizeBandRange {
	dimension: string;
	lowerMm: number;
	upperMm: number;
}

const dimensionNames: Record<string, string> = { bust_girth: 'bust', waist_girth: 'waist', hip_girth: 'hip' };

/** "bust 86–90 cm, hip 94–98 cm" in the reader's unit. */
export function formatSizeBand(band: readonly SizeBandRange[], unit: Unit): string {
	return band
		.map((d) => {
			const name = dimensionNames[d.dimension] ?? d.dimension.replace(/_/g, ' ');
			return `${name} ${formatLength(d.lowerMm, unit, { withUnit: false })}–${formatLength(d.upperMm, unit, { withUnit: true })}`;
		})
		.join(', ');
}
