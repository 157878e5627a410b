/**
 * Demo orders in every stage, made the way people make them: the tailor's quote is accepted through the quotes
 * area, the customer pays on the payment stand-in's hosted page with Stripe's working test card (the order is
 * funded from the paid Checkout Session, as the return page does), and the tailor and customer then take it
 * through the lifecycle's own transitions — progress, fittings, delivery, confirmation — with the release
 * transfer made by the release job's own function. So the ledger, the payment rows, the notifications and the
 * stand-in's balances agree, as they would after a real week in Merrowgate.
 *
 * Needs the payment stand-in (`STRIPE_API_HOST`, `STRIPE_STANDIN_URL`): under `npm start` and `npm test` the
 * stand-ins are up before the seed. Without it only the order awaiting payment is made. Idempotent: a
 * commission that already has an order is left as it is, whatever the demo did with it since.
 */
import { DateTime } from 'luxon';
import { StripeStandinController, TEST_CARDS } from '../../docker/standins/stripe-controller';
import type { Database } from '../../src/lib/server/db/client';
import { quote, type NewQuote } from '../../src/lib/server/db/schema';
import { openThread } from '../../src/lib/server/messages/threads';
import { currency, timeZone } from './city';
import { demoId } from './ids';
import { personId } from './people';
import { dateFrom, daysFrom } from './time';

/** How far along the demo takes each order. */
type Stage = 'awaiting_payment' | 'funded' | 'in_work' | 'ready' | 'delivered' | 'released';
const path: Stage[] = ['awaiting_payment', 'funded', 'in_work', 'ready', 'delivered', 'released'];
const reached = (stage: Stage, step: Stage) => path.indexOf(stage) >= path.indexOf(step);

type ProgressLine = { step: 'fabric_sourced' | 'pattern_drafted' | 'cutting' | 'sewing' | 'finishing'; note: string };

type DemoOrder = {
	/** The demo commission (./commissions.ts) and the quote accepted on it. */
	commission: number;
	quote: number;
	customer: string;
	tailor: string;
	stage: Stage;
	priceMinor: number;
	deliveryInDays: number;
	fittingsIncluded: number;
	fabricIncluded: boolean;
	message: string;
	progress?: ProgressLine[];
	/** Fitting times offered (days ahead, wall-clock in the workroom's zone); `book` books the first one. */
	fittings?: { days: number; time: string }[];
	book?: boolean;
	/** Where and when to collect it, as the tailor writes it when marking the order delivered. */
	pickupNote?: string;
	/** Sent by courier instead, with this tracking reference. */
	courier?: string;
	/** A few messages on the order's conversation, oldest first; the last one waits unread for the other person. */
	chat?: { from: 'customer' | 'tailor'; body: string }[];
};

const atObi = 'Obi Cut & Stitch, 4 Harbour Steps, Old Quay — Tuesday to Saturday, 10:00 to 18:00. Ring the top bell.';

const customer = 'customer@tackline.test';
const tailor = 'tailor@tackline.test';

