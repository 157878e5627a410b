/**
 * Every page, form action and endpoint of the marketplace areas, tried by each kind of person: anonymous,
 * the owner, another customer, a tailor (onboarded and not), an admin and a suspended account. Each area's
 * rows live in `./authorization/<area>.ts`; add an area by importing its rows and adding one line below.
 */
import { afterAll, beforeAll, vi } from 'vitest';
import { acceptRows } from './authorization/accept';
import { castActors } from './authorization/actors';
import { describeMatrix, type World } from './authorization/matrix';
import { escrowRows } from './authorization/escrow';
import { commissionRows } from './authorization/commissions';
import { fittingRows } from './authorization/fittings';
import { measurementProfileRows } from './authorization/measurement-profiles';
import { orderRows } from './authorization/orders';
import { orderPageRows } from './authorization/order-pages';
import { orderLifecycleRows } from './authorization/order-lifecycle';
import { quoteRows } from './authorization/quotes';
import { openApiRows } from './authorization/openapi';
import { liveMessageRows } from './authorization/live-messages';
import { messageRows } from './authorization/messages';
import { notificationRows } from './authorization/notifications';
import { searchRows } from './authorization/search';
import { workroomRows } from './authorization/workrooms';
import { testDb } from './db';

// Photos are stored through the app's own storage service, which reads its settings from the environment.
vi.mock('$env/dynamic/private', () => ({ env: process.env }));

const { db, pool } = testDb();
let world: World;

beforeAll(async () => {
	world = { db, cast: await castActors(db) };
});
afterAll(() => pool.end());

describeMatrix('measurement profiles', measurementProfileRows, () => world);
describeMatrix('commissions and their photos', commissionRows, () => world);
describeMatrix('workrooms', workroomRows, () => world);
describeMatrix('quotes', quoteRows, () => world);
describeMatrix('deciding on quotes, and what acceptance opens up', acceptRows, () => world);
describeMatrix('the API description', openApiRows, () => world);
describeMatrix('messages', messageRows, () => world);
describeMatrix('the live unread count', liveMessageRows, () => world);
describeMatrix('search near me', searchRows, () => world);
describeMatrix('paying for orders, and payouts', orderRows, () => world);
describeMatrix('the order page, its actions and the order lists', orderPageRows, () => world);
describeMatrix('fittings', fittingRows, () => world);
describeMatrix('moving orders along: progress, delivery, release, cancellation', orderLifecycleRows, () => world);
describeMatrix('notifications and their settings', notificationRows, () => world);
describeMatrix('the books: escrow and reconciliation', escrowRows, () => world);
