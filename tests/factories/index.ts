/**
 * Test data made directly in the test file's own database (see tests/integration/setup.ts): people of
 * any role, workrooms and commissions, each returning what a test needs to act on it.
 */
import { randomInt, randomUUID } from 'node:crypto';
import { hash } from '@node-rs/argon2';
import type { Executor } from '../../src/lib/server/db/client';
import {
	commission,
	commissionMeasurements,
	commissionSizeBand,
	measurementProfile,
	portfolioItem,
	portfolioPhoto,
	tailorProfile,
	user,
	type CommissionStatus,
	type NewCommission,
	type NewMeasurementProfile,
	type NewTailorProfile,
	type UserRole
} from '../../src/lib/server/db/schema';

// Only the db layer is imported, so factories stay usable from any area's specs without import cycles.
const place = { city: 'Merrowgate', district: 'Old Quay', lat: 46.8512, lng: 3.2089, currency: 'EUR' };

/** A password every factory-made person has unless told otherwise. */
export const knownPassword = 'harbour lantern quilting 47';

// argon2id (the library's default; sign-in verifies any stored parameters) is deliberately slow:
// hash each distinct password once per test file.
const hashes = new Map<string, Promise<string>>();
function hashOnce(password: string) {
	if (!hashes.has(password)) hashes.set(password, hash(password));
	return hashes.get(password)!;
}

let sequence = 0;
/** Unique within a run: a fresh database per file, and a random part for files sharing the mail stand-in. */
function unique(prefix: string) {
	sequence += 1;
	return `${prefix}-${Date.now().toString(36)}${randomInt(1000, 9999)}${sequence}`;
}

export type PersonOptions = {
	role?: UserRole;
	name?: string;
	email?: string;
	password?: string;
	suspended?: boolean | string;
};

export type Person = { id: string; email: string; password: string; role: UserRole; name: string };

/** A person who can sign in with `password` (the known one by default); `suspended` may give the reason. */
export async function createUser(db: Executor, options: PersonOptions = {}): Promise<Person> {
	const role = options.role ?? 'customer';
	const email = options.email ?? `${unique(role)}@example.test`;
	const name = options.name ?? `Test ${role}`;
	const password = options.password ?? knownPassword;
	const reason = typeof options.suspended === 'string' ? options.suspended : 'Suspended for a test';
	const [row] = await db
		.insert(user)
		.values({
			email,
			name,
			role,
			passwordHash: await hashOnce(password),
			emailVerified: new Date(),
			suspendedAt: options.suspended ? new Date() : null,
			suspendedReason: options.suspended ? reason : null
		})
		.returning({ id: user.id });
	return { id: row.id, email, password, role, name };
}

export type Workroom = Person & { shopName: string; slug: string };

/**
 * A tailor with a workroom in Merrowgate's Old Quay, accepting work unless the profile says otherwise.
 * Onboarding is complete (rates set, `onboarded_at` stamped) unless `onboarded: false`.
 */
export async function createWorkroom(
	db: Executor,
	options: PersonOptions & { profile?: Partial<Omit<NewTailorProfile, 'userId'>>; onboarded?: boolean } = {}
): Promise<Workroom> {
	const tailor = await createUser(db, { ...options, role: 'tailor' });
	const slug = options.profile?.slug ?? unique('workroom');
	const shopName = options.profile?.shopName ?? `Workroom ${slug}`;
	await db.insert(tailorProfile).values({
		city: place.city,
		district: place.district,
		lat: place.lat,
		lng: place.lng,
		specialties: ['straight-skirt', 'wide-leg-trousers'],
		...(options.onboarded === false
			? {}
			: {
					countryCode: 'FR',
					hourlyRateMinor: 2800,
					rateCurrency: 'EUR',
					onboardedAt: new Date(),
					// Payouts set up, as a quote must have before it can be accepted. No account at the processor:
					// tests that move money to the workroom onboard one through the stand-in.
					payoutStatus: 'enabled' as const
				}),
		...options.profile,
		userId: tailor.id,
		slug,
		shopName
	});
	return { ...tailor, shopName, slug };
}

