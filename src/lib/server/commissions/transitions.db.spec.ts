import { and, eq, sql } from 'drizzle-orm';
import PgBoss from 'pg-boss';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { createCommission, createUser, createWorkroom } from '../../../../tests/factories';
import { createDb } from '../db/client';
import {
	auditEvent,
	commission,
	commissionMeasurements,
	commissionSizeBand,
	measurementProfile,
	quote
} from '../db/schema';
import { queueNames } from '../jobs';
import { cancel, createDraft, editOpen, expireDue, publish, updateDraft, type Actor } from '.';

// Kit's env module is fixed when vitest starts; this file's database is chosen by the setup after that.
vi.mock('$env/dynamic/private', () => ({ env: { ...process.env, ORIGIN: 'http://localhost:5173' } }));

const { db, pool } = createDb(process.env.DATABASE_URL!, { max: 2 });
afterAll(() => pool.end());
// No server works the queue here: pg-boss's schema and the mail queue are made as the app's start would.
beforeAll(async () => {
	const boss = new PgBoss({ connectionString: process.env.DATABASE_URL!, supervise: false, schedule: false });
	await boss.start();
	await boss.createQueue(queueNames.mail);
	await boss.stop({ graceful: false, wait: true });
});

const today = '2026-12-02';

async function customer(): Promise<Actor & { profileId: string }> {
	const person = await createUser(db);
	const [profile] = await db
		.insert(measurementProfile)
		.values({
			ownerId: person.id,
			label: 'Me',
			unit: 'in',
			valuesMm: { bust_girth: 920, waist_girth: 740, hip_girth: 1000, shoulder_width: 385 }
		})
		.returning({ id: measurementProfile.id });
	return { id: person.id, role: 'customer', profileId: profile.id };
}

async function readyDraft(actor: Actor & { profileId: string }, garmentType: 'tunic' | 'other' = 'tunic') {
	return createDraft(db, {
		actor,
		today,
		changes: {
			garmentType,
			garmentOther: garmentType === 'other' ? 'Waistcoat' : '',
			title: 'A tunic for the summer',
			measurementProfileId: actor.profileId,
			budgetMinMinor: 5000,
			budgetMaxMinor: 8000,
			currency: 'EUR',
			dateNeeded: '2027-02-01',
			place: { lat: 46.8512, lng: 3.2089, city: 'Merrowgate', district: 'Old Quay', countryCode: 'FR' }
		}
	});
}

async function auditCount(id: string, action: string) {
	const rows = await db
		.select()
		.from(auditEvent)
		.where(and(eq(auditEvent.subjectId, id), eq(auditEvent.action, action)));
	return rows.length;
}

