ALTER TABLE "commission" ALTER COLUMN "budget_min_minor" SET DATA TYPE bigint;--> statement-breakpoint
ALTER TABLE "commission" ALTER COLUMN "budget_max_minor" SET DATA TYPE bigint;--> statement-breakpoint
ALTER TABLE "dispute" ALTER COLUMN "refund_minor" SET DATA TYPE bigint;--> statement-breakpoint
ALTER TABLE "dispute" ALTER COLUMN "release_minor" SET DATA TYPE bigint;--> statement-breakpoint
ALTER TABLE "dispute" ALTER COLUMN "fee_minor" SET DATA TYPE bigint;--> statement-breakpoint
ALTER TABLE "tailor_profile" ALTER COLUMN "hourly_rate_minor" SET DATA TYPE bigint;--> statement-breakpoint
ALTER TABLE "quote" ALTER COLUMN "price_minor" SET DATA TYPE bigint;--> statement-breakpoint
ALTER TABLE "quote" ALTER COLUMN "advance_minor" SET DATA TYPE bigint;--> statement-breakpoint
ALTER TABLE "order" ALTER COLUMN "price_minor" SET DATA TYPE bigint;--> statement-breakpoint
ALTER TABLE "order" ALTER COLUMN "platform_fee_minor" SET DATA TYPE bigint;--> statement-breakpoint
ALTER TABLE "order" ALTER COLUMN "tailor_payout_minor" SET DATA TYPE bigint;--> statement-breakpoint
ALTER TABLE "order" ALTER COLUMN "advance_minor" SET DATA TYPE bigint;