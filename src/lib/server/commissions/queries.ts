import { and, desc, eq, sql } from 'drizzle-orm';
import { formatSizeBand, type SizeBandRange } from '$lib/format/size-band';
import { toUnitValue, type Unit } from '$lib/drafting';
import * as accounts from '../accounts';
import type { Executor } from '../db';
import { preparedPer } from '../db/prepared';
import {
	commission,
	commissionMeasurements,
	commissionPhoto,
	commissionSizeBand,
	quote,
	type Commission
} from '../db/schema';
import { missingForPublish, stepOfField, type StepId } from './completeness';
import { fabricEstimateForBand } from './estimate';
import { todayIn } from './lead-times';
import { snapshotFor } from './profile-snapshot';
import { quotedBy, sizeBandOf } from './quotes-read';

export type Viewer = { id: string; role: 'customer' | 'tailor' | 'admin' } | null;

/** "Rosalind P." — all a tailor learns of the customer's name. */
export function firstNameAndInitial(name: string | null | undefined) {
	const parts = (name ?? '').trim().split(/\s+/).filter(Boolean);
	if (parts.length === 0) return 'A customer';
	return parts.length > 1 ? `${parts[0]} ${parts.at(-1)![0].toUpperCase()}.` : parts[0];
}

/**
 * The listed commission's id, qualified: in a select from one table Drizzle writes columns bare, and a bare
 * `"id"` inside a subquery would name the subquery's own row.
 */
const listedId = sql`${commission}.${sql.identifier('id')}`;

const bandJson = sql<SizeBandRange[]>`coalesce((
	select json_agg(json_build_object('dimension', b.dimension, 'lowerMm', b.lower_mm, 'upperMm', b.upper_mm) order by b.position)
	from ${commissionSizeBand} b where b.commission_id = ${listedId}
), '[]'::json)`;

const customerListStatement = preparedPer((db) =>
	db
		.select({
			id: commission.id,
			title: commission.title,
			status: commission.status,
			garmentType: commission.garmentType,
			garmentOther: commission.garmentOther,
			measurementProfileId: commission.measurementProfileId,
			budgetMinMinor: commission.budgetMinMinor,
			budgetMaxMinor: commission.budgetMaxMinor,
			currency: commission.currency,
			dateNeeded: commission.dateNeeded,
			approxLat: commission.approxLat,
			approxLng: commission.approxLng,
			city: commission.city,
			quoteCount: sql<number>`(
				select count(*)::int from ${quote} q
				where q.commission_id = ${listedId} and q.status = 'sent'
			)`.mapWith(Number)
		})
		.from(commission)
		.where(eq(commission.customerId, sql.placeholder('customerId')))
		.orderBy(desc(commission.updatedAt), desc(commission.id))
		.limit(100)
		.prepare('commissions_of_customer')
);

const dayMs = 86_400_000;
const utcDay = (offsetDays = 0) => new Date(Date.now() + offsetDays * dayMs).toISOString().slice(0, 10);

/**
 * The day drafts' dates needed are judged against. Every time zone's date is within a day of UTC's, so the
 * customer's own day (`today()`, a read) is needed only for a draft needed within a day of UTC's date; for
 * any other date, UTC's day gives the same answer.
 */
async function dayFor(rows: { status: string; dateNeeded: string | null }[], today: () => Promise<string>) {
	const [earliest, latest] = [utcDay(-1), utcDay(1)];
	const close = rows.some(
		(row) => row.status === 'draft' && row.dateNeeded !== null && row.dateNeeded >= earliest && row.dateNeeded <= latest
	);
	return close ? today() : utcDay();
}

/**
 * The customer's commissions, newest first, with what their list shows; each draft says which step to
 * continue at. `today` is the customer's day; as a function it is called only when a draft's date needed
 * is close enough for the time zone to matter.
 */
