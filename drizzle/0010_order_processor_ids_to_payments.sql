ALTER TABLE "order" DROP CONSTRAINT "order_payment_intent_id_unique";--> statement-breakpoint
ALTER TABLE "order" DROP CONSTRAINT "order_charge_id_unique";--> statement-breakpoint
ALTER TABLE "order" DROP CONSTRAINT "order_transfer_id_unique";--> statement-breakpoint
ALTER TABLE "order" DROP COLUMN "payment_intent_id";--> statement-breakpoint
ALTER TABLE "order" DROP COLUMN "charge_id";--> statement-breakpoint
ALTER TABLE "order" DROP COLUMN "transfer_id";