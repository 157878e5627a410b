/**
 * The order page both parties share, and the lists that lead to it: who may see it (and its progress photos),
 * the status in plain words as the order moves, the timeline of payments and progress, the forms that keep
 * what was typed when refused, the customer's orders newest first and the workroom's board by stage.
 */
import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { order } from '../../src/lib/server/db/schema';
import { TEST_CARDS } from '../../docker/standins/stripe-controller';
import { createCommission, createUser, createWorkroom, type Person } from '../factories';
import { awardQuote, insertQuote } from '../factories/quotes';
import { noisy } from '../factories/images';
import { testDb } from './db';
import { baseUrl, newClient, signIn, type Client } from './http';
import { stripeControl } from './stripe';

const { db, pool } = testDb();
afterAll(() => pool.end());
const control = stripeControl();

async function signedIn(person: Person): Promise<Client> {
	const client = newClient();
	expect((await signIn(client, person.email, person.password)).status).toBe(303);
	return client;
}

async function until<T>(read: () => Promise<T>, done: (value: T) => boolean, timeoutMs = 10_000): Promise<T> {
	const deadline = Date.now() + timeoutMs;
	for (;;) {
		const value = await read();
		if (done(value) || Date.now() > deadline) return value;
		await new Promise((resolve) => setTimeout(resolve, 100));
	}
}

const statusOf = async (orderId: string) =>
	(await db.select({ status: order.status }).from(order).where(eq(order.id, orderId)))[0].status;

/** The page's HTML as text, with entities for quotes and apostrophes read back. */
async function pageText(client: Client, path: string) {
	const response = await client.get(path);
	const html = await response.text();
	return { status: response.status, html: html.replaceAll('&#39;', '’').replaceAll('&quot;', '"') };
}

/** A multipart form post (for the progress form's photo), as a browser without JavaScript sends it. */
async function postMultipart(client: Client, path: string, fields: Record<string, string | Blob>) {
	const body = new FormData();
	for (const [name, value] of Object.entries(fields)) body.append(name, value);
	const cookie = [...client.jar].map(([name, value]) => `${name}=${value}`).join('; ');
	return fetch(baseUrl + path, {
		method: 'POST',
		headers: { origin: baseUrl, 'x-forwarded-for': client.address, cookie, accept: 'text/html' },
		body,
		redirect: 'manual'
	});
}

type World = {
	orderId: string;
	commissionId: string;
	customer: Client;
	tailor: Client;
	otherCustomer: Client;
	otherTailor: Client;
	admin: Client;
	workroomName: string;
};

/** An order awaiting payment, due in `dueInDays`, between a fresh customer and a fresh workroom. */
async function makeOrder(dueInDays = 30, title = 'Linen wedding waistcoat'): Promise<World> {
	const customer = await createUser(db, { name: 'Morwenna Trevail' });
	const tailor = await createWorkroom(db);
	const made = await createCommission(db, { customerId: customer.id, status: 'open', title });
	const due = new Date(Date.now() + dueInDays * 86_400_000).toISOString().slice(0, 10);
	const q = await insertQuote(db, {
		commissionId: made.id,
		tailorId: tailor.id,
		priceMinor: 36_000,
		deliveryDate: due
	});
	const { orderId } = await awardQuote(db, { commissionId: made.id, quoteId: q.id, customerId: customer.id });
	const [otherCustomer, otherTailor, admin] = await Promise.all([
		createUser(db),
		createWorkroom(db),
		createUser(db, { role: 'admin' })
	]);
	return {
		orderId,
		commissionId: made.id,
		customer: await signedIn(customer),
		tailor: await signedIn(tailor),
		otherCustomer: await signedIn(otherCustomer),
		otherTailor: await signedIn(otherTailor),
		admin: await signedIn(admin),
		workroomName: tailor.shopName
	};
}

/** Pays the order on the stand-in's hosted page with `card`, as the customer would. */
async function pay(world: World, card: string) {
	const response = await world.customer.json('POST', `/api/v1/orders/${world.orderId}/checkout`);
	const { url } = (await response.json()) as { url: string };
	return control.pay(url, card);
}