const demoOrders: DemoOrder[] = [
	{
		commission: 11,
		quote: 9,
		customer,
		tailor,
		stage: 'awaiting_payment',
		priceMinor: 12400,
		deliveryInDays: 40,
		fittingsIncluded: 1,
		fabricIncluded: true,
		message:
			'I have a mid-grey flannel from the Loomside mill that presses beautifully; the lining would be a pale grey cupro. One fitting before the waistband goes on.'
	},
	{
		commission: 12,
		quote: 10,
		customer,
		tailor,
		stage: 'in_work',
		priceMinor: 18600,
		deliveryInDays: 30,
		fittingsIncluded: 1,
		fabricIncluded: true,
		message:
			'A washed terracotta linen would suit this. Bound seams inside, and pockets deep enough for a phone. One fitting once the bodice is tacked.',
		progress: [
			{ step: 'fabric_sourced', note: 'Three metres of washed terracotta linen from the Saltmarket cloth hall.' },
			{ step: 'pattern_drafted', note: 'Drafted from your measurements with 6 cm of ease at the hip for linen.' },
			{ step: 'cutting', note: 'Cut on the straight grain; pockets and binding cut from the same length.' }
		],
		fittings: [
			{ days: 5, time: '10:00' },
			{ days: 6, time: '17:30' }
		],
		chat: [
			{
				from: 'tailor',
				body: 'The linen is cut. I have offered two fitting times; the bodice will be tacked, so wear a thin top.'
			},
			{ from: 'customer', body: 'Lovely, thank you. I will book once I know my shifts for next week.' }
		]
	},
	{
		commission: 13,
		quote: 11,
		customer,
		tailor,
		stage: 'ready',
		priceMinor: 19200,
		deliveryInDays: 12,
		fittingsIncluded: 2,
		fabricIncluded: true,
		message:
			'A charcoal worsted, 260 g/m², holds a pleat well. A calico fitting first, then one in the cloth before I hem them to your shoes.',
		progress: [
			{ step: 'fabric_sourced', note: 'Charcoal worsted from the Northmere cloth market.' },
			{ step: 'pattern_drafted', note: 'High waist drafted 2 cm above the natural waist, as you asked.' },
			{ step: 'cutting', note: 'Cut with 4 cm inlays at the centre back seam, so they can be let out later.' },
			{ step: 'sewing', note: 'Pleats pressed and stitched down 3 cm; pockets bagged in cotton.' },
			{ step: 'finishing', note: 'Hem left basted until the last fitting, so the length suits your shoes.' }
		],
		fittings: [
			{ days: 3, time: '11:00' },
			{ days: 4, time: '18:00' }
		],
		book: true,
		chat: [
			{ from: 'customer', body: 'I have booked Saturday morning. Should I bring the loafers or the boots?' },
			{ from: 'tailor', body: 'The loafers, please: they are what you will wear most with these. See you on Saturday.' }
		]
	},
	{
		commission: 14,
		quote: 12,
		customer,
		tailor,
		stage: 'delivered',
		priceMinor: 8800,
		deliveryInDays: 6,
		fittingsIncluded: 1,
		fabricIncluded: false,
		message: 'For the making, in the twill you bring. Patch pockets topstitched in a matching thread.',
		pickupNote: atObi,
		chat: [
			{ from: 'tailor', body: 'It is ready on the rail by the door. Try it on at home and tell me how the waist sits.' }
		],
		progress: [
			{ step: 'pattern_drafted', note: 'Drafted a straight skirt block from your measurements.' },
			{ step: 'sewing', note: 'Zip set by hand; pockets topstitched twice.' }
		]
	},
	{
		commission: 15,
		quote: 13,
		customer,
		tailor,
		stage: 'released',
		priceMinor: 14500,
		deliveryInDays: 5,
		fittingsIncluded: 1,
		fabricIncluded: true,
		message: 'A cream cotton-linen that does not show through; one fitting for the length.',
		pickupNote: atObi,
		progress: [
			{ step: 'fabric_sourced', note: 'Cream cotton-linen, washed twice so it will not shrink on you.' },
			{ step: 'cutting', note: 'Cut; the elastic back is a 3 cm soft waistband elastic.' },
			{ step: 'sewing', note: 'Sewn and pressed.' }
		]
	},
	{
		commission: 16,
		quote: 14,
		customer: 'tamsin.oyelaran@tackline.test',
		tailor: 'sunniva.crale@tackline.test',
		stage: 'funded',
		priceMinor: 11200,
		deliveryInDays: 32,
		fittingsIncluded: 1,
		fabricIncluded: true,
		message: 'Bottle-green needlecord from my usual supplier; one fitting for the hem length.',
		progress: [{ step: 'fabric_sourced', note: 'Needlecord ordered; it arrives at the workroom on Thursday.' }]
	},
	{
		commission: 17,
		quote: 15,
		customer: 'tamsin.oyelaran@tackline.test',
		tailor: 'sunniva.crale@tackline.test',
		stage: 'released',
		priceMinor: 23800,
		deliveryInDays: 8,
		fittingsIncluded: 2,
		fabricIncluded: true,
		message: 'A dusty-blue crepe, tried first in calico. Lined in cotton lawn so it breathes in a warm church.',
		courier: 'MGP 4471 2093 KX',
		progress: [
			{ step: 'fabric_sourced', note: 'Dusty-blue crepe and cotton lawn lining.' },
			{ step: 'pattern_drafted', note: 'Bodice darts placed from the calico fitting.' },
			{ step: 'sewing', note: 'Lining bagged in; invisible zip set.' }
		]
	}
];