export async function listForCustomer(
	db: Executor,
	{ customerId, today }: { customerId: string; today?: string | (() => Promise<string>) }
) {
	const rows = await customerListStatement(db).execute({ customerId });
	const day = typeof today === 'function' ? await dayFor(rows, today) : (today ?? utcDay());
	return rows.map(
		({ measurementProfileId, budgetMinMinor, budgetMaxMinor, currency, approxLat, approxLng, city, ...row }) => {
			if (row.status !== 'draft') return { ...row, continueAt: null };
			// The profile is judged at publish time; here only whether one is chosen.
			const gaps = missingForPublish(
				{ ...row, measurementProfileId, budgetMinMinor, budgetMaxMinor, currency, approxLat, approxLng, city },
				measurementProfileId ? { valuesMm: {} } : null,
				day
			).filter((issue) => issue.path !== 'measurements');
			const continueAt: StepId = gaps.length ? stepOfField[gaps[0].path] : 'review';
			return { ...row, continueAt };
		}
	);
}

/** A draft or open commission for its owner's edit steps; null for anyone else (the page answers 404). */
export async function getForOwner(
	db: Executor,
	{ id, ownerId }: { id: string; ownerId: string }
): Promise<Commission | null> {
	const [row] = await db
		.select()
		.from(commission)
		.where(and(eq(commission.id, id), eq(commission.customerId, ownerId)))
		.limit(1);
	return row ?? null;
}

function photosVisible(row: Commission, viewer: NonNullable<Viewer>, isOwner: boolean, quoteStatus: string | null) {
	if (isOwner || viewer.role === 'admin') return true;
	if (viewer.role !== 'tailor') return false;
	return row.status === 'open' || quoteStatus === 'accepted';
}

async function photosOf(db: Executor, commissionId: string) {
	return db
		.select({
			id: commissionPhoto.id,
			altText: commissionPhoto.altText,
			width: commissionPhoto.width,
			height: commissionPhoto.height
		})
		.from(commissionPhoto)
		.where(eq(commissionPhoto.commissionId, commissionId))
		.orderBy(commissionPhoto.sortOrder, commissionPhoto.createdAt);
}

async function measurementsOf(db: Executor, commissionId: string) {
	const [row] = await db
		.select({
			label: commissionMeasurements.label,
			unit: commissionMeasurements.unit,
			valuesMm: commissionMeasurements.valuesMm,
			takenBy: commissionMeasurements.takenBy,
			takenAt: commissionMeasurements.takenAt
		})
		.from(commissionMeasurements)
		.where(eq(commissionMeasurements.commissionId, commissionId))
		.limit(1);
	if (!row) return null;
	const values = Object.fromEntries(
		Object.entries(row.valuesMm).map(([code, mm]) => [code, toUnitValue(mm, row.unit)])
	);
	return {
		label: row.label,
		unit: row.unit,
		values,
		valuesMm: row.valuesMm,
		takenBy: row.takenBy,
		takenAt: row.takenAt
	};
}

/**
 * A commission as `viewer` may see it, or null when they may not know it exists. The owner and the tailor
 * whose quote was accepted get the frozen measurements (only their queries touch `commission_measurements`);
 * everyone else gets the size band, a
 * fabric estimate for it, the customer's first name and initial, and the town. Drafts are the owner's alone.
 */