describe('who sees an order page', () => {
	let world: World;
	beforeAll(async () => {
		world = await makeOrder();
	});

	it('shows the parties and admins the order, and answers 404 to everyone else as for a missing order', async () => {
		for (const client of [world.customer, world.tailor, world.admin])
			expect((await client.get(`/orders/${world.orderId}`)).status).toBe(200);
		const missing = await pageText(world.otherCustomer, `/orders/00000000-0000-4000-8000-000000000000`);
		expect(missing.status).toBe(404);
		for (const client of [world.otherCustomer, world.otherTailor]) {
			const page = await pageText(client, `/orders/${world.orderId}`);
			expect(page.status).toBe(404);
			expect(page.html).not.toContain('Linen wedding waistcoat');
		}
		expect((await newClient().get(`/orders/${world.orderId}`)).status).toBe(303);
	});

	it('tells each side where the order stands and what comes next, with the money split', async () => {
		const customer = await pageText(world.customer, `/orders/${world.orderId}`);
		expect(customer.html).toContain('Awaiting payment');
		expect(customer.html).toContain('Pay to start the work');
		// Whole amounts are written without cents.
		expect(customer.html).toMatch(/You pay<\/dt>\s*<dd[^>]*>€360</);
		expect(customer.html).toMatch(/Tackline’s fee \(10 %, from the price\)<\/dt>\s*<dd[^>]*>€36</);
		expect(customer.html).toMatch(/The workroom receives<\/dt>\s*<dd[^>]*>€324</);
		expect(customer.html).toContain(`/orders/${world.orderId}/paid?/pay`);
		const tailor = await pageText(world.tailor, `/orders/${world.orderId}`);
		expect(tailor.html).toContain('The customer pays next');
		expect(tailor.html).not.toContain(`/orders/${world.orderId}/paid?/pay`);
		// The tailor reads the customer's first name and initial, never the whole name.
		expect(tailor.html).toContain('Morwenna T.');
		expect(tailor.html).not.toContain('Trevail');
	});

	it('links the commission page to its order, for both parties', async () => {
		const owner = await pageText(world.customer, `/commissions/${world.commissionId}`);
		expect(owner.html).toContain(`href="/orders/${world.orderId}"`);
	});
});

describe('a declined card', () => {
	it('leaves the order unpaid and shows the card’s message on the order page', async () => {
		const world = await makeOrder();
		const refused = await pay(world, TEST_CARDS.declined);
		expect(refused.status).toBe(402);
		const page = await until(
			() => pageText(world.customer, `/orders/${world.orderId}`),
			(p) => p.html.includes('The last card attempt did not go through')
		);
		expect(page.html).toContain('The last card attempt did not go through');
		expect(page.html).toMatch(/declined/i);
		expect(page.html).toContain('Try again');
		expect(await statusOf(world.orderId)).toBe('awaiting_payment');
	});
});

describe('following the work', () => {
	let world: World;
	beforeAll(async () => {
		world = await makeOrder();
		const paid = await pay(world, TEST_CARDS.success);
		expect(paid.status).toBe(303);
		expect(
			await until(
				() => statusOf(world.orderId),
				(s) => s === 'funded'
			)
		).toBe('funded');
	});

	it('shows the payment as held, in the timeline and the money', async () => {
		const page = await pageText(world.customer, `/orders/${world.orderId}`);
		expect(page.html).toContain('Paid — held by Tackline until delivery is confirmed');
		expect(page.html).toContain('You paid; Tackline holds the money');
		expect(page.html).toMatch(/Held by Tackline now<\/dt>\s*<dd[^>]*>€360</);
	});

	it('refuses a progress post with a bad step and keeps the note typed', async () => {
		const response = await postMultipart(world.tailor, `/orders/${world.orderId}?/progress`, {
			step: 'knitting',
			note: 'Chalked the fronts; the wool is lovely'
		});
		expect(response.status).toBe(400);
		const html = (await response.text()).replaceAll('&#39;', '’');
		expect(html).toContain('Chalked the fronts; the wool is lovely');
		expect(html).toContain('Choose the step you have reached.');
	});

	it('takes a step with a photo and shows it to the parties and admins only', async () => {
		const photo = new Blob([new Uint8Array(await noisy(640, 480).jpeg().toBuffer())], { type: 'image/jpeg' });
		const response = await postMultipart(world.tailor, `/orders/${world.orderId}?/progress`, {
			step: 'cutting',
			note: 'Cut from the navy wool',
			photoAlt: 'Navy wool pieces on the cutting table',
			photo
		});
		expect(response.status).toBe(303);
		expect(response.headers.get('location')).toBe(`/orders/${world.orderId}?done=progress`);
		expect(await statusOf(world.orderId)).toBe('in_work');

		const page = await pageText(world.customer, `/orders/${world.orderId}`);
		expect(page.html).toContain('Cut from the navy wool');
		expect(page.html).toContain('Navy wool pieces on the cutting table');
		const thumb = page.html.match(/\/orders\/[0-9a-f-]{36}\/progress\/[0-9a-f-]{36}\/thumb/)?.[0];
		expect(thumb).toBeDefined();
		for (const client of [world.customer, world.tailor, world.admin]) {
			const image = await client.get(thumb!);
			expect(image.status).toBe(200);
			expect(image.headers.get('content-type')).toBe('image/webp');
			await image.arrayBuffer();
		}
		for (const client of [world.otherCustomer, world.otherTailor]) {
			const image = await client.get(thumb!);
			expect(image.status).toBe(404);
			await image.arrayBuffer();
		}
	});

	it('refuses a refused photo with its reason, keeping the note', async () => {
		const response = await postMultipart(world.tailor, `/orders/${world.orderId}?/progress`, {
			step: 'sewing',
			note: 'Sewing the lining',
			photo: new Blob([Buffer.from('<!doctype html><p>not a photo')], { type: 'image/jpeg' })
		});
		expect(response.status).toBeGreaterThanOrEqual(400);
		expect(response.status).toBeLessThan(500);
		const html = await response.text();
		expect(html).toContain('Sewing the lining');
	});

	it('does not let the customer or an outsider post progress', async () => {
		const customer = await world.customer.post(`/orders/${world.orderId}?/progress`, { step: 'sewing' });
		expect(customer.status).toBe(403);
		const outsider = await world.otherTailor.post(`/orders/${world.orderId}?/progress`, { step: 'sewing' });
		expect(outsider.status).toBe(404);
	});

	it('asks a courier delivery for its tracking reference, keeping the note', async () => {
		const response = await world.tailor.post(`/orders/${world.orderId}?/deliver`, {
			method: 'courier',
			trackingReference: '',
			note: 'Sent in a garment box'
		});
		expect(response.status).toBe(400);
		const html = await response.text();
		expect(html).toContain('Enter the courier’s tracking reference.');
		expect(html).toContain('Sent in a garment box');
	});

	it('shows the courier and its tracking reference once delivered, and asks the customer to confirm', async () => {
		const response = await world.tailor.post(`/orders/${world.orderId}?/deliver`, {
			method: 'courier',
			trackingReference: 'MG-4471-2209',
			note: 'Sent in a garment box'
		});
		expect(response.status).toBe(303);
		expect(await statusOf(world.orderId)).toBe('delivered');
		const page = await pageText(world.customer, `/orders/${world.orderId}`);
		expect(page.html).toContain('Sent by courier');
		expect(page.html).toContain('MG-4471-2209');
		expect(page.html).toContain('Delivered — held by Tackline until you confirm');
		expect(page.html).toContain('?ask=confirm');
		// Confirming is behind a second step that says what it does.
		const asked = await pageText(world.customer, `/orders/${world.orderId}?ask=confirm`);
		expect(asked.html).toContain('Confirm delivery and pay the workroom?');
		expect(asked.html).toMatch(/This\s+cannot be undone\./);
	});

	it('keeps the alteration form’s text when it is refused, and pauses the release when asked', async () => {
		const empty = await world.customer.post(`/orders/${world.orderId}?/alteration`, { note: '   ' });
		expect(empty.status).toBe(400);
		expect(await empty.text()).toContain('Say what needs altering.');
		const asked = await world.customer.post(`/orders/${world.orderId}?/alteration`, {
			note: 'Let the back seam out by a centimetre'
		});
		expect(asked.status).toBe(303);
		const page = await pageText(world.tailor, `/orders/${world.orderId}`);
		expect(page.html).toContain('Alteration asked for');
		expect(page.html).toContain('Let the back seam out by a centimetre');
	});

	it('lists the order for the customer, and on the workroom’s board', async () => {
		const list = await pageText(world.customer, '/orders');
		expect(list.status).toBe(200);
		expect(list.html).toContain(`/orders/${world.orderId}`);
		expect(list.html).toContain(world.workroomName);
		const board = await pageText(world.tailor, '/workroom/orders');
		expect(board.status).toBe(200);
		expect(board.html).toContain(`/orders/${world.orderId}`);
		const tailorOrders = await world.tailor.get('/orders');
		expect(tailorOrders.status).toBe(303);
		expect(tailorOrders.headers.get('location')).toBe('/workroom/orders');
	});
});

