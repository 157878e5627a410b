import { and, arrayContains, eq, like, or, sql, type SQL } from 'drizzle-orm';
import type { GarmentId } from '$lib/drafting';
import type { DirectoryEntry, OnboardingStatus, OwnWorkroom, PublicWorkroom, WorkroomRates } from '$lib/types/workroom';
import * as audit from '../audit';
import type { Executor } from '../db';
import { preparedPer } from '../db/prepared';
import { tailorProfile, user, type NewTailorProfile } from '../db/schema';
import { cardColumns, listed, reviewsOf, toCards } from './cards';
import { resolveLocation, type WorkroomPlace } from './location';
import { statusOf, type OnboardingFacts } from './onboarding';
import { readyColumn as payoutsReadyColumn } from '../payouts';
import { portfolio } from '../photos';
import { noteWorkroomChanged } from '../search-outbox';
import type { WorkroomInput } from './schemas';
import { firstFreeSlug, slugify } from './slug';

export { UnknownPlace, type LocationChoice, type WorkroomPlace } from './location';
export { missingSteps } from './onboarding';
export * from './schemas';

/** Saving a section before the workroom has a name and a place: the row needs both. */
export class WorkroomNotStarted extends Error {
	readonly code = 'workroom_not_started';
	constructor() {
		super('Start with your workroom’s name and place; the other sections follow.');
	}
}

const ownColumns = {
	id: tailorProfile.userId,
	slug: tailorProfile.slug,
	shopName: tailorProfile.shopName,
	bio: tailorProfile.bio,
	specialties: tailorProfile.specialties,
	city: tailorProfile.city,
	district: tailorProfile.district,
	countryCode: tailorProfile.countryCode,
	lat: tailorProfile.lat,
	lng: tailorProfile.lng,
	serviceRadiusKm: tailorProfile.serviceRadiusKm,
	leadTimes: tailorProfile.leadTimes,
	capacity: tailorProfile.capacity,
	hourlyRateMinor: tailorProfile.hourlyRateMinor,
	rateCurrency: tailorProfile.rateCurrency,
	labourHours: tailorProfile.labourHours,
	fabricMarkupPercent: tailorProfile.fabricMarkupPercent,
	acceptingWork: tailorProfile.acceptingWork,
	onboardedAt: tailorProfile.onboardedAt
};
const selectOwn = (db: Executor, tailorId: string) =>
	db.select(ownColumns).from(tailorProfile).where(eq(tailorProfile.userId, tailorId));
type OwnRow = Awaited<ReturnType<typeof selectOwn>>[number];

/** The unlocked read of `readRow`, prepared once (the workroom pages and the near-me list all start with it). */
const ownStatement = preparedPer((db) =>
	db
		.select(ownColumns)
		.from(tailorProfile)
		.where(eq(tailorProfile.userId, sql.placeholder('tailorId')))
		.prepare('workroom_own')
);

async function readRow(db: Executor, tailorId: string, { lock = false } = {}): Promise<OwnRow | null> {
	const [row] = await (lock ? selectOwn(db, tailorId).for('update') : ownStatement(db).execute({ tailorId }));
	return row ?? null;
}

function toOwn(row: OwnRow): OwnWorkroom {
	const rates: WorkroomRates | null =
		row.hourlyRateMinor !== null && row.rateCurrency !== null
			? {
					hourlyRateMinor: row.hourlyRateMinor,
					currency: row.rateCurrency,
					labourHours: row.labourHours,
					fabricMarkupPercent: row.fabricMarkupPercent
				}
			: null;
	return {
		id: row.id,
		slug: row.slug,
		name: row.shopName,
		bio: row.bio,
		specialties: row.specialties as GarmentId[],
		location: { town: row.city, district: row.district, country: row.countryCode, lat: row.lat, lng: row.lng },
		serviceRadiusKm: row.serviceRadiusKm,
		leadTimes: row.leadTimes,
		capacity: row.capacity,
		rates,
		acceptingWork: row.acceptingWork,
		onboardedAt: row.onboardedAt
	};
}

function factsOf(row: OwnRow | null): OnboardingFacts | null {
	return row && { ...row, specialties: row.specialties as GarmentId[] };
}

