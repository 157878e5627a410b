import type { DraftRequest } from '$lib/drafting';
import { fromMm } from '$lib/drafting/units';
import type { DraftCalculator } from './calculator.svelte';

/** What the calculator shows, as the draft API's request in the calculator's unit. */
export function draftRequestOf(calc: DraftCalculator): DraftRequest {
	const inUnit = (mm: number) => Math.round(fromMm(mm, calc.unit) * 1e4) / 1e4;
	const measurements = Object.fromEntries(
		calc.fields.flatMap((code) => {
			const mm = calc.measurements.mm[code];
			return mm === undefined ? [] : [[code, inUnit(mm)]];
		})
	);
	const lengths = Object.entries({ ...calc.metricDefaults, ...calc.options.mm }).map(([id, mm]): [string, number] => [
		id,
		inUnit(mm)
	]);
	const shrinkage = Number(calc.shrinkage.replace(',', '.'));
	return {
		garment: calc.garment,
		unit: calc.unit,
		measurements,
		options: { ...Object.fromEntries(lengths), fit: calc.fit, ...calc.choices, ...calc.switches },
		fabric: {
			width: calc.widthPresets[calc.widthIndex],
			folded: calc.folded,
			directional: calc.directional,
			shrinkage: Number.isFinite(shrinkage) ? Math.min(Math.max(shrinkage, 0), 20) : 0,
			repeat: inUnit(calc.repeat.mm.repeat ?? 0)
		},
		unitConfirmed: calc.unitConfirmed
	};
}
