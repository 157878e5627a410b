/**
 * Every demo workroom can be paid: its payouts are set up. With the payment stand-in configured
 * (`STRIPE_API_HOST`), each gets a real Express account there, created through the SDK with the key the app
 * uses (`account:<tailor id>`) and taken through the stand-in's onboarding page; otherwise the workroom is marked
 * ready with a recognisable local id (`acct_demo_…`) that no processor knows.
 */
import { and, eq, inArray, ne } from 'drizzle-orm';
import Stripe from 'stripe';
import type { Database } from '../../src/lib/server/db/client';
import { tailorProfile } from '../../src/lib/server/db/schema';

function standinClient(): Stripe | null {
	const { STRIPE_SECRET_KEY: key, STRIPE_API_HOST: host, STRIPE_API_PORT: port } = process.env;
	if (!key || !host) return null;
	return new Stripe(key, {
		host,
		port: Number(port || 443),
		protocol: process.env.STRIPE_API_PROTOCOL === 'http' ? 'http' : 'https',
		telemetry: false
	});
}

/** Opens the onboarding link and agrees, as a tailor would on the stand-in's page. */
async function finishOnboarding(url: string, name: string) {
	const response = await fetch(url, {
		method: 'POST',
		headers: { 'content-type': 'application/x-www-form-urlencoded' },
		body: new URLSearchParams({ name, action: 'complete' }),
		redirect: 'manual'
	});
	await response.arrayBuffer();
	if (response.status >= 400) throw new Error(`The stand-in's onboarding page answered ${response.status}`);
}

export async function seedDemoPayouts(db: Database, tailorIds: string[]) {
	const waiting = await db
		.select({
			userId: tailorProfile.userId,
			slug: tailorProfile.slug,
			shopName: tailorProfile.shopName,
			countryCode: tailorProfile.countryCode
		})
		.from(tailorProfile)
		.where(and(inArray(tailorProfile.userId, tailorIds), ne(tailorProfile.payoutStatus, 'enabled')));
	if (waiting.length === 0) return;
	const stripe = standinClient();
	for (const workroom of waiting) {
		let accountId = `acct_demo_${workroom.slug.replace(/[^a-z0-9]/g, '_')}`;
		if (stripe) {
			const account = await stripe.accounts.create(
				{
					type: 'express',
					country: workroom.countryCode ?? undefined,
					capabilities: { transfers: { requested: true } },
					business_profile: { name: workroom.shopName },
					metadata: { tailor_id: workroom.userId }
				},
				{ idempotencyKey: `account:${workroom.userId}` }
			);
			accountId = account.id;
			if (!account.payouts_enabled) {
				const link = await stripe.accountLinks.create({
					account: account.id,
					type: 'account_onboarding',
					return_url: 'http://localhost:3000/workroom/payouts?returned=1',
					refresh_url: 'http://localhost:3000/workroom/payouts?refresh=1'
				});
				await finishOnboarding(link.url, workroom.shopName);
			}
		}
		await db
			.update(tailorProfile)
			.set({ payoutAccountId: accountId, payoutStatus: 'enabled' })
			.where(eq(tailorProfile.userId, workroom.userId));
	}
}