/** The columns an input changes; absent keys stay as they are, `rates: null` clears the rates. */
function columnsFor(input: WorkroomInput, place: WorkroomPlace | undefined): Partial<NewTailorProfile> {
	const set: Partial<NewTailorProfile> = {};
	if (input.name !== undefined) set.shopName = input.name;
	if (input.bio !== undefined) set.bio = input.bio;
	if (input.specialties !== undefined) set.specialties = [...new Set(input.specialties)];
	if (place)
		Object.assign(set, {
			city: place.town,
			district: place.district,
			countryCode: place.country,
			lat: place.lat,
			lng: place.lng
		});
	if (input.serviceRadiusKm !== undefined) set.serviceRadiusKm = input.serviceRadiusKm;
	if (input.capacity !== undefined) set.capacity = input.capacity;
	if (input.leadTimes !== undefined) {
		set.leadTimes = input.leadTimes;
		// The single figure covers garments not listed: quote the longest of the listed ones for them.
		const days = Object.values(input.leadTimes);
		if (days.length) set.leadTimeDays = Math.max(...days);
	}
	if (input.rates !== undefined) {
		const rates = input.rates;
		set.hourlyRateMinor = rates?.hourlyRateMinor ?? null;
		set.rateCurrency = rates?.currency ?? null;
		set.labourHours = rates?.labourHours ?? {};
		set.fabricMarkupPercent = rates?.fabricMarkupPercent ?? 0;
	}
	return set;
}

/** Inserts the workroom under a slug made from its name: unique, and kept when the name changes later. */
async function insertRow(tx: Executor, tailorId: string, values: Partial<NewTailorProfile>) {
	const { shopName, city, lat, lng } = values;
	if (!shopName || !city || lat === undefined || lng === undefined) throw new WorkroomNotStarted();
	const base = slugify(shopName);
	for (let attempt = 0; attempt < 5; attempt += 1) {
		const taken = await tx
			.select({ slug: tailorProfile.slug })
			.from(tailorProfile)
			.where(or(eq(tailorProfile.slug, base), like(tailorProfile.slug, `${base}-%`)));
		const slug = firstFreeSlug(
			base,
			taken.map((row) => row.slug)
		);
		const [row] = await tx
			.insert(tailorProfile)
			.values({ ...values, shopName, city, lat, lng, userId: tailorId, slug })
			.onConflictDoNothing()
			.returning({ id: tailorProfile.userId });
		if (row) return;
		// A second submit may have made the row meanwhile; otherwise the slug was taken a moment ago.
		if (await readRow(tx, tailorId, { lock: true })) {
			await tx.update(tailorProfile).set(values).where(eq(tailorProfile.userId, tailorId));
			return;
		}
	}
	throw new Error('Could not find a free workroom address');
}

/** Recomputes onboarding and sets or clears `onboarded_at` to match, recording the change. */
async function syncOnboarding(tx: Executor, tailorId: string, row: OwnRow | null) {
	const status = statusOf(factsOf(row), row ? await portfolio.photoCount(tx, tailorId) : 0);
	if (!row || status.complete === (row.onboardedAt !== null)) return { status, onboardedAt: row?.onboardedAt ?? null };
	const onboardedAt = status.complete ? new Date() : null;
	await tx.update(tailorProfile).set({ onboardedAt }).where(eq(tailorProfile.userId, tailorId));
	await noteWorkroomChanged(tx, tailorId);
	await audit.record(tx, {
		actorId: tailorId,
		action: status.complete ? 'workroom.onboarded' : 'workroom.onboarding_reopened',
		subjectType: 'tailor_profile',
		subjectId: tailorId,
		data: status.complete ? {} : { missing: status.missing.map((m) => m.step) }
	});
	return { status, onboardedAt };
}

/** Where a tailor's near-me list starts from: the workroom's place and reach, and the currency it quotes in. */
export type ListOrigin = Pick<OwnWorkroom, 'serviceRadiusKm'> & {
	location: Pick<OwnWorkroom['location'], 'town' | 'lat' | 'lng'>;
	/** The rates' currency, null while no rates are set. */
	currency: string | null;
};

const originStatement = preparedPer((db) =>
	db
		.select({
			town: tailorProfile.city,
			lat: tailorProfile.lat,
			lng: tailorProfile.lng,
			serviceRadiusKm: tailorProfile.serviceRadiusKm,
			hourlyRateMinor: tailorProfile.hourlyRateMinor,
			rateCurrency: tailorProfile.rateCurrency
		})
		.from(tailorProfile)
		.where(eq(tailorProfile.userId, sql.placeholder('tailorId')))
		.prepare('workroom_list_origin')
);

