import type { MeasurementCode } from '../measurements';
import { mmPerInch } from '../units';
import { fits, type Fit } from '../ease';
import type { BodyMm, ChoiceOption, LengthOption, ResolvedOptions } from './types';

export const inch = (value: number) => value * mmPerInch;

/** Home-sewing pattern seam allowance, 5/8 in (Wikipedia "Seam allowance"; metric patterns use 1.5 cm). */
export const homeSeamAllowance = inch(5 / 8);

export const fitOption: ChoiceOption = {
	id: 'fit',
	label: 'Fit',
	kind: 'choice',
	choices: fits.map((value) => ({ value, label: value[0].toUpperCase() + value.slice(1) })),
	default: 'regular',
	help: 'How much ease (room) to add over the body measurements.'
};

export function lengthOption(
	id: string,
	label: string,
	defaultMm: number | null,
	range: [number, number],
	extra: Partial<LengthOption> = {}
): LengthOption {
	return { id, label, kind: 'length', defaultMm, minMm: range[0], maxMm: range[1], ...extra };
}

export function num(options: ResolvedOptions, id: string): number {
	const value = options[id];
	if (typeof value !== 'number') throw new TypeError(`Option ${id} must be a number`);
	return value;
}

export function fitOf(options: ResolvedOptions): Fit {
	const value = options.fit;
	return (fits as readonly unknown[]).includes(value) ? (value as Fit) : 'regular';
}

export function need(body: BodyMm, code: MeasurementCode): number {
	const value = body[code];
	if (value === undefined) throw new TypeError(`Measurement ${code} is required`);
	return value;
}