/** Posted commissions carry a measurements snapshot, a size band and a publication time, as publishing writes them. */
const postedStatuses: CommissionStatus[] = ['open', 'awarded', 'closed', 'expired'];

/** A commission in any status; without `customerId` a new customer is made for it. */
export async function createCommission(
	db: Executor,
	options: { status?: CommissionStatus; customerId?: string } & Partial<
		Omit<NewCommission, 'status' | 'customerId'>
	> = {}
): Promise<{ id: string; customerId: string; status: CommissionStatus; title: string }> {
	const { status = 'open', customerId = (await createUser(db)).id, ...fields } = options;
	const posted = postedStatuses.includes(status);
	const title = fields.title ?? `Straight skirt ${unique('no')}`;
	const [row] = await db
		.insert(commission)
		.values({
			garmentType: 'straight-skirt',
			budgetMinMinor: 6000,
			budgetMaxMinor: 9000,
			currency: place.currency,
			city: place.city,
			district: place.district,
			approxLat: 46.85,
			approxLng: 3.21,
			publishedAt: posted ? new Date() : null,
			...fields,
			title,
			customerId,
			status
		})
		.returning({ id: commission.id });
	if (posted) {
		await db.insert(commissionMeasurements).values({
			commissionId: row.id,
			label: 'Measured for a test',
			valuesMm: { waist_girth: 740, hip_girth: 1000 }
		});
		await db.insert(commissionSizeBand).values([
			{ commissionId: row.id, dimension: 'waist_girth', position: 1, lowerMm: 720, upperMm: 760 },
			{ commissionId: row.id, dimension: 'hip_girth', position: 2, lowerMm: 980, upperMm: 1020 }
		]);
	}
	return { id: row.id, customerId, status, title };
}

/** A measurement profile owned by `ownerId`; values in millimetres. */
export async function createMeasurementProfile(
	db: Executor,
	options: { ownerId: string } & Partial<Omit<NewMeasurementProfile, 'ownerId'>>
): Promise<{ id: string; label: string }> {
	const label = options.label ?? unique('Profile');
	const [row] = await db
		.insert(measurementProfile)
		.values({ valuesMm: { waist_girth: 740, hip_girth: 1000, waist_to_hip: 205 }, takenBy: 'self', ...options, label })
		.returning({ id: measurementProfile.id });
	return { id: row.id, label };
}

/** Body measurements enough for the skirts and trousers the tests commission, in millimetres. */
export const customerMeasurementsMm = {
	waist_girth: 740,
	hip_girth: 1000,
	waist_to_hip: 205,
	waist_to_floor: 1040,
	body_rise: 275,
	thigh_girth: 580,
	inside_leg: 760
};

/** A customer with one measurement profile, "Me" in centimetres, ready to commission with. */
export async function createCustomerWithProfile(
	db: Executor,
	options: PersonOptions & { valuesMm?: Record<string, number> } = {}
): Promise<{ person: Person; profileId: string }> {
	const { valuesMm = customerMeasurementsMm, ...personOptions } = options;
	const person = await createUser(db, personOptions);
	const profile = await createMeasurementProfile(db, { ownerId: person.id, label: 'Me', unit: 'cm', valuesMm });
	return { person, profileId: profile.id };
}

/** A portfolio item with one photo row for a workroom, as the portfolio area stores it (no stored image). */
export async function createPortfolioPhoto(db: Executor, { tailorId, altText }: { tailorId: string; altText: string }) {
	const [item] = await db
		.insert(portfolioItem)
		.values({ tailorId, caption: 'Herringbone wide-leg trousers', garmentType: 'wide-leg-trousers' })
		.returning({ id: portfolioItem.id });
	const key = `photos/${randomUUID().replaceAll('-', '')}`;
	await db.insert(portfolioPhoto).values({
		itemId: item.id,
		storageKey: `${key}/full.webp`,
		thumbKey: `${key}/thumb.webp`,
		contentType: 'image/webp',
		bytes: 1000,
		width: 800,
		height: 600,
		altText
	});
	return item.id;
}
