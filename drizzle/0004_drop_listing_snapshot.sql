-- Portfolio items written before this migration carried one key and no stored thumbnail or size; only demo rows did, and the demo seed writes them again as portfolio photos.
ALTER TABLE "portfolio_item" DROP CONSTRAINT "portfolio_item_storage_key_unique";--> statement-breakpoint
ALTER TABLE "commission" DROP CONSTRAINT "commission_posted_has_snapshot";--> statement-breakpoint
ALTER TABLE "commission" DROP COLUMN "measurement_snapshot";--> statement-breakpoint
ALTER TABLE "commission" DROP COLUMN "size_band";--> statement-breakpoint
ALTER TABLE "portfolio_item" DROP COLUMN "storage_key";--> statement-breakpoint
ALTER TABLE "commission" ADD CONSTRAINT "commission_posted_has_published_at" CHECK ("commission"."status" in ('draft', 'cancelled') or "commission"."published_at" is not null);