/** The quotes the demo orders come from, sent a few days after each commission was posted. */
export function demoOrderQuotes(now: Date): NewQuote[] {
	return demoOrders.map((o) => ({
		id: demoId('quote', o.quote),
		commissionId: demoId('commission', o.commission),
		tailorId: personId(o.tailor),
		priceMinor: o.priceMinor,
		currency,
		deliveryDate: dateFrom(now, o.deliveryInDays),
		fittingsIncluded: o.fittingsIncluded,
		fabricIncluded: o.fabricIncluded,
		message: o.message,
		validUntil: daysFrom(now, 14),
		createdAt: daysFrom(now, -2)
	}));
}

/** Loaded after the Kit shims are registered: the domain areas import `$lib/…` and `$env/…`. */
async function domain() {
	// Under Vitest, Vite already resolves them.
	if (!process.env.VITEST) await import('../lib/kit-modules');
	const [quotes, orders, payments, fittings, notifications, runner] = await Promise.all([
		import('../../src/lib/server/quotes'),
		import('../../src/lib/server/orders'),
		import('../../src/lib/server/payments'),
		import('../../src/lib/server/fittings'),
		import('../../src/lib/server/notifications'),
		import('../../src/lib/server/jobs/runner')
	]);
	const messages = await import('../../src/lib/server/messages');
	return { quotes, orders, payments, fittings, notifications, messages, runner };
}

type Domain = Awaited<ReturnType<typeof domain>>;
type Actor = { id: string; role: 'customer' | 'tailor'; ip: null };

const actorOf = (email: string, role: Actor['role']): Actor => ({ id: personId(email), role, ip: null });

/** A wall-clock time `days` ahead in the demo city, as a tailor types it into the offer form. */
function localStart(days: number, time: string) {
	const [hour, minute] = time.split(':').map(Number);
	return DateTime.now()
		.setZone(timeZone)
		.plus({ days })
		.set({ hour, minute, second: 0, millisecond: 0 })
		.toFormat("yyyy-MM-dd'T'HH:mm");
}

/** Pays an order on the hosted page with the working test card and funds it from the paid session. */
async function pay(db: Database, d: Domain, orderId: string, payer: Actor, standin: StripeStandinController) {
	const { url, sessionId } = await d.payments.startCheckout(db, { orderId, actor: payer });
	const page = await standin.pay(url, TEST_CARDS.success);
	if (page.status !== 303) throw new Error(`The payment stand-in refused the demo card (${page.status})`);
	const state = await d.payments.syncFromSession(db, { sessionId, orderId });
	if (!state.paid) throw new Error(`Demo order ${orderId} is not paid after paying`);
}

