/**
 * What `npm run bench:http` loads, in one list. `target` says which server answers; `as` signs in a
 * demo account first and sends its cookie; `optional` scenarios are skipped when their route answers 404
 * (a feature not built yet).
 */
export type Target = 'app' | 'bare' | 'keyset' | 'nearby';

export type Scenario = {
	name: string;
	target: Target;
	path: string;
	method?: 'GET' | 'POST';
	body?: unknown;
	as?: 'customer' | 'tailor';
	/** A body of its own for the n-th request, so that nothing can be answered from what was worked out before. */
	bodyFor?: (n: number) => unknown;
	optional?: boolean;
	/** The answer expected; anything else counts as a failure. */
	status?: number;
};

/** The yardstick every ratio is taken against. */
export const baselineName = 'keyset list (node:http + pg)';

/** A trousers draft from the drafting API's own tests (inches). */
const trousersDraft = {
	garment: 'wide-leg-trousers',
	unit: 'in',
	measurements: { hip_girth: 40, waist_girth: 28, thigh_girth: 25 },
	options: { length: 45.5 }
};

export const scenarios: Scenario[] = [
	{ name: 'bare node:http 2 KB page', target: 'bare', path: '/' },
	{ name: baselineName, target: 'keyset', path: '/' },
	{ name: 'home, anonymous', target: 'app', path: '/' },
	{ name: 'how it works, anonymous', target: 'app', path: '/how-it-works' },
	{ name: 'draft calculator page', target: 'app', path: '/draft-calculator' },
	{ name: 'GET /api/v1/garments', target: 'app', path: '/api/v1/garments' },
	{ name: 'POST /api/v1/drafts', target: 'app', path: '/api/v1/drafts', method: 'POST', body: trousersDraft },
	{
		name: 'POST /api/v1/drafts, each body new',
		target: 'app',
		path: '/api/v1/drafts',
		method: 'POST',
		body: trousersDraft,
		// Hips from 40 in up in steps of a thousandth: a new draft each time, never one kept from before.
		bodyFor: (n) => ({
			...trousersDraft,
			measurements: { ...trousersDraft.measurements, hip_girth: 40 + (n % 4000) / 1000 }
		})
	},
	{ name: 'unknown /api/v1 path (404)', target: 'app', path: '/api/v1/no-such-thing', status: 404 },
	{ name: 'customer: commissions page', target: 'app', path: '/commissions', as: 'customer' },
	{ name: 'tailor: workroom home (near you)', target: 'app', path: '/workroom', as: 'tailor' },
	{ name: 'tailor: search API', target: 'app', path: '/api/v1/commissions?q=linen', as: 'tailor' }
];

/** Demo accounts from scripts/demo/people.ts. */
export const demoAccounts = { customer: 'customer@tackline.test', tailor: 'tailor@tackline.test' } as const;

/** The search bench's yardstick: the near-me keyset query answered by node:http + pg alone. */
export const searchBaselineName = 'near-me keyset (node:http + pg)';

/** `npm run bench:search`: the near-me lists over 10 000 open commissions and 1 000 workrooms. */
export const searchScenarios: Scenario[] = [
	{ name: searchBaselineName, target: 'nearby', path: '/' },
	{ name: 'tailor: near-me page (SSR)', target: 'app', path: '/workroom/commissions', as: 'tailor' },
	{ name: 'tailor: GET /api/v1/commissions', target: 'app', path: '/api/v1/commissions', as: 'tailor' },
	{
		name: 'tailor: API, newest, filtered',
		target: 'app',
		path: '/api/v1/commissions?sort=newest&garment=tunic&budgetMin=9000&radiusKm=25',
		as: 'tailor'
	},
	{ name: 'GET /api/v1/tailors near a point', target: 'app', path: '/api/v1/tailors?near=46.8512,3.2089&radiusKm=25' }
];