describe('the workroom’s board', () => {
	it('groups orders by stage, soonest due first, flags the overdue and shows an empty state', async () => {
		const tailor = await createWorkroom(db);
		const client = await signedIn(tailor);
		const empty = await pageText(client, '/workroom/orders');
		expect(empty.html).toContain('No orders yet');

		const dueIn = async (days: number, title: string, status: 'funded' | 'in_work' | 'released') => {
			const customer = await createUser(db);
			const made = await createCommission(db, { customerId: customer.id, status: 'open', title });
			const due = new Date(Date.now() + days * 86_400_000).toISOString().slice(0, 10);
			const q = await insertQuote(db, { commissionId: made.id, tailorId: tailor.id, deliveryDate: due });
			const { orderId } = await awardQuote(db, { commissionId: made.id, quoteId: q.id, customerId: customer.id });
			await db.update(order).set({ status, dueDate: due }).where(eq(order.id, orderId));
			return orderId;
		};
		await dueIn(20, 'Later tweed jacket', 'in_work');
		await dueIn(-2, 'Late silk blouse', 'in_work');
		await dueIn(3, 'Soon linen skirt', 'funded');
		await dueIn(-40, 'Old wool coat', 'released');

		const board = await pageText(client, '/workroom/orders');
		const column = (id: string) => {
			const start = board.html.indexOf(`id="column-${id}"`);
			const end = board.html.indexOf('</section>', start);
			return board.html.slice(start, end);
		};
		const inWork = column('in_work');
		expect(inWork.indexOf('Late silk blouse')).toBeLessThan(inWork.indexOf('Later tweed jacket'));
		expect(inWork).toContain('Overdue');
		expect(column('to_start')).toContain('Soon linen skirt');
		expect(column('to_start')).toContain('Due this week');
		expect(column('finished')).toContain('Old wool coat');
		expect(board.html).toMatch(/1 overdue/);
	});
});