describe('commission transitions', () => {
	it('lets only customers draft, and hides other people’s drafts', async () => {
		const tailor = await createWorkroom(db);
		await expect(
			createDraft(db, {
				actor: { id: tailor.id, role: 'tailor' },
				today,
				changes: { garmentType: 'tunic', title: 'Mine' }
			})
		).rejects.toMatchObject({ code: 'forbidden' });
		const draft = await readyDraft(await customer());
		const stranger = await customer();
		await expect(
			updateDraft(db, { id: draft.id, actor: stranger, today, changes: { title: 'Taken' } })
		).rejects.toMatchObject({
			code: 'not_found'
		});
	});

	it('returns the same draft when a creation is retried', async () => {
		const actor = await customer();
		const first = await readyDraft(actor);
		const retry = await readyDraft(actor);
		expect(retry.id).toBe(first.id);
	});

	it('publishes once: frozen measurements, the size band in mm, thirty days open, one audit event', async () => {
		const actor = await customer();
		const draft = await readyDraft(actor);
		const now = new Date('2026-12-02T10:00:00Z');
		const first = await publish(db, { id: draft.id, actor, today, now, openDays: 30 });
		const again = await publish(db, {
			id: draft.id,
			actor,
			today,
			now: new Date('2026-12-03T10:00:00Z'),
			openDays: 30
		});
		expect(first.commission).toMatchObject({
			status: 'open',
			publishedAt: now,
			expiresAt: new Date('2027-01-01T10:00:00Z')
		});
		expect(again.commission.publishedAt).toEqual(now);
		// A tunic is a top: bust and hip are its control dimensions (ISO 8559-2, from memory); EN 13402-3 puts
		// a 92 cm bust in the 90–94 band and a 100 cm hip in 98–102.
		expect(first.sizeBand).toEqual([
			{ dimension: 'bust_girth', lowerMm: 900, upperMm: 940 },
			{ dimension: 'hip_girth', lowerMm: 980, upperMm: 1020 }
		]);
		const [frozen] = await db
			.select()
			.from(commissionMeasurements)
			.where(eq(commissionMeasurements.commissionId, draft.id));
		expect(frozen).toMatchObject({
			profileId: actor.profileId,
			label: 'Me',
			unit: 'in',
			valuesMm: { waist_girth: 740 }
		});
		await db
			.update(measurementProfile)
			.set({ valuesMm: { waist_girth: 800 } })
			.where(eq(measurementProfile.id, actor.profileId));
		const [still] = await db
			.select()
			.from(commissionMeasurements)
			.where(eq(commissionMeasurements.commissionId, draft.id));
		expect(still.valuesMm.waist_girth).toBe(740);
		expect(await auditCount(draft.id, 'commission.published')).toBe(1);
	});

	it('publishes a garment of its own kind without a size band', async () => {
		const actor = await customer();
		const draft = await readyDraft(actor, 'other');
		const published = await publish(db, { id: draft.id, actor, today });
		expect(published.sizeBand).toEqual([]);
		expect(await db.select().from(commissionSizeBand).where(eq(commissionSizeBand.commissionId, draft.id))).toEqual([]);
	});

	it('refuses a past date and an upside-down budget', async () => {
		const actor = await customer();
		const draft = await readyDraft(actor);
		await expect(updateDraft(db, { id: draft.id, actor, today, changes: { dateNeeded: today } })).rejects.toMatchObject(
			{
				code: 'invalid',
				issues: [{ path: 'dateNeeded' }]
			}
		);
		await expect(
			updateDraft(db, { id: draft.id, actor, today, changes: { budgetMinMinor: 9000 } })
		).rejects.toMatchObject({
			issues: [{ path: 'budget' }]
		});
	});

	it('records an edit of an open commission once, and nothing for the same values again', async () => {
		const actor = await customer();
		const draft = await readyDraft(actor);
		await publish(db, { id: draft.id, actor, today });
		await editOpen(db, { id: draft.id, actor, today, changes: { title: 'A linen tunic' } });
		await editOpen(db, { id: draft.id, actor, today, changes: { title: 'A linen tunic' } });
		expect(await auditCount(draft.id, 'commission.edited')).toBe(1);
		await expect(
			editOpen(db, {
				id: draft.id,
				actor,
				today,
				changes: { measurementProfileId: actor.profileId, garmentType: 'shift-dress' }
			})
		).rejects.toMatchObject({ code: 'invalid', issues: [{ path: 'garmentType' }] });
	});

	it('cancels drafts and open commissions, not expired ones', async () => {
		const actor = await customer();
		const draft = await readyDraft(actor);
		expect((await cancel(db, { id: draft.id, actor })).status).toBe('cancelled');
		const expired = await createCommission(db, { customerId: actor.id, status: 'expired' });
		await expect(cancel(db, { id: expired.id, actor })).rejects.toMatchObject({ code: 'wrong_status' });
	});

	it('expires what is due, leaves a commission with an accepted quote, and does nothing the second time', async () => {
		const past = new Date(Date.now() - 60_000);
		const due = await createCommission(db, { status: 'open', expiresAt: past });
		const awardedLike = await createCommission(db, { status: 'open', expiresAt: past });
		const tailor = await createWorkroom(db);
		await db.insert(quote).values({
			commissionId: awardedLike.id,
			tailorId: tailor.id,
			priceMinor: 9000,
			currency: 'EUR',
			deliveryDate: '2027-01-20',
			fabricIncluded: false,
			validUntil: new Date(Date.now() + 86_400_000),
			status: 'accepted'
		});
		expect(await expireDue(db)).toBeGreaterThanOrEqual(1);
		expect(await expireDue(db)).toBe(0);
		const statuses = await db
			.select({ id: commission.id, status: commission.status })
			.from(commission)
			.where(sql`${commission.id} in (${due.id}, ${awardedLike.id})`);
		expect(Object.fromEntries(statuses.map((s) => [s.id, s.status]))).toEqual({
			[due.id]: 'expired',
			[awardedLike.id]: 'open'
		});
		expect(await auditCount(due.id, 'commission.expired')).toBe(1);
		const mails = await db.execute(
			sql`select data->>'subject' as subject from pgboss.job where name = ${queueNames.mail}`
		);
		expect(mails.rows.map((r) => r.subject)).toContain(`Your commission has closed without a tailor: ${due.title}`);
	});
});
