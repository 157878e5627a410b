import { toMm, type MeasurementCode, type Measurements, type Unit } from '$lib/drafting';

/** Lengths typed in `unit`, keyed by code, as millimetres. */
export function toMmValues(values: Partial<Record<MeasurementCode, number>>, unit: Unit): Measurements {
	return Object.fromEntries(Object.entries(values).map(([code, value]) => [code, toMm(value, unit)]));
}

/** `YYYY-MM-DD` of a day kept as midnight UTC. */
export const dayOf = (at: Date | null) => (at ? at.toISOString().slice(0, 10) : null);
export const dayStart = (day: string | null) => (day ? new Date(`${day}T00:00:00Z`) : null);
