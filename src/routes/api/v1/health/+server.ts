import { json } from '@sveltejs/kit';
import * as health from '$lib/server/health';
import type { RequestHandler } from './$types';

/** 200 while the database answers (mail or jobs may be degraded); 503 when it does not. */
export const GET: RequestHandler = async ({ locals }) => {
	const report = await health.report(locals.db, { withDetails: locals.user?.role === 'admin' });
	return json(report, { status: report.status === 'down' ? 503 : 200, headers: { 'cache-control': 'no-store' } });
};
