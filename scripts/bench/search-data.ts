/**
 * The search bench's own data: 10 000 open commissions and 1 000 workrooms taking work, spread over a
 * region around Merrowgate (about 110 × 110 km), added to the bench database beside the demo seed and
 * written to the search outbox, so the app's sync job indexes them. Deterministic: a low-discrepancy
 * sequence places them, garments and budgets take turns.
 */
import pg from 'pg';

export const searchRegion = { lat: 46.35, lng: 2.48, spanLat: 1, spanLng: 1.46 };
/** Where the near-me baseline searches from: the demo tailor's workroom district (Old Quay). */
export const benchCentre = { lat: 46.8512, lng: 3.2089 };

export async function seedSearchData(databaseUrl: string, { commissions = 10_000, workrooms = 1_000 } = {}) {
	const pool = new pg.Pool({ connectionString: databaseUrl, max: 1 });
	const { lat, lng, spanLat, spanLng } = searchRegion;
	try {
		const {
			rows: [customer]
		} = await pool.query<{ id: string }>(`select id from "user" where email = 'customer@tackline.test'`);
		await pool.query(
			`insert into commission (customer_id, garment_type, title, style_notes, currency, budget_min_minor,
				budget_max_minor, date_needed, approx_lat, approx_lng, city, status, published_at, expires_at)
			select $1, (array['straight-skirt','tunic','shift-dress','a-line-skirt','wide-leg-trousers'])[1 + i % 5],
				'Bench commission ' || i, case when i % 7 = 0 then 'Linen, lined, with pockets' else 'Wool, unlined' end,
				'EUR', 6000 + (i % 9) * 1000, 11000 + (i % 9) * 1000, current_date + 20 + i % 90,
				$2 + ((i * 0.6180339887) - floor(i * 0.6180339887)) * $3,
				$4 + ((i * 0.7548776662) - floor(i * 0.7548776662)) * $5,
				'Merrowgate', 'open', now() - (i || ' minutes')::interval, now() + interval '30 days'
			from generate_series(1, $6::int) as i`,
			[customer.id, lat, spanLat, lng, spanLng, commissions]
		);
		await pool.query(
			`with made as (
				insert into "user" (email, name, role)
				select 'bench-tailor-' || i || '@example.test', 'Bench tailor ' || i, 'tailor'
				from generate_series(1, $5::int) as i
				returning id, split_part(split_part(email, '@', 1), '-', 3)::int as i
			)
			insert into tailor_profile (user_id, shop_name, slug, bio, specialties, city, lat, lng, service_radius_km, onboarded_at)
			select id, 'Bench workroom ' || i, 'bench-workroom-' || i, 'Made to measure and alterations',
				case when i % 2 = 0 then array['tunic','shift-dress'] else array['straight-skirt','wide-leg-trousers'] end,
				'Merrowgate', $1 + ((i * 0.5698402910) - floor(i * 0.5698402910)) * $2,
				$3 + ((i * 0.3247179572) - floor(i * 0.3247179572)) * $4, 15, now()
			from made`,
			[lat, spanLat, lng, spanLng, workrooms]
		);
		await pool.query(
			`insert into search_outbox (kind, entity_id)
			select 'commission'::search_document_kind, id from commission where title like 'Bench commission %'
			union all select 'workroom'::search_document_kind, user_id from tailor_profile where slug like 'bench-workroom-%'
			on conflict do nothing`
		);
		await pool.query('analyze');
	} finally {
		await pool.end();
	}
}

/** Waits until the sync job has emptied the outbox: the index then holds every bench document. */
export async function waitForIndex(databaseUrl: string, timeoutMs = 180_000) {
	const pool = new pg.Pool({ connectionString: databaseUrl, max: 1 });
	try {
		const deadline = Date.now() + timeoutMs;
		for (;;) {
			const { rows } = await pool.query<{ n: string }>('select count(*) as n from search_outbox');
			if (Number(rows[0].n) === 0) return;
			if (Date.now() > deadline) throw new Error(`the search index is still ${rows[0].n} documents behind`);
			await new Promise((resolve) => setTimeout(resolve, 1000));
		}
	} finally {
		await pool.end();
	}
}
