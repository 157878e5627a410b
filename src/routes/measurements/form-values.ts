import type { Measurements, Unit } from '$lib/drafting';
import { garmentIds, measurementCodes } from '$lib/drafting/measurements';
import { formatForInput } from '$lib/drafting/units';
import type { ProfileFormValues } from '$lib/types/measurements';

export function storedValues(profile: {
	label: string;
	unit: Unit;
	takenBy: string;
	takenAt: string | null;
	notes: string;
	valuesMm: Measurements;
}): ProfileFormValues {
	const texts = Object.fromEntries(
		Object.entries(profile.valuesMm).map(([code, mm]) => [code, formatForInput(mm, profile.unit)])
	);
	return { ...profile, takenAt: profile.takenAt ?? '', texts };
}

export function blankValues(unit: Unit): ProfileFormValues {
	return { label: '', unit, takenBy: 'self', takenAt: '', notes: '', texts: {} };
}

/** A submitted form's fields (`m.<code>` for each length) back into the form's shape. */
export function typedValues(kept: Record<string, string> | undefined, fallback: ProfileFormValues): ProfileFormValues {
	if (!kept) return fallback;
	const texts = Object.fromEntries(measurementCodes.map((code) => [code, kept[`m.${code}`] ?? '']));
	const unit = kept.unit === 'in' || kept.unit === 'cm' ? kept.unit : fallback.unit;
	return {
		label: kept.label ?? fallback.label,
		unit,
		takenBy: kept.takenBy || fallback.takenBy,
		takenAt: kept.takenAt ?? fallback.takenAt,
		notes: kept.notes ?? fallback.notes,
		texts
	};
}

/** `?garment=` names the garment a commission needs measurements for. */
export function garmentFrom(url: URL) {
	const garment = url.searchParams.get('garment');
	return garment && (garmentIds as readonly string[]).includes(garment) ? garment : null;
}