async function takeThrough(db: Database, d: Domain, o: DemoOrder, standin: StripeStandinController | null) {
	const buyer = actorOf(o.customer, 'customer');
	const maker = actorOf(o.tailor, 'tailor');
	const accepted = await d.quotes.accept(db, {
		quoteId: demoId('quote', o.quote),
		commissionId: demoId('commission', o.commission),
		actor: buyer
	});
	const orderId = accepted.orderId;
	if (o.stage === 'awaiting_payment' || !standin) return;

	await pay(db, d, orderId, buyer, standin);
	for (const line of o.progress ?? [])
		await d.orders.postProgress(db, { orderId, actor: maker, input: { step: line.step, note: line.note } });
	if (o.fittings?.length) {
		const offered = await d.fittings.offer(db, {
			orderId,
			actor: maker,
			request: {
				timeZone,
				slots: o.fittings.map((f) => ({
					start: localStart(f.days, f.time),
					durationMinutes: 45,
					placeKind: 'workroom' as const,
					address: '',
					notes: 'Bring the shoes you mean to wear with it.'
				}))
			}
		});
		if (o.book) await d.fittings.book(db, { fittingId: offered[0].id, actor: buyer });
	}
	await converse(db, d, o, { customer: buyer, tailor: maker });
	if (reached(o.stage, 'ready')) await d.orders.markReady(db, { orderId, actor: maker });
	if (reached(o.stage, 'delivered'))
		await d.orders.markDelivered(db, {
			orderId,
			actor: maker,
			input: o.courier
				? { method: 'courier', trackingReference: o.courier, note: 'Merrowgate Parcel Post, signed for.' }
				: { method: 'pickup', note: o.pickupNote ?? '' }
		});
	if (reached(o.stage, 'released')) {
		await d.orders.confirmDelivery(db, { orderId, actor: buyer });
		// What the `order-release` job runs; the job itself, queued by the confirmation, then finds nothing to do.
		await d.payments.runRelease(db, { orderId });
	}
}

/**
 * Someone coming back to the demo has read what came before: of the notices about each page, only the newest
 * stays unread (marked read as the notifications page does), so the bell counts what is new, not the whole week.
 */
async function leaveNewestUnread(db: Database, d: Domain, userId: string) {
	const seen = new Set<string>();
	const older: string[] = [];
	let cursor: string | undefined;
	do {
		const page = await d.notifications.list(db, { userId, cursor, limit: 100 });
		for (const notice of page.items) {
			if (notice.read) continue;
			if (seen.has(notice.href)) older.push(notice.id);
			else seen.add(notice.href);
		}
		cursor = page.nextCursor ?? undefined;
	} while (cursor);
	await d.notifications.markRead(db, { userId, ids: older });
}

/** Posts the order's messages as the two people would, and has each read what came before their own last word. */
async function converse(db: Database, d: Domain, o: DemoOrder, people: Record<'customer' | 'tailor', Actor>) {
	if (!o.chat?.length) return;
	const threadId = await d.messages.threadIdFor(db, {
		commissionId: demoId('commission', o.commission),
		tailorId: people.tailor.id
	});
	if (!threadId) return;
	for (const line of o.chat) await d.messages.post(db, { threadId, actor: people[line.from], body: line.body });
	await d.messages.markRead(db, { threadId, viewer: people[o.chat[o.chat.length - 1].from] });
}

function standinController(): StripeStandinController | null {
	const url = process.env.STRIPE_STANDIN_URL;
	return url && process.env.STRIPE_API_HOST ? new StripeStandinController(url) : null;
}

/** Makes each demo order whose commission has none yet. Returns how many were made. */
export async function seedDemoOrders(db: Database, now: Date): Promise<number> {
	const quotes = demoOrderQuotes(now);
	await db.insert(quote).values(quotes).onConflictDoNothing();
	// Sending a quote opens the conversation between the two; the order page links to it.
	for (const q of quotes) await openThread(db, { commissionId: q.commissionId, tailorId: q.tailorId });
	const d = await domain();
	const waiting: DemoOrder[] = [];
	for (const o of demoOrders) {
		const existing = await d.orders.getForParty(db, {
			viewerId: personId(o.customer),
			commissionId: demoId('commission', o.commission)
		});
		if (!existing) waiting.push(o);
	}
	if (waiting.length === 0) return 0;

	// Links in the notices and the payment page's return address need the public origin; `npm start` sets it.
	process.env.ORIGIN ||= 'http://localhost:3000';
	// Notices are queued as jobs, so the queues must exist (the app makes them too when it starts); no workers here.
	await d.runner.startJobs({});
	try {
		if (!d.runner.jobsRunning()) throw new Error('The job queue could not be started for the demo orders');
		const standin = standinController();
		for (const o of waiting) await takeThrough(db, d, o, standin);
		const people = new Set(waiting.flatMap((o) => [personId(o.customer), personId(o.tailor)]));
		for (const userId of people) await leaveNewestUnread(db, d, userId);
	} finally {
		await d.runner.stopJobs();
	}
	return waiting.length;
}
