CREATE TYPE "public"."search_document_kind" AS ENUM('commission', 'workroom');--> statement-breakpoint
CREATE TABLE "search_outbox" (
	"id" bigserial PRIMARY KEY NOT NULL,
	"kind" "search_document_kind" NOT NULL,
	"entity_id" uuid NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "search_outbox_kind_entity_uq" UNIQUE("kind","entity_id")
);
--> statement-breakpoint
DROP INDEX "message_thread_created_idx";--> statement-breakpoint
ALTER TABLE "quote" ADD COLUMN "decline_reason" text DEFAULT '' NOT NULL;--> statement-breakpoint
ALTER TABLE "message" ADD COLUMN "notified_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "message_attachment" ADD COLUMN "width" integer;--> statement-breakpoint
ALTER TABLE "message_attachment" ADD COLUMN "height" integer;--> statement-breakpoint
ALTER TABLE "message_attachment" ADD COLUMN "thumb_key" text;--> statement-breakpoint
ALTER TABLE "message_attachment" ADD COLUMN "alt_text" text DEFAULT '' NOT NULL;--> statement-breakpoint
ALTER TABLE "order" ADD COLUMN "platform_fee_basis_points" integer DEFAULT 1000 NOT NULL;--> statement-breakpoint
CREATE INDEX "search_outbox_created_idx" ON "search_outbox" USING btree ("created_at");--> statement-breakpoint
CREATE INDEX "quote_sent_valid_until_idx" ON "quote" USING btree ("valid_until") WHERE "quote"."status" = 'sent';--> statement-breakpoint
CREATE INDEX "message_unread_unnotified_idx" ON "message" USING btree ("created_at") WHERE "message"."read_at" is null and "message"."notified_at" is null;--> statement-breakpoint
CREATE INDEX "message_thread_created_idx" ON "message" USING btree ("thread_id","created_at","id");--> statement-breakpoint
ALTER TABLE "message_attachment" ADD CONSTRAINT "message_attachment_thumb_key_unique" UNIQUE("thumb_key");