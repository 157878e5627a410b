/**
 * `npm run bench:pages`: Lighthouse (mobile, Debian's Chromium, no network beyond loopback) on the home
 * page, the calculator, the customer's commissions page and one of their commissions, and the tailor's workroom, against the
 * production build on a throwaway database with the demo seed. Prints the performance, accessibility and
 * best-practices scores, the main timings and the script each page loads (bytes as sent, compressed).
 */
import * as chromeLauncher from 'chrome-launcher';
import lighthouse from 'lighthouse';
import pg from 'pg';
import { signIn, startBenchEnvironment } from './bench/environment';
import { demoAccounts } from './bench/scenarios';
import { table } from './bench/stats';
import { chromiumFlags, chromiumPath } from './lib/chromium';
import { log } from './lib/local';

type Page = { name: string; path: string; as?: keyof typeof demoAccounts };

/** The demo customer's most recently changed open commission: the page with the quotes side by side. */
async function demoCommissionPath(databaseUrl: string) {
	const client = new pg.Client({ connectionString: databaseUrl });
	await client.connect();
	try {
		const { rows } = await client.query<{ id: string }>(
			`select c.id from commission c join "user" u on u.id = c.customer_id
			 where u.email = $1 and c.status = 'open' order by c.updated_at desc limit 1`,
			[demoAccounts.customer]
		);
		return rows[0] ? `/commissions/${rows[0].id}` : null;
	} finally {
		await client.end();
	}
}

type Audit = { numericValue?: number; details?: { items?: { resourceType?: string; transferSize?: number }[] } };

// `--only REGEX` measures only the pages whose name matches; `--details` also lists what shifted the layout and
// which scripts took the main thread's time, to find what a score is lost on.
const argv = process.argv.slice(2);
const onlyAt = argv.indexOf('--only');
const only = onlyAt >= 0 && argv[onlyAt + 1] ? new RegExp(argv[onlyAt + 1], 'i') : null;
const details = argv.includes('--details');

const environment = await startBenchEnvironment();
const commissionPath = await demoCommissionPath(environment.databaseUrl);
const allPages: Page[] = [
	{ name: 'home', path: '/' },
	{ name: 'how it works', path: '/how-it-works' },
	{ name: 'draft calculator', path: '/draft-calculator' },
	{ name: 'commissions (customer)', path: '/commissions', as: 'customer' },
	...(commissionPath ? [{ name: 'a commission (customer)', path: commissionPath, as: 'customer' as const }] : []),
	{ name: 'workroom (tailor)', path: '/workroom', as: 'tailor' }
];
const pages = allPages.filter((page) => !only || only.test(page.name));
const chrome = await chromeLauncher.launch({
	chromePath: chromiumPath,
	chromeFlags: ['--headless=new', ...chromiumFlags]
});
let failed = false;
try {
	const rows = [['page', 'performance', 'accessibility', 'best practices', 'FCP ms', 'LCP ms', 'TBT ms', 'script KB']];
	for (const page of pages) {
		const cookie = page.as ? await signIn(environment.appUrl, demoAccounts[page.as]) : undefined;
		log(`Lighthouse: ${page.name}`);
		const result = await lighthouse(
			environment.appUrl + page.path,
			{ port: chrome.port, output: 'json', logLevel: 'error', extraHeaders: cookie ? { cookie } : undefined },
			{
				extends: 'lighthouse:default',
				settings: { onlyCategories: ['performance', 'accessibility', 'best-practices'] }
			}
		);
		if (!result) throw new Error(`Lighthouse gave no result for ${page.path}`);
		const { categories, audits } = result.lhr;
		const score = (id: string) => String(Math.round((categories[id]?.score ?? 0) * 100));
		const ms = (id: string) => String(Math.round((audits[id] as Audit | undefined)?.numericValue ?? NaN));
		const requests = (audits['network-requests'] as Audit | undefined)?.details?.items ?? [];
		const scriptBytes = requests
			.filter((r) => r.resourceType === 'Script')
			.reduce((sum, r) => sum + (r.transferSize ?? 0), 0);
		rows.push([
			page.name,
			score('performance'),
			score('accessibility'),
			score('best-practices'),
			ms('first-contentful-paint'),
			ms('largest-contentful-paint'),
			ms('total-blocking-time'),
			(scriptBytes / 1024).toFixed(1)
		]);
		for (const [id, audit] of Object.entries(audits)) {
			const weighs = audit.scoreDisplayMode === 'binary' || audit.scoreDisplayMode === 'numeric';
			if (weighs && audit.score !== null && audit.score < 0.9 && !id.includes('paint') && id !== 'total-blocking-time')
				log(`  ${page.name}: ${id} — ${audit.title}${audit.displayValue ? ` (${audit.displayValue})` : ''}`);
			if (id === 'inspector-issues' && audit.score === 0) log(`    ${JSON.stringify(audit.details).slice(0, 600)}`);
			if (details && ['layout-shifts', 'bootup-time', 'long-tasks', 'mainthread-work-breakdown'].includes(id))
				log(
					`    ${id}: ${JSON.stringify(audit.details ?? audit.errorMessage ?? audit.scoreDisplayMode).slice(0, 1500)}`
				);
		}
	}
	console.log(`\nTackline pages under Lighthouse (mobile, Node ${process.version})\n`);
	console.log(table(rows));
} catch (error) {
	failed = true;
	console.error(error);
} finally {
	chrome.kill();
	await environment.stop();
}
process.exit(failed ? 1 : 0);
