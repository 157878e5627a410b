/** Demo conversations in Merrowgate: two tailors who quoted on the linen trousers, and the demo tailor's question. */
import { openThread } from '../../src/lib/server/messages/threads';
import type { Executor } from '../../src/lib/server/db/client';
import { message, messageThread, type NewMessage } from '../../src/lib/server/db/schema';
import { eq } from 'drizzle-orm';
import { demoId } from './ids';
import { personId } from './people';

const minute = 60_000;
const customer = personId('customer@tackline.test');

/** Fixed message ids in the demo id scheme (kind a001, clear of ./ids.ts), so a second run inserts nothing. */
function messageId(n: number) {
	return `5eed0000-0000-4000-8000-a001${n.toString(16).padStart(8, '0')}`;
}

type Line = { from: 'customer' | 'tailor'; body: string; minutesAgo: number; read: boolean };

const conversations: { commission: number; tailor: string; lines: Line[] }[] = [
	{
		commission: 1,
		tailor: 'tobiah.marsh@tackline.test',
		lines: [
			{
				from: 'tailor',
				body: 'Hello Rosalind — I have sent a quote. The sand linen is a washed 185 g/m², soft but it holds a crease. Would you like a swatch posted to you first?',
				minutesAgo: 2 * 24 * 60,
				read: true
			},
			{
				from: 'customer',
				body: 'Yes please, a swatch would help. Could the waistband sit about 2 cm higher than usual?',
				minutesAgo: 2 * 24 * 60 - 95,
				read: true
			},
			{
				from: 'tailor',
				body: 'Of course: I will draft it high and we will settle the height at the fitting. The swatch goes out tomorrow from the Old Quay post office.',
				minutesAgo: 26 * 60,
				read: true
			}
		]
	},
	{
		commission: 1,
		tailor: 'reuben.frost@tackline.test',
		lines: [
			{
				from: 'tailor',
				body: 'Thank you for the clear measurements. For wide legs in linen I like a calico fitting first, so the drape is right before the good cloth is cut. Do you wear these with flats or heels?',
				minutesAgo: 30 * 60,
				read: true
			},
			{
				from: 'customer',
				body: 'Mostly flat sandals, sometimes a low block heel.',
				minutesAgo: 29 * 60,
				read: true
			},
			{
				from: 'tailor',
				body: 'Then I will hem for the block heel and turn up 1 cm for flats — you will not see the difference in linen. My linen samples are on my workroom page.',
				minutesAgo: 90,
				read: false
			}
		]
	},
	{
		commission: 2,
		tailor: 'tailor@tackline.test',
		lines: [
			{
				from: 'tailor',
				body: 'Hello — is the tunic for the spring concert at the Merrowgate Corn Exchange? If so I would suggest a cotton drill that washes well after rehearsals.',
				minutesAgo: 6 * 60,
				read: true
			},
			{
				from: 'customer',
				body: 'It is! Cotton drill sounds sensible. He is growing fast, so could you leave some hem to let down?',
				minutesAgo: 45,
				read: false
			}
		]
	}
];

/** Opens each thread (or finds it) and adds its messages; unread ones count as already mailed about. */
export async function seedDemoMessages(db: Executor, now: Date) {
	let n = 0;
	for (const conversation of conversations) {
		const tailorId = personId(conversation.tailor);
		const thread = await openThread(db, { commissionId: demoId('commission', conversation.commission), tailorId });
		const rows: NewMessage[] = conversation.lines.map((line) => {
			n += 1;
			const createdAt = new Date(now.getTime() - line.minutesAgo * minute);
			return {
				id: messageId(n),
				threadId: thread.id,
				authorId: line.from === 'customer' ? customer : tailorId,
				body: line.body,
				createdAt,
				readAt: line.read ? new Date(createdAt.getTime() + 10 * minute) : null,
				notifiedAt: line.read ? null : now
			};
		});
		await db.insert(message).values(rows).onConflictDoNothing();
		const last = rows.at(-1)!.createdAt as Date;
		await db.update(messageThread).set({ lastMessageAt: last }).where(eq(messageThread.id, thread.id));
	}
}
