import { sql } from 'drizzle-orm';
import { check, index, pgEnum, pgTable, smallint, text, unique, uuid } from 'drizzle-orm/pg-core';
import { id, instant } from './columns';
import { user } from './auth';
import { order } from './orders';

export const reviewDirection = pgEnum('review_direction', ['customer_to_tailor', 'tailor_to_customer']);

export const review = pgTable(
	'review',
	{
		id: id(),
		orderId: uuid('order_id')
			.notNull()
			.references(() => order.id, { onDelete: 'cascade' }),
		// Orders already pin both parties' accounts; these cascades only matter once an order is gone.
		authorId: uuid('author_id')
			.notNull()
			.references(() => user.id, { onDelete: 'cascade' }),
		subjectId: uuid('subject_id')
			.notNull()
			.references(() => user.id, { onDelete: 'cascade' }),
		direction: reviewDirection('direction').notNull(),
		rating: smallint('rating').notNull(),
		fitRating: smallint('fit_rating'),
		workmanshipRating: smallint('workmanship_rating'),
		communicationRating: smallint('communication_rating'),
		timelinessRating: smallint('timeliness_rating'),
		body: text('body').notNull().default(''),
		submittedAt: instant('submitted_at').notNull().defaultNow(),
		/** Set when both sides have written or the review window closed; neither sees the other's first. */
		publishedAt: instant('published_at')
	},
	(t) => [
		unique('review_order_direction_uq').on(t.orderId, t.direction),
		index('review_subject_published_idx').on(t.subjectId, t.publishedAt),
		check('review_rating_range', sql`${t.rating} between 1 and 5`),
		check('review_fit_range', sql`${t.fitRating} between 1 and 5`),
		check('review_workmanship_range', sql`${t.workmanshipRating} between 1 and 5`),
		check('review_communication_range', sql`${t.communicationRating} between 1 and 5`),
		check('review_timeliness_range', sql`${t.timelinessRating} between 1 and 5`),
		// Fit and workmanship describe the garment, so only the customer rates them.
		check(
			'review_garment_aspects_by_customer',
			sql`${t.direction} = 'customer_to_tailor' or (${t.fitRating} is null and ${t.workmanshipRating} is null)`
		),
		check('review_not_self', sql`${t.authorId} <> ${t.subjectId}`)
	]
);
export type Review = typeof review.$inferSelect;
export type NewReview = typeof review.$inferInsert;
export type ReviewDirection = (typeof reviewDirection.enumValues)[number];
