import { and, asc, eq, ne, sql } from 'drizzle-orm';
import {
	checkMeasurements,
	garmentIds,
	toMm,
	isMeasurementCode,
	templates,
	toUnitValue,
	type CheckResult,
	type GarmentId,
	type MeasurementCode,
	type Measurements,
	type Unit
} from '$lib/drafting';
import * as audit from '../audit';
import type { Executor } from '../db';
import { measurementProfile, type MeasurementTaker } from '../db/schema';
import { dayOf } from './values';

export { dayOf, dayStart, toMmValues } from './values';

export type Profile = {
	id: string;
	label: string;
	unit: Unit;
	valuesMm: Measurements;
	takenBy: MeasurementTaker;
	takenAt: Date | null;
	notes: string;
	createdAt: Date;
	updatedAt: Date;
};

export type ProfileFields = Omit<Profile, 'id' | 'createdAt' | 'updatedAt'>;

/** What a commission freezes when it is published. */
export type Snapshot = {
	profileId: string;
	label: string;
	unit: Unit;
	valuesMm: Measurements;
	takenBy: MeasurementTaker;
	takenAt: Date | null;
};

export class DuplicateLabel extends Error {
	constructor(label: string) {
		super(`You already have a profile called “${label}”. Choose another name.`);
	}
}

const columns = {
	id: measurementProfile.id,
	label: measurementProfile.label,
	unit: measurementProfile.unit,
	valuesMm: measurementProfile.valuesMm,
	takenBy: measurementProfile.takenBy,
	takenAt: measurementProfile.takenAt,
	notes: measurementProfile.notes,
	createdAt: measurementProfile.createdAt,
	updatedAt: measurementProfile.updatedAt
};

const owned = (ownerId: string, id: string) =>
	and(eq(measurementProfile.id, id), eq(measurementProfile.ownerId, ownerId));

/*
 * Hundredths of a millimetre: a value sent as 40.125 in or 101.37 cm comes back exactly as sent at the
 * API's precision (0.001 in, 0.01 cm), and nothing a tape can read is lost.
 */
const storedMm = (mm: number) => Math.round(mm * 100) / 100;

/** Only known codes with positive values, at storage precision. */
function cleanValues(values: Record<string, number | undefined>): Measurements {
	const clean: Measurements = {};
	for (const [code, mm] of Object.entries(values)) {
		if (isMeasurementCode(code) && typeof mm === 'number' && mm > 0) clean[code] = storedMm(mm);
	}
	return clean;
}

export async function list(db: Executor, { ownerId }: { ownerId: string }): Promise<Profile[]> {
	return db
		.select(columns)
		.from(measurementProfile)
		.where(eq(measurementProfile.ownerId, ownerId))
		.orderBy(asc(measurementProfile.createdAt), asc(measurementProfile.id))
		.limit(200);
}

/** The owner's profile, or null when there is none with that id or it is someone else's. */
export async function get(db: Executor, { ownerId, id }: { ownerId: string; id: string }): Promise<Profile | null> {
	const [row] = await db.select(columns).from(measurementProfile).where(owned(ownerId, id)).limit(1);
	return row ?? null;
}

async function labelTaken(db: Executor, ownerId: string, label: string, exceptId?: string) {
	const [row] = await db
		.select({ id: measurementProfile.id })
		.from(measurementProfile)
		.where(
			and(
				eq(measurementProfile.ownerId, ownerId),
				sql`lower(${measurementProfile.label}) = ${label.toLowerCase()}`,
				exceptId ? ne(measurementProfile.id, exceptId) : undefined
			)
		)
		.limit(1);
	return Boolean(row);
}

/** Labels are unique per owner whatever their case; throws DuplicateLabel. */
export async function create(
	db: Executor,
	{ ownerId, ip, fields }: { ownerId: string; ip?: string | null; fields: ProfileFields }
): Promise<Profile> {
	return db.transaction(async (tx) => {
		if (await labelTaken(tx, ownerId, fields.label)) throw new DuplicateLabel(fields.label);
		const [row] = await tx
			.insert(measurementProfile)
			.values({ ...fields, valuesMm: cleanValues(fields.valuesMm), ownerId })
			.onConflictDoNothing()
			.returning(columns);
		if (!row) throw new DuplicateLabel(fields.label);
		await audit.record(tx, {
			actorId: ownerId,
			ip,
			action: 'measurement_profile.created',
			subjectType: 'measurement_profile',
			subjectId: row.id
		});
		return row;
	});
}