/** The few columns of the tailor's workroom a near-me list needs (null before the first section is saved). */
export async function listOrigin(db: Executor, { tailorId }: { tailorId: string }): Promise<ListOrigin | null> {
	const [row] = await originStatement(db).execute({ tailorId });
	if (!row) return null;
	const { town, lat, lng, serviceRadiusKm, hourlyRateMinor, rateCurrency } = row;
	return {
		location: { town, lat, lng },
		serviceRadiusKm,
		// As `getOwn` has it: a currency only with a rate.
		currency: hourlyRateMinor !== null && rateCurrency !== null ? rateCurrency : null
	};
}

/** The tailor's own workroom, or null before the first section is saved. */
export async function getOwn(db: Executor, { tailorId }: { tailorId: string }): Promise<OwnWorkroom | null> {
	const row = await readRow(db, tailorId);
	return row && toOwn(row);
}

/**
 * Saves any subset of the onboarding fields (one section, or all of them for a full replace) and keeps
 * `onboarded_at` in step. The first save must carry the name and the place: the row needs them.
 */
export async function save(
	db: Executor,
	{ tailorId, input, ip = null }: { tailorId: string; input: WorkroomInput; ip?: string | null }
): Promise<{ workroom: OwnWorkroom; onboarding: OnboardingStatus }> {
	return db.transaction(async (tx) => {
		const place = input.location && (await resolveLocation(tx, input.location));
		const values = columnsFor(input, place);
		const existing = await readRow(tx, tailorId, { lock: true });
		if (!existing) await insertRow(tx, tailorId, values);
		else if (Object.keys(values).length) {
			await tx.update(tailorProfile).set(values).where(eq(tailorProfile.userId, tailorId));
		}
		await audit.record(tx, {
			actorId: tailorId,
			ip,
			action: existing ? 'workroom.updated' : 'workroom.created',
			subjectType: 'tailor_profile',
			subjectId: tailorId,
			data: { fields: Object.keys(input).sort() }
		});
		const row = (await readRow(tx, tailorId))!;
		await noteWorkroomChanged(tx, tailorId);
		const { status, onboardedAt } = await syncOnboarding(tx, tailorId, row);
		return { workroom: toOwn({ ...row, onboardedAt }), onboarding: status };
	});
}

/**
 * What is still missing before the workroom can quote. Also brings `onboarded_at` back in step when
 * something outside this area changed it (the last portfolio photo removed, say): call it after such changes.
 */
export async function onboardingStatus(db: Executor, { tailorId }: { tailorId: string }): Promise<OnboardingStatus> {
	return (await home(db, { tailorId })).onboarding;
}

const homeStatement = preparedPer((db) =>
	db
		.select({
			...ownColumns,
			// Qualified: Drizzle writes a one-table select's columns bare, and the subquery has tables of its own.
			hasPortfolioPhoto: portfolio.hasPhotoExpression(sql`${tailorProfile}.${sql.identifier('user_id')}`),
			payoutsReady: payoutsReadyColumn
		})
		.from(tailorProfile)
		.where(eq(tailorProfile.userId, sql.placeholder('tailorId')))
		.prepare('workroom_home')
);

/**
 * What the workroom home shows about the tailor's own workroom, in one statement: the workroom (null before
 * the first section is saved), its onboarding status and whether payouts are ready. Like `onboardingStatus`,
 * it brings `onboarded_at` back in step when that has drifted (then, and only then, in a transaction).
 */
export async function home(
	db: Executor,
	{ tailorId }: { tailorId: string }
): Promise<{ workroom: OwnWorkroom | null; onboarding: OnboardingStatus; payoutsReady: boolean }> {
	const [found] = await homeStatement(db).execute({ tailorId });
	if (!found) return { workroom: null, onboarding: statusOf(null, 0), payoutsReady: false };
	const { hasPortfolioPhoto, payoutsReady, ...row } = found;
	let onboarding = statusOf(factsOf(row), hasPortfolioPhoto ? 1 : 0);
	let workroom: OwnWorkroom | null = toOwn(row);
	if (onboarding.complete !== (row.onboardedAt !== null)) {
		const synced = await db.transaction(async (tx) => {
			const locked = await readRow(tx, tailorId, { lock: true });
			return { row: locked, ...(await syncOnboarding(tx, tailorId, locked)) };
		});
		onboarding = synced.status;
		workroom = synced.row && toOwn({ ...synced.row, onboardedAt: synced.onboardedAt });
	}
	return { workroom, onboarding, payoutsReady };
}

