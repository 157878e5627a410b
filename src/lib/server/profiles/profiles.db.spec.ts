import { afterAll, describe, expect, it } from 'vitest';
import { createUser } from '../../../../tests/factories';
import { createDb } from '../db/client';
import * as profiles from './index';

const { db, pool } = createDb(process.env.DATABASE_URL!, { max: 2 });
afterAll(() => pool.end());

const fields = (overrides: Partial<profiles.ProfileFields> = {}): profiles.ProfileFields => ({
	label: 'Me',
	unit: 'cm',
	valuesMm: { waist_girth: 720, hip_girth: 960 },
	takenBy: 'self',
	takenAt: null,
	notes: '',
	...overrides
});

describe('measurement profiles', () => {
	it('belong to their owner: others get null, false, or their own list', async () => {
		const [owner, other] = await Promise.all([createUser(db), createUser(db)]);
		const profile = await profiles.create(db, { ownerId: owner.id, fields: fields() });
		expect(await profiles.get(db, { ownerId: other.id, id: profile.id })).toBeNull();
		expect(await profiles.update(db, { ownerId: other.id, id: profile.id, changes: { label: 'Mine' } })).toBeNull();
		expect(await profiles.remove(db, { ownerId: other.id, id: profile.id })).toBe(false);
		expect(await profiles.snapshotFor(db, { ownerId: other.id, id: profile.id })).toBeNull();
		expect(await profiles.list(db, { ownerId: other.id })).toEqual([]);
		expect((await profiles.get(db, { ownerId: owner.id, id: profile.id }))?.label).toBe('Me');
	});

	it('keep labels unique per owner whatever the case, but not across owners', async () => {
		const [owner, other] = await Promise.all([createUser(db), createUser(db)]);
		await profiles.create(db, { ownerId: owner.id, fields: fields({ label: 'My son' }) });
		await expect(profiles.create(db, { ownerId: owner.id, fields: fields({ label: 'my SON' }) })).rejects.toThrow(
			profiles.DuplicateLabel
		);
		await expect(
			profiles.create(db, { ownerId: other.id, fields: fields({ label: 'My son' }) })
		).resolves.toMatchObject({
			label: 'My son'
		});
	});

	it('freeze a snapshot for a commission that later edits do not reach', async () => {
		const owner = await createUser(db);
		const takenAt = new Date('2026-10-05T00:00:00Z');
		const profile = await profiles.create(db, { ownerId: owner.id, fields: fields({ takenBy: 'tailor', takenAt }) });
		const snapshot = await profiles.snapshotFor(db, { ownerId: owner.id, id: profile.id });
		expect(snapshot).toEqual({
			profileId: profile.id,
			label: 'Me',
			unit: 'cm',
			valuesMm: { waist_girth: 720, hip_girth: 960 },
			takenBy: 'tailor',
			takenAt
		});
		await profiles.update(db, { ownerId: owner.id, id: profile.id, changes: { valuesPatch: { hip_girth: 100 } } });
		expect(snapshot?.valuesMm.hip_girth).toBe(960);
		expect((await profiles.get(db, { ownerId: owner.id, id: profile.id }))?.valuesMm.hip_girth).toBe(1000);
	});
});

describe('missingFor', () => {
	it('names what the garment’s template needs and the values lack', () => {
		expect(profiles.missingFor('straight-skirt', { waist_girth: 720, hip_girth: 960 })).toEqual(['waist_to_hip']);
		expect(profiles.missingFor('wide-leg-trousers', {})).toEqual(['hip_girth', 'waist_girth', 'thigh_girth']);
		expect(profiles.missingFor('other', {})).toEqual([]);
	});
});
