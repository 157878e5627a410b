/**
 * Search near me: tailors browse open commissions (never their measurements), anyone finds workrooms
 * (never a workroom's exact point). Pages follow their areas: the tailor's browse page is the workroom's.
 */
import { eq } from 'drizzle-orm';
import { commissionMeasurements } from '../../../src/lib/server/db/schema';
import { createCommission } from '../../factories';
import { everyone, tailorApi, tailorPage, type Row, type World } from './matrix';

type Listed = { id: string; secrets: string[] };

/** An open commission near the actors' workrooms, with measurement values no list may carry. */
async function openNearby({ db, cast }: World): Promise<Listed> {
	const made = await createCommission(db, { customerId: cast.owner.id!, status: 'open', title: 'Listed skirt' });
	// Values no band edge or distance could spell: bands are shown, the measurements never are.
	await db
		.update(commissionMeasurements)
		.set({ valuesMm: { waist_girth: 741.37, hip_girth: 1003.19 } })
		.where(eq(commissionMeasurements.commissionId, made.id));
	return { id: made.id, secrets: ['741.37', '1003.19', '74.137', '100.319'] };
}

// The factory places workrooms and commissions in Merrowgate's Old Quay.
const merrowgate = '46.85,3.21';

export const searchRows: Row<Listed>[] = [
	{
		name: 'GET /api/v1/commissions (near me)',
		arrange: openNearby,
		send: (client) => client.json('GET', `/api/v1/commissions?near=${merrowgate}&radiusKm=5`),
		expect: tailorApi(200)
	},
	{
		name: 'GET /api/v1/commissions with a bad radius',
		arrange: openNearby,
		send: (client) => client.json('GET', `/api/v1/commissions?near=${merrowgate}&radiusKm=-3`),
		expect: tailorApi(400)
	},
	{
		name: 'GET /api/v1/tailors (near a point)',
		arrange: openNearby,
		send: (client) => client.json('GET', `/api/v1/tailors?near=${merrowgate}&radiusKm=5`),
		expect: everyone(200)
	},
	{
		name: 'GET /workroom/commissions',
		arrange: openNearby,
		send: (client) => client.get(`/workroom/commissions?near=${merrowgate}&radiusKm=5`),
		expect: tailorPage(200)
	},
	{
		name: 'GET /workrooms?near=…',
		arrange: openNearby,
		send: (client) => client.get(`/workrooms?near=${merrowgate}`),
		expect: everyone(200)
	}
];