export async function getForViewer(db: Executor, { id, viewer, unit }: { id: string; viewer: Viewer; unit?: Unit }) {
	if (!viewer) return null;
	const [row] = await db.select().from(commission).where(eq(commission.id, id)).limit(1);
	if (!row) return null;
	const isOwner = row.customerId === viewer.id;
	const quoteStatus =
		viewer.role === 'tailor' && !isOwner ? await quotedBy(db, { commissionId: id, tailorId: viewer.id }) : null;
	const visible =
		isOwner || viewer.role === 'admin' || (viewer.role === 'tailor' && (row.status === 'open' || quoteStatus !== null));
	if (!visible || (row.status === 'draft' && !isOwner)) return null;

	const readerUnit = unit ?? 'cm';
	const [band, photos, customer] = await Promise.all([
		sizeBandOf(db, id),
		photosVisible(row, viewer, isOwner, quoteStatus) ? photosOf(db, id) : Promise.resolve(null),
		accounts.getProfile(db, { id: row.customerId })
	]);
	const shared = {
		id: row.id,
		status: row.status,
		garment: row.garmentType,
		garmentOther: row.garmentOther,
		title: row.title,
		styleNotes: row.styleNotes,
		fabricSource: row.fabricSource,
		fabricNotes: row.fabricNotes,
		budget:
			row.budgetMinMinor === null || row.budgetMaxMinor === null
				? null
				: { minMinor: row.budgetMinMinor, maxMinor: row.budgetMaxMinor, currency: row.currency },
		dateNeeded: row.dateNeeded,
		handover: row.handover,
		sizeBand: band,
		sizeBandText: band.length ? formatSizeBand(band, readerUnit) : null,
		publishedAt: row.publishedAt,
		expiresAt: row.expiresAt,
		createdAt: row.createdAt,
		updatedAt: row.updatedAt,
		photos
	};
	const location =
		row.approxLat === null || row.approxLng === null
			? null
			: { lat: row.approxLat, lng: row.approxLng, name: row.city, district: row.district, country: row.countryCode };
	if (isOwner) {
		return {
			...shared,
			viewer: 'owner' as const,
			customer: { name: customer?.name ?? null },
			measurementProfileId: row.measurementProfileId,
			location,
			measurements: await measurementsOf(db, id)
		};
	}
	const fabricEstimate = fabricEstimateForBand(row.garmentType, band, readerUnit);
	if (quoteStatus === 'accepted') {
		// The awarded tailor cuts from the full measurements, as the customer agreed by accepting their quote.
		return {
			...shared,
			viewer: 'awarded' as const,
			customer: { name: firstNameAndInitial(customer?.name) },
			location,
			fabricEstimate,
			measurements: await measurementsOf(db, id)
		};
	}
	return {
		...shared,
		viewer: viewer.role === 'admin' ? ('admin' as const) : ('tailor' as const),
		customer: { name: firstNameAndInitial(customer?.name) },
		location,
		fabricEstimate
	};
}

export type CommissionView = NonNullable<Awaited<ReturnType<typeof getForViewer>>>;

/** Open commissions, newest first, as a quoting tailor may see them: size band, never measurements. */
export async function listOpen(db: Executor, { limit = 20 }: { limit?: number } = {}) {
	return db
		.select({
			id: commission.id,
			title: commission.title,
			garmentType: commission.garmentType,
			garmentOther: commission.garmentOther,
			sizeBand: bandJson,
			city: commission.city,
			district: commission.district,
			dateNeeded: commission.dateNeeded,
			budgetMinMinor: commission.budgetMinMinor,
			budgetMaxMinor: commission.budgetMaxMinor,
			currency: commission.currency,
			fabricSource: commission.fabricSource,
			handover: commission.handover,
			publishedAt: commission.publishedAt,
			expiresAt: commission.expiresAt,
			photoCount: sql<number>`(select count(*) from ${commissionPhoto} p where p.commission_id = ${listedId})`.mapWith(
				Number
			)
		})
		.from(commission)
		.where(eq(commission.status, 'open'))
		.orderBy(desc(commission.publishedAt), desc(commission.id))
		.limit(limit);
}

/** The customer's own time zone, in which "a date after today" is judged. */
export async function customerTimeZone(db: Executor, customerId: string) {
	return (await accounts.getProfile(db, { id: customerId }))?.timeZone ?? 'UTC';
}

/** What still stands between the owner's draft and publishing it, each with the step that mends it. */
export async function readiness(db: Executor, { commission: row }: { commission: Commission }) {
	const profile = row.measurementProfileId
		? await snapshotFor(db, { profileId: row.measurementProfileId, ownerId: row.customerId })
		: null;
	const today = todayIn(await customerTimeZone(db, row.customerId));
	const issues = missingForPublish(row, profile, today).map((issue) => ({
		...issue,
		step: stepOfField[issue.path] ?? 'review'
	}));
	return { issues, today, profileLabel: profile?.label ?? null };
}
