CREATE TYPE "public"."delivery_method" AS ENUM('pickup', 'courier');--> statement-breakpoint
CREATE TYPE "public"."notification_channel" AS ENUM('email', 'in_app');--> statement-breakpoint
CREATE TYPE "public"."notification_event" AS ENUM('quote_received', 'quote_accepted', 'quote_declined', 'payment_received', 'payment_failed', 'progress_posted', 'fabric_approval', 'advance_released', 'fitting_offered', 'fitting_booked', 'fitting_cancelled', 'fitting_reminder', 'delivered', 'alteration_requested', 'released', 'refunded', 'order_cancelled', 'message_waiting', 'money_stuck');--> statement-breakpoint
CREATE TABLE "notification" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"user_id" uuid NOT NULL,
	"event" "notification_event" NOT NULL,
	"title" text NOT NULL,
	"body" text DEFAULT '' NOT NULL,
	"href" text NOT NULL,
	"read_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "notification_preference" (
	"user_id" uuid NOT NULL,
	"event" "notification_event" NOT NULL,
	"channel" "notification_channel" NOT NULL,
	"enabled" boolean NOT NULL,
	CONSTRAINT "notification_preference_user_id_event_channel_pk" PRIMARY KEY("user_id","event","channel")
);
--> statement-breakpoint
ALTER TABLE "quote" ADD COLUMN "advance_minor" integer DEFAULT 0 NOT NULL;--> statement-breakpoint
ALTER TABLE "fitting" ADD COLUMN "time_zone" text DEFAULT 'UTC' NOT NULL;--> statement-breakpoint
ALTER TABLE "fitting" ADD COLUMN "booked_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "fitting" ADD COLUMN "reminded_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "fitting" ADD COLUMN "cancelled_by_id" uuid;--> statement-breakpoint
ALTER TABLE "fitting" ADD COLUMN "cancel_reason" text DEFAULT '' NOT NULL;--> statement-breakpoint
ALTER TABLE "order" ADD COLUMN "advance_minor" integer DEFAULT 0 NOT NULL;--> statement-breakpoint
ALTER TABLE "order" ADD COLUMN "fabric_approved_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "order" ADD COLUMN "work_started_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "order" ADD COLUMN "ready_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "order" ADD COLUMN "delivery_method" "delivery_method";--> statement-breakpoint
ALTER TABLE "order" ADD COLUMN "tracking_reference" text;--> statement-breakpoint
ALTER TABLE "order" ADD COLUMN "delivery_note" text DEFAULT '' NOT NULL;--> statement-breakpoint
ALTER TABLE "order" ADD COLUMN "alteration_requested_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "order" ADD COLUMN "alteration_note" text DEFAULT '' NOT NULL;--> statement-breakpoint
ALTER TABLE "order" ADD COLUMN "release_requested_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "order" ADD COLUMN "refund_requested_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "order" ADD COLUMN "cancelled_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "order" ADD COLUMN "cancel_reason" text DEFAULT '' NOT NULL;--> statement-breakpoint
ALTER TABLE "progress_step" ADD COLUMN "photo_thumb_key" text;--> statement-breakpoint
ALTER TABLE "progress_step" ADD COLUMN "photo_width" integer;--> statement-breakpoint
ALTER TABLE "progress_step" ADD COLUMN "photo_height" integer;--> statement-breakpoint
ALTER TABLE "progress_step" ADD COLUMN "photo_alt" text DEFAULT '' NOT NULL;--> statement-breakpoint
ALTER TABLE "progress_step" ADD COLUMN "posted_by_id" uuid;--> statement-breakpoint
ALTER TABLE "notification" ADD CONSTRAINT "notification_user_id_user_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."user"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "notification_preference" ADD CONSTRAINT "notification_preference_user_id_user_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."user"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "notification_user_created_idx" ON "notification" USING btree ("user_id","created_at");--> statement-breakpoint
CREATE INDEX "notification_user_unread_idx" ON "notification" USING btree ("user_id") WHERE "notification"."read_at" is null;--> statement-breakpoint
ALTER TABLE "fitting" ADD CONSTRAINT "fitting_cancelled_by_id_user_id_fk" FOREIGN KEY ("cancelled_by_id") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "progress_step" ADD CONSTRAINT "progress_step_posted_by_id_user_id_fk" FOREIGN KEY ("posted_by_id") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "fitting_reminder_due_idx" ON "fitting" USING btree ("starts_at") WHERE "fitting"."status" = 'confirmed' and "fitting"."reminded_at" is null;--> statement-breakpoint
ALTER TABLE "quote" ADD CONSTRAINT "quote_advance_within_limit" CHECK ("quote"."advance_minor" >= 0 and "quote"."advance_minor"::bigint * 10 <= "quote"."price_minor"::bigint * 3 and ("quote"."advance_minor" = 0 or "quote"."fabric_included"));--> statement-breakpoint
ALTER TABLE "order" ADD CONSTRAINT "order_advance_within_limit" CHECK ("order"."advance_minor" >= 0 and "order"."advance_minor"::bigint * 10 <= "order"."price_minor"::bigint * 3 and "order"."advance_minor" <= "order"."tailor_payout_minor");--> statement-breakpoint
ALTER TABLE "order" ADD CONSTRAINT "order_courier_tracked" CHECK ("order"."delivery_method" is distinct from 'courier' or "order"."tracking_reference" is not null);--> statement-breakpoint
-- An order's escrow never goes negative: checked at commit for every order a transaction posted to, so no
-- release, advance or refund can pay out more than the order holds.
CREATE FUNCTION "ledger_escrow_not_negative"() RETURNS trigger LANGUAGE plpgsql AS $$
DECLARE
	held bigint;
BEGIN
	SELECT coalesce(sum(amount_minor), 0) INTO held
	FROM ledger_entry
	WHERE order_id = NEW.order_id AND account = 'escrow';
	IF held < 0 THEN
		RAISE EXCEPTION 'order % would hold % in escrow', NEW.order_id, held
			USING ERRCODE = 'check_violation', CONSTRAINT = 'ledger_escrow_not_negative';
	END IF;
	RETURN NULL;
END;
$$;--> statement-breakpoint
CREATE CONSTRAINT TRIGGER "ledger_escrow_not_negative"
	AFTER INSERT ON "ledger_entry"
	DEFERRABLE INITIALLY DEFERRED
	FOR EACH ROW WHEN (NEW.account = 'escrow') EXECUTE FUNCTION "ledger_escrow_not_negative"();