/** Whether the tailor may send quotes: every onboarding step done. */
export async function canQuote(db: Executor, { tailorId }: { tailorId: string }): Promise<boolean> {
	return (await onboardingStatus(db, { tailorId })).complete;
}

const uuidPattern = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/** The public view of an onboarded workroom by slug or tailor id: its town, never its coordinates. */
export async function getPublic(db: Executor, { slugOrId }: { slugOrId: string }): Promise<PublicWorkroom | null> {
	// Slugs are lower-case words and hyphens; anything else names no workroom (and never reaches SQL).
	if (!uuidPattern.test(slugOrId) && !/^[a-z0-9-]{1,80}$/.test(slugOrId)) return null;
	const key = uuidPattern.test(slugOrId) ? eq(tailorProfile.userId, slugOrId) : eq(tailorProfile.slug, slugOrId);
	const [row] = await db
		.select({
			id: tailorProfile.userId,
			slug: tailorProfile.slug,
			name: tailorProfile.shopName,
			bio: tailorProfile.bio,
			specialties: tailorProfile.specialties,
			leadTimes: tailorProfile.leadTimes,
			town: tailorProfile.city,
			district: tailorProfile.district,
			country: tailorProfile.countryCode,
			serviceRadiusKm: tailorProfile.serviceRadiusKm,
			acceptingWork: tailorProfile.acceptingWork,
			ratingCount: tailorProfile.ratingCount,
			ratingAverageHundredths: tailorProfile.ratingAverageHundredths,
			memberSince: user.createdAt
		})
		.from(tailorProfile)
		.innerJoin(user, eq(user.id, tailorProfile.userId))
		.where(and(key, listed))
		.limit(1);
	if (!row) return null;
	return {
		id: row.id,
		slug: row.slug,
		name: row.name,
		bio: row.bio,
		specialties: (row.specialties as GarmentId[]).map((id) => ({ id, leadTimeDays: row.leadTimes[id] ?? null })),
		area: { town: row.town, district: row.district, country: row.country },
		serviceRadiusKm: row.serviceRadiusKm,
		acceptingWork: row.acceptingWork,
		memberSince: row.memberSince,
		reviews: reviewsOf(row),
		portfolio: await portfolio.listItems(db, { tailorId: row.id })
	};
}

export const directoryPageSize = 12;

/**
 * Onboarded workrooms by name, optionally in one town and making one garment; keyset-paged: `after`
 * is the slug of the last workroom shown.
 */
export async function listDirectory(
	db: Executor,
	{
		town,
		specialty,
		after,
		limit = directoryPageSize
	}: { town?: string; specialty?: GarmentId; after?: string; limit?: number }
): Promise<{ items: DirectoryEntry[]; next: string | null }> {
	const filters: (SQL | undefined)[] = [listed];
	if (town) filters.push(eq(tailorProfile.city, town));
	if (specialty) filters.push(arrayContains(tailorProfile.specialties, [specialty]));
	if (after) {
		filters.push(
			sql`(lower(${tailorProfile.shopName}), ${tailorProfile.userId}) > (select lower(p.shop_name), p.user_id from ${tailorProfile} p where p.slug = ${after})`
		);
	}
	const rows = await db
		.select({ ...cardColumns, acceptingWork: tailorProfile.acceptingWork })
		.from(tailorProfile)
		.innerJoin(user, eq(user.id, tailorProfile.userId))
		.where(and(...filters))
		.orderBy(sql`lower(${tailorProfile.shopName})`, tailorProfile.userId)
		.limit(limit + 1);
	const page = rows.slice(0, limit);
	return {
		items: await toCards(db, page),
		next: rows.length > limit ? (page.at(-1)?.slug ?? null) : null
	};
}

/** Towns with at least one listed workroom, for the directory's filter. */
export async function listTowns(db: Executor): Promise<string[]> {
	const rows = await db
		.selectDistinct({ town: tailorProfile.city })
		.from(tailorProfile)
		.innerJoin(user, eq(user.id, tailorProfile.userId))
		.where(listed)
		.orderBy(tailorProfile.city);
	return rows.map((row) => row.town);
}
export * as searchDocuments from './search-documents';