export type ProfileChanges = Partial<ProfileFields> & {
	/** Measurements to set or (null) remove, in the profile's unit after this change; others stay. */
	valuesPatch?: Partial<Record<MeasurementCode, number | null>>;
};

/** Applies the changes to the owner's profile; null when it is not theirs. Throws DuplicateLabel. */
export async function update(
	db: Executor,
	{ ownerId, id, ip, changes }: { ownerId: string; id: string; ip?: string | null; changes: ProfileChanges }
): Promise<Profile | null> {
	return db.transaction(async (tx) => {
		const [current] = await tx.select(columns).from(measurementProfile).where(owned(ownerId, id)).for('update');
		if (!current) return null;
		const { valuesPatch, ...fields } = changes;
		if (fields.label !== undefined && (await labelTaken(tx, ownerId, fields.label, id)))
			throw new DuplicateLabel(fields.label);
		const unit = fields.unit ?? current.unit;
		let valuesMm = fields.valuesMm ?? current.valuesMm;
		if (valuesPatch) {
			valuesMm = { ...valuesMm };
			for (const [code, value] of Object.entries(valuesPatch) as [MeasurementCode, number | null][]) {
				if (value === null) delete valuesMm[code];
				else valuesMm[code] = toMm(value, unit);
			}
		}
		const [row] = await tx
			.update(measurementProfile)
			.set({ ...fields, valuesMm: cleanValues(valuesMm) })
			.where(owned(ownerId, id))
			.returning(columns);
		await audit.record(tx, {
			actorId: ownerId,
			ip,
			action: 'measurement_profile.updated',
			subjectType: 'measurement_profile',
			subjectId: id,
			// Which fields changed, never what they hold: measurements are private.
			data: { fields: Object.keys({ ...fields, ...(valuesPatch ? { valuesMm: true } : {}) }).sort() }
		});
		return row;
	});
}

/** Deletes the owner's profile; false when it is not theirs. Commissions keep their own frozen copy. */
export async function remove(
	db: Executor,
	{ ownerId, id, ip }: { ownerId: string; id: string; ip?: string | null }
): Promise<boolean> {
	return db.transaction(async (tx) => {
		const [row] = await tx
			.delete(measurementProfile)
			.where(owned(ownerId, id))
			.returning({ id: measurementProfile.id });
		if (!row) return false;
		await audit.record(tx, {
			actorId: ownerId,
			ip,
			action: 'measurement_profile.deleted',
			subjectType: 'measurement_profile',
			subjectId: id
		});
		return true;
	});
}

export async function snapshotFor(
	db: Executor,
	{ ownerId, id }: { ownerId: string; id: string }
): Promise<Snapshot | null> {
	const profile = await get(db, { ownerId, id });
	if (!profile) return null;
	const { label, unit, valuesMm, takenBy, takenAt } = profile;
	return { profileId: profile.id, label, unit, valuesMm, takenBy, takenAt };
}

/** The measurements a garment's template needs; none for a garment without one ("other"). */
export function neededFor(garmentId: string): readonly MeasurementCode[] {
	return (garmentIds as readonly string[]).includes(garmentId)
		? templates[garmentId as GarmentId].requiredMeasurements
		: [];
}

/** The measurements the garment needs that the values lack. */
export function missingFor(garmentId: string, valuesMm: Measurements): MeasurementCode[] {
	return neededFor(garmentId).filter((code) => valuesMm[code] === undefined);
}

/** Range, unit mix-up and relation checks, with messages in the profile's unit. */
export function checksFor(profile: Pick<Profile, 'valuesMm' | 'unit'>): CheckResult {
	return checkMeasurements(profile.valuesMm, profile.unit);
}

/** The JSON API's view: lengths in the profile's unit. */
export function present(profile: Profile) {
	const values: Partial<Record<MeasurementCode, number>> = {};
	for (const [code, mm] of Object.entries(profile.valuesMm) as [MeasurementCode, number][]) {
		values[code] = toUnitValue(mm, profile.unit);
	}
	return {
		id: profile.id,
		label: profile.label,
		unit: profile.unit,
		values,
		checks: checksFor(profile),
		takenBy: profile.takenBy,
		takenAt: dayOf(profile.takenAt),
		notes: profile.notes,
		createdAt: profile.createdAt.toISOString(),
		updatedAt: profile.updatedAt.toISOString()
	};
}
export type PresentedProfile = ReturnType<typeof present>;
