CREATE TYPE "public"."length_unit" AS ENUM('in', 'cm');--> statement-breakpoint
CREATE TYPE "public"."user_role" AS ENUM('customer', 'tailor', 'admin');--> statement-breakpoint
CREATE TYPE "public"."commission_status" AS ENUM('draft', 'open', 'awarded', 'closed', 'cancelled', 'expired');--> statement-breakpoint
CREATE TYPE "public"."fabric_source" AS ENUM('customer_supplies', 'tailor_sources');--> statement-breakpoint
CREATE TYPE "public"."handover" AS ENUM('pickup', 'delivery');--> statement-breakpoint
CREATE TYPE "public"."dispute_reason" AS ENUM('poor_fit', 'not_as_agreed', 'workmanship', 'fabric_problem', 'late', 'not_delivered', 'other');--> statement-breakpoint
CREATE TYPE "public"."dispute_status" AS ENUM('open', 'settled', 'withdrawn');--> statement-breakpoint
CREATE TYPE "public"."payout_status" AS ENUM('not_connected', 'pending', 'enabled', 'restricted');--> statement-breakpoint
CREATE TYPE "public"."measurement_taker" AS ENUM('self', 'companion', 'tailor');--> statement-breakpoint
CREATE TYPE "public"."quote_status" AS ENUM('sent', 'accepted', 'declined', 'withdrawn', 'lapsed');--> statement-breakpoint
CREATE TYPE "public"."fitting_place" AS ENUM('workroom', 'public_place', 'customer_home');--> statement-breakpoint
CREATE TYPE "public"."fitting_status" AS ENUM('proposed', 'confirmed', 'done', 'cancelled');--> statement-breakpoint
CREATE TYPE "public"."order_status" AS ENUM('awaiting_payment', 'funded', 'in_work', 'ready', 'delivered', 'released', 'cancelled', 'refunded', 'disputed', 'settled');--> statement-breakpoint
CREATE TYPE "public"."progress_step_kind" AS ENUM('fabric_sourced', 'pattern_drafted', 'cutting', 'first_fitting', 'sewing', 'final_fitting', 'finishing', 'ready');--> statement-breakpoint
CREATE TYPE "public"."ledger_account" AS ENUM('customer_payments', 'escrow', 'customer_refunds', 'tailor_payable', 'tailor_payouts', 'platform_fees');--> statement-breakpoint
CREATE TYPE "public"."review_direction" AS ENUM('customer_to_tailor', 'tailor_to_customer');--> statement-breakpoint
CREATE TABLE "audit_event" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"actor_id" uuid,
	"action" text NOT NULL,
	"subject_type" text NOT NULL,
	"subject_id" text NOT NULL,
	"data" jsonb DEFAULT '{}'::jsonb NOT NULL,
	"ip" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "account" (
	"user_id" uuid NOT NULL,
	"type" text NOT NULL,
	"provider" text NOT NULL,
	"provider_account_id" text NOT NULL,
	"refresh_token" text,
	"access_token" text,
	"expires_at" integer,
	"token_type" text,
	"scope" text,
	"id_token" text,
	"session_state" text,
	CONSTRAINT "account_provider_provider_account_id_pk" PRIMARY KEY("provider","provider_account_id")
);
--> statement-breakpoint
CREATE TABLE "session" (
	"session_token" text PRIMARY KEY NOT NULL,
	"user_id" uuid NOT NULL,
	"expires" timestamp with time zone NOT NULL
);
--> statement-breakpoint
CREATE TABLE "sign_in_attempt" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"email" text NOT NULL,
	"ip" text NOT NULL,
	"succeeded" boolean NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "user" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"name" text,
	"email" text NOT NULL,
	"email_verified" timestamp with time zone,
	"image" text,
	"password_hash" text,
	"role" "user_role" DEFAULT 'customer' NOT NULL,
	"units" "length_unit" DEFAULT 'cm' NOT NULL,
	"time_zone" text DEFAULT 'UTC' NOT NULL,
	"suspended_at" timestamp with time zone,
	"suspended_reason" text,
	"created_at" timestamp (3) with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "user_email_unique" UNIQUE("email")
);
--> statement-breakpoint
CREATE TABLE "verification_token" (
	"identifier" text NOT NULL,
	"token" text NOT NULL,
	"expires" timestamp with time zone NOT NULL,
	CONSTRAINT "verification_token_identifier_token_pk" PRIMARY KEY("identifier","token")
);
--> statement-breakpoint
CREATE TABLE "commission" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"customer_id" uuid NOT NULL,
	"garment_type" text NOT NULL,
	"title" text NOT NULL,
	"style_notes" text DEFAULT '' NOT NULL,
	"measurement_snapshot" jsonb,
	"size_band" text,
	"fabric_source" "fabric_source" DEFAULT 'tailor_sources' NOT NULL,
	"fabric_notes" text DEFAULT '' NOT NULL,
	"budget_min_minor" integer,
	"budget_max_minor" integer,
	"currency" char(3) NOT NULL,
	"date_needed" date,
	"city" text,
	"district" text,
	"approx_lat" double precision,
	"approx_lng" double precision,
	"handover" "handover" DEFAULT 'pickup' NOT NULL,
	"status" "commission_status" DEFAULT 'draft' NOT NULL,
	"published_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "commission_currency_iso" CHECK ("commission"."currency" ~ '^[A-Z]{3}$'),
	CONSTRAINT "commission_budget_min_nonnegative" CHECK ("commission"."budget_min_minor" >= 0),
	CONSTRAINT "commission_budget_order" CHECK ("commission"."budget_min_minor" <= "commission"."budget_max_minor"),
	CONSTRAINT "commission_posted_has_snapshot" CHECK ("commission"."status" in ('draft', 'cancelled') or ("commission"."measurement_snapshot" is not null and "commission"."published_at" is not null))
);
--> statement-breakpoint
CREATE TABLE "commission_photo" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"commission_id" uuid NOT NULL,
	"storage_key" text NOT NULL,
	"content_type" text NOT NULL,
	"bytes" integer NOT NULL,
	"width" integer NOT NULL,
	"height" integer NOT NULL,
	"sort_order" integer DEFAULT 0 NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "commission_photo_storage_key_unique" UNIQUE("storage_key"),
	CONSTRAINT "commission_photo_size_positive" CHECK ("commission_photo"."bytes" > 0 and "commission_photo"."width" > 0 and "commission_photo"."height" > 0)
);
--> statement-breakpoint
CREATE TABLE "dispute" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"order_id" uuid NOT NULL,
	"opened_by_id" uuid NOT NULL,
	"reason" "dispute_reason" NOT NULL,
	"statement" text NOT NULL,
	"status" "dispute_status" DEFAULT 'open' NOT NULL,
	"refund_minor" integer,
	"release_minor" integer,
	"fee_minor" integer,
	"currency" char(3) NOT NULL,
	"settled_by_id" uuid,
	"settlement_note" text,
	"settled_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "dispute_currency_iso" CHECK ("dispute"."currency" ~ '^[A-Z]{3}$'),
	CONSTRAINT "dispute_refund_nonnegative" CHECK ("dispute"."refund_minor" >= 0),
	CONSTRAINT "dispute_release_nonnegative" CHECK ("dispute"."release_minor" >= 0),
	CONSTRAINT "dispute_fee_within_release" CHECK ("dispute"."fee_minor" >= 0 and "dispute"."fee_minor" <= "dispute"."release_minor"),
	CONSTRAINT "dispute_settled_complete" CHECK ("dispute"."status" <> 'settled' or ("dispute"."refund_minor" is not null and "dispute"."release_minor" is not null and "dispute"."fee_minor" is not null and "dispute"."settled_at" is not null))
);
--> statement-breakpoint
CREATE TABLE "dispute_evidence" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"dispute_id" uuid NOT NULL,
	"author_id" uuid,
	"statement" text DEFAULT '' NOT NULL,
	"storage_key" text,
	"content_type" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "dispute_evidence_storage_key_unique" UNIQUE("storage_key"),
	CONSTRAINT "dispute_evidence_not_empty" CHECK ("dispute_evidence"."statement" <> '' or "dispute_evidence"."storage_key" is not null)
);
--> statement-breakpoint
CREATE TABLE "portfolio_item" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"tailor_id" uuid NOT NULL,
	"storage_key" text NOT NULL,
	"caption" text DEFAULT '' NOT NULL,
	"garment_type" text,
	"sort_order" integer DEFAULT 0 NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "portfolio_item_storage_key_unique" UNIQUE("storage_key")
);
--> statement-breakpoint
CREATE TABLE "tailor_profile" (
	"user_id" uuid PRIMARY KEY NOT NULL,
	"shop_name" text NOT NULL,
	"slug" text NOT NULL,
	"bio" text DEFAULT '' NOT NULL,
	"specialties" text[] DEFAULT '{}'::text[] NOT NULL,
	"city" text NOT NULL,
	"district" text,
	"lat" double precision NOT NULL,
	"lng" double precision NOT NULL,
	"service_radius_km" integer DEFAULT 10 NOT NULL,
	"lead_time_days" integer DEFAULT 14 NOT NULL,
	"capacity" integer DEFAULT 3 NOT NULL,
	"payout_account_id" text,
	"payout_status" "payout_status" DEFAULT 'not_connected' NOT NULL,
	"rating_average_hundredths" integer DEFAULT 0 NOT NULL,
	"rating_count" integer DEFAULT 0 NOT NULL,
	"accepting_work" boolean DEFAULT true NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "tailor_profile_slug_unique" UNIQUE("slug"),
	CONSTRAINT "tailor_profile_payout_account_id_unique" UNIQUE("payout_account_id"),
	CONSTRAINT "tailor_profile_lat_range" CHECK ("tailor_profile"."lat" between -90 and 90),
	CONSTRAINT "tailor_profile_lng_range" CHECK ("tailor_profile"."lng" between -180 and 180),
	CONSTRAINT "tailor_profile_radius_positive" CHECK ("tailor_profile"."service_radius_km" > 0),
	CONSTRAINT "tailor_profile_lead_time_nonnegative" CHECK ("tailor_profile"."lead_time_days" >= 0),
	CONSTRAINT "tailor_profile_capacity_positive" CHECK ("tailor_profile"."capacity" > 0),
	CONSTRAINT "tailor_profile_rating_range" CHECK ("tailor_profile"."rating_average_hundredths" between 0 and 500),
	CONSTRAINT "tailor_profile_rating_count_nonnegative" CHECK ("tailor_profile"."rating_count" >= 0)
);
--> statement-breakpoint
CREATE TABLE "measurement_profile" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"owner_id" uuid NOT NULL,
	"label" text NOT NULL,
	"values_mm" jsonb DEFAULT '{}'::jsonb NOT NULL,
	"taken_by" "measurement_taker" DEFAULT 'self' NOT NULL,
	"taken_at" timestamp with time zone,
	"notes" text DEFAULT '' NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "measurement_profile_owner_label_uq" UNIQUE("owner_id","label"),
	CONSTRAINT "measurement_profile_values_object" CHECK (jsonb_typeof("measurement_profile"."values_mm") = 'object')
);
--> statement-breakpoint
CREATE TABLE "quote" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"commission_id" uuid NOT NULL,
	"tailor_id" uuid NOT NULL,
	"price_minor" integer NOT NULL,
	"currency" char(3) NOT NULL,
	"delivery_date" date NOT NULL,
	"fittings_included" integer DEFAULT 1 NOT NULL,
	"fabric_included" boolean NOT NULL,
	"message" text DEFAULT '' NOT NULL,
	"valid_until" timestamp with time zone NOT NULL,
	"status" "quote_status" DEFAULT 'sent' NOT NULL,
	"decided_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "quote_currency_iso" CHECK ("quote"."currency" ~ '^[A-Z]{3}$'),
	CONSTRAINT "quote_price_positive" CHECK ("quote"."price_minor" > 0),
	CONSTRAINT "quote_fittings_nonnegative" CHECK ("quote"."fittings_included" >= 0)
);
--> statement-breakpoint
CREATE TABLE "message" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"thread_id" uuid NOT NULL,
	"author_id" uuid,
	"body" text NOT NULL,
	"read_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "message_attachment" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"message_id" uuid NOT NULL,
	"storage_key" text NOT NULL,
	"file_name" text NOT NULL,
	"content_type" text NOT NULL,
	"bytes" integer NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "message_attachment_storage_key_unique" UNIQUE("storage_key"),
	CONSTRAINT "message_attachment_bytes_positive" CHECK ("message_attachment"."bytes" > 0)
);
--> statement-breakpoint
CREATE TABLE "message_thread" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"commission_id" uuid NOT NULL,
	"tailor_id" uuid NOT NULL,
	"last_message_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "message_thread_commission_tailor_uq" UNIQUE("commission_id","tailor_id")
);
--> statement-breakpoint
CREATE TABLE "fitting" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"order_id" uuid NOT NULL,
	"proposed_by_id" uuid,
	"starts_at" timestamp with time zone NOT NULL,
	"ends_at" timestamp with time zone NOT NULL,
	"place_kind" "fitting_place" DEFAULT 'workroom' NOT NULL,
	"address" text DEFAULT '' NOT NULL,
	"status" "fitting_status" DEFAULT 'proposed' NOT NULL,
	"notes" text DEFAULT '' NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "fitting_ends_after_start" CHECK ("fitting"."ends_at" > "fitting"."starts_at")
);
--> statement-breakpoint
CREATE TABLE "order" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"commission_id" uuid NOT NULL,
	"quote_id" uuid NOT NULL,
	"customer_id" uuid NOT NULL,
	"tailor_id" uuid NOT NULL,
	"price_minor" integer NOT NULL,
	"platform_fee_minor" integer NOT NULL,
	"tailor_payout_minor" integer NOT NULL,
	"currency" char(3) NOT NULL,
	"due_date" date NOT NULL,
	"checkout_session_id" text,
	"payment_intent_id" text,
	"charge_id" text,
	"transfer_id" text,
	"status" "order_status" DEFAULT 'awaiting_payment' NOT NULL,
	"funded_at" timestamp with time zone,
	"delivered_at" timestamp with time zone,
	"released_at" timestamp with time zone,
	"auto_release_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "order_commission_id_unique" UNIQUE("commission_id"),
	CONSTRAINT "order_quote_id_unique" UNIQUE("quote_id"),
	CONSTRAINT "order_checkout_session_id_unique" UNIQUE("checkout_session_id"),
	CONSTRAINT "order_payment_intent_id_unique" UNIQUE("payment_intent_id"),
	CONSTRAINT "order_charge_id_unique" UNIQUE("charge_id"),
	CONSTRAINT "order_transfer_id_unique" UNIQUE("transfer_id"),
	CONSTRAINT "order_currency_iso" CHECK ("order"."currency" ~ '^[A-Z]{3}$'),
	CONSTRAINT "order_price_positive" CHECK ("order"."price_minor" > 0),
	CONSTRAINT "order_fee_nonnegative" CHECK ("order"."platform_fee_minor" >= 0),
	CONSTRAINT "order_payout_nonnegative" CHECK ("order"."tailor_payout_minor" >= 0),
	CONSTRAINT "order_split_adds_up" CHECK ("order"."platform_fee_minor" + "order"."tailor_payout_minor" = "order"."price_minor")
);
--> statement-breakpoint
CREATE TABLE "progress_step" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"order_id" uuid NOT NULL,
	"kind" "progress_step_kind" NOT NULL,
	"note" text DEFAULT '' NOT NULL,
	"photo_key" text,
	"recorded_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "ledger_entry" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"transaction_id" uuid NOT NULL,
	"order_id" uuid NOT NULL,
	"account" "ledger_account" NOT NULL,
	"amount_minor" bigint NOT NULL,
	"currency" char(3) NOT NULL,
	"kind" text NOT NULL,
	"idempotency_key" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "ledger_entry_currency_iso" CHECK ("ledger_entry"."currency" ~ '^[A-Z]{3}$'),
	CONSTRAINT "ledger_entry_amount_nonzero" CHECK ("ledger_entry"."amount_minor" <> 0)
);
--> statement-breakpoint
CREATE TABLE "processed_webhook_event" (
	"event_id" text PRIMARY KEY NOT NULL,
	"type" text NOT NULL,
	"received_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "review" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"order_id" uuid NOT NULL,
	"author_id" uuid NOT NULL,
	"subject_id" uuid NOT NULL,
	"direction" "review_direction" NOT NULL,
	"rating" smallint NOT NULL,
	"fit_rating" smallint,
	"workmanship_rating" smallint,
	"communication_rating" smallint,
	"timeliness_rating" smallint,
	"body" text DEFAULT '' NOT NULL,
	"submitted_at" timestamp with time zone DEFAULT now() NOT NULL,
	"published_at" timestamp with time zone,
	CONSTRAINT "review_order_direction_uq" UNIQUE("order_id","direction"),
	CONSTRAINT "review_rating_range" CHECK ("review"."rating" between 1 and 5),
	CONSTRAINT "review_fit_range" CHECK ("review"."fit_rating" between 1 and 5),
	CONSTRAINT "review_workmanship_range" CHECK ("review"."workmanship_rating" between 1 and 5),
	CONSTRAINT "review_communication_range" CHECK ("review"."communication_rating" between 1 and 5),
	CONSTRAINT "review_timeliness_range" CHECK ("review"."timeliness_rating" between 1 and 5),
	CONSTRAINT "review_garment_aspects_by_customer" CHECK ("review"."direction" = 'customer_to_tailor' or ("review"."fit_rating" is null and "review"."workmanship_rating" is null)),
	CONSTRAINT "review_not_self" CHECK ("review"."author_id" <> "review"."subject_id")
);
--> statement-breakpoint
ALTER TABLE "audit_event" ADD CONSTRAINT "audit_event_actor_id_user_id_fk" FOREIGN KEY ("actor_id") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "account" ADD CONSTRAINT "account_user_id_user_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."user"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "session" ADD CONSTRAINT "session_user_id_user_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."user"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "commission" ADD CONSTRAINT "commission_customer_id_user_id_fk" FOREIGN KEY ("customer_id") REFERENCES "public"."user"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "commission_photo" ADD CONSTRAINT "commission_photo_commission_id_commission_id_fk" FOREIGN KEY ("commission_id") REFERENCES "public"."commission"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "dispute" ADD CONSTRAINT "dispute_order_id_order_id_fk" FOREIGN KEY ("order_id") REFERENCES "public"."order"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "dispute" ADD CONSTRAINT "dispute_opened_by_id_user_id_fk" FOREIGN KEY ("opened_by_id") REFERENCES "public"."user"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "dispute" ADD CONSTRAINT "dispute_settled_by_id_user_id_fk" FOREIGN KEY ("settled_by_id") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "dispute_evidence" ADD CONSTRAINT "dispute_evidence_dispute_id_dispute_id_fk" FOREIGN KEY ("dispute_id") REFERENCES "public"."dispute"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "dispute_evidence" ADD CONSTRAINT "dispute_evidence_author_id_user_id_fk" FOREIGN KEY ("author_id") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "portfolio_item" ADD CONSTRAINT "portfolio_item_tailor_id_tailor_profile_user_id_fk" FOREIGN KEY ("tailor_id") REFERENCES "public"."tailor_profile"("user_id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "tailor_profile" ADD CONSTRAINT "tailor_profile_user_id_user_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."user"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "measurement_profile" ADD CONSTRAINT "measurement_profile_owner_id_user_id_fk" FOREIGN KEY ("owner_id") REFERENCES "public"."user"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "quote" ADD CONSTRAINT "quote_commission_id_commission_id_fk" FOREIGN KEY ("commission_id") REFERENCES "public"."commission"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "quote" ADD CONSTRAINT "quote_tailor_id_tailor_profile_user_id_fk" FOREIGN KEY ("tailor_id") REFERENCES "public"."tailor_profile"("user_id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "message" ADD CONSTRAINT "message_thread_id_message_thread_id_fk" FOREIGN KEY ("thread_id") REFERENCES "public"."message_thread"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "message" ADD CONSTRAINT "message_author_id_user_id_fk" FOREIGN KEY ("author_id") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "message_attachment" ADD CONSTRAINT "message_attachment_message_id_message_id_fk" FOREIGN KEY ("message_id") REFERENCES "public"."message"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "message_thread" ADD CONSTRAINT "message_thread_commission_id_commission_id_fk" FOREIGN KEY ("commission_id") REFERENCES "public"."commission"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "message_thread" ADD CONSTRAINT "message_thread_tailor_id_tailor_profile_user_id_fk" FOREIGN KEY ("tailor_id") REFERENCES "public"."tailor_profile"("user_id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "fitting" ADD CONSTRAINT "fitting_order_id_order_id_fk" FOREIGN KEY ("order_id") REFERENCES "public"."order"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "fitting" ADD CONSTRAINT "fitting_proposed_by_id_user_id_fk" FOREIGN KEY ("proposed_by_id") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "order" ADD CONSTRAINT "order_commission_id_commission_id_fk" FOREIGN KEY ("commission_id") REFERENCES "public"."commission"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "order" ADD CONSTRAINT "order_quote_id_quote_id_fk" FOREIGN KEY ("quote_id") REFERENCES "public"."quote"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "order" ADD CONSTRAINT "order_customer_id_user_id_fk" FOREIGN KEY ("customer_id") REFERENCES "public"."user"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "order" ADD CONSTRAINT "order_tailor_id_tailor_profile_user_id_fk" FOREIGN KEY ("tailor_id") REFERENCES "public"."tailor_profile"("user_id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "progress_step" ADD CONSTRAINT "progress_step_order_id_order_id_fk" FOREIGN KEY ("order_id") REFERENCES "public"."order"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "ledger_entry" ADD CONSTRAINT "ledger_entry_order_id_order_id_fk" FOREIGN KEY ("order_id") REFERENCES "public"."order"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "review" ADD CONSTRAINT "review_order_id_order_id_fk" FOREIGN KEY ("order_id") REFERENCES "public"."order"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "review" ADD CONSTRAINT "review_author_id_user_id_fk" FOREIGN KEY ("author_id") REFERENCES "public"."user"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "review" ADD CONSTRAINT "review_subject_id_user_id_fk" FOREIGN KEY ("subject_id") REFERENCES "public"."user"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "audit_event_subject_idx" ON "audit_event" USING btree ("subject_type","subject_id","created_at");--> statement-breakpoint
CREATE INDEX "audit_event_created_idx" ON "audit_event" USING btree ("created_at");--> statement-breakpoint
CREATE INDEX "audit_event_actor_idx" ON "audit_event" USING btree ("actor_id","created_at");--> statement-breakpoint
CREATE INDEX "account_user_idx" ON "account" USING btree ("user_id");--> statement-breakpoint
CREATE INDEX "session_user_idx" ON "session" USING btree ("user_id");--> statement-breakpoint
CREATE INDEX "sign_in_attempt_email_idx" ON "sign_in_attempt" USING btree ("email","created_at");--> statement-breakpoint
CREATE INDEX "sign_in_attempt_ip_idx" ON "sign_in_attempt" USING btree ("ip","created_at");--> statement-breakpoint
CREATE INDEX "user_role_idx" ON "user" USING btree ("role");--> statement-breakpoint
CREATE INDEX "user_email_lower_idx" ON "user" USING btree (lower("email"));--> statement-breakpoint
CREATE INDEX "user_created_idx" ON "user" USING btree ("created_at","id");--> statement-breakpoint
CREATE INDEX "commission_status_published_idx" ON "commission" USING btree ("status","published_at","id");--> statement-breakpoint
CREATE INDEX "commission_garment_status_idx" ON "commission" USING btree ("garment_type","status","published_at");--> statement-breakpoint
CREATE INDEX "commission_city_status_idx" ON "commission" USING btree ("city","district","status");--> statement-breakpoint
CREATE INDEX "commission_open_location_idx" ON "commission" USING btree ("approx_lat","approx_lng") WHERE "commission"."status" = 'open';--> statement-breakpoint
CREATE INDEX "commission_customer_idx" ON "commission" USING btree ("customer_id","created_at");--> statement-breakpoint
CREATE INDEX "commission_photo_commission_idx" ON "commission_photo" USING btree ("commission_id","sort_order");--> statement-breakpoint
CREATE UNIQUE INDEX "dispute_one_open_per_order_uq" ON "dispute" USING btree ("order_id") WHERE "dispute"."status" = 'open';--> statement-breakpoint
CREATE INDEX "dispute_order_idx" ON "dispute" USING btree ("order_id");--> statement-breakpoint
CREATE INDEX "dispute_status_created_idx" ON "dispute" USING btree ("status","created_at");--> statement-breakpoint
CREATE INDEX "dispute_evidence_dispute_idx" ON "dispute_evidence" USING btree ("dispute_id","created_at");--> statement-breakpoint
CREATE INDEX "portfolio_item_tailor_idx" ON "portfolio_item" USING btree ("tailor_id","sort_order");--> statement-breakpoint
CREATE INDEX "tailor_profile_city_accepting_idx" ON "tailor_profile" USING btree ("city","accepting_work");--> statement-breakpoint
CREATE INDEX "tailor_profile_location_idx" ON "tailor_profile" USING btree ("lat","lng");--> statement-breakpoint
CREATE INDEX "tailor_profile_specialties_idx" ON "tailor_profile" USING gin ("specialties");--> statement-breakpoint
CREATE UNIQUE INDEX "quote_live_uq" ON "quote" USING btree ("commission_id","tailor_id") WHERE "quote"."status" in ('sent', 'accepted');--> statement-breakpoint
CREATE INDEX "quote_commission_status_idx" ON "quote" USING btree ("commission_id","status");--> statement-breakpoint
CREATE INDEX "quote_tailor_status_idx" ON "quote" USING btree ("tailor_id","status","created_at");--> statement-breakpoint
CREATE INDEX "message_thread_created_idx" ON "message" USING btree ("thread_id","created_at");--> statement-breakpoint
CREATE INDEX "message_attachment_message_idx" ON "message_attachment" USING btree ("message_id");--> statement-breakpoint
CREATE INDEX "message_thread_tailor_idx" ON "message_thread" USING btree ("tailor_id","last_message_at");--> statement-breakpoint
CREATE INDEX "fitting_order_idx" ON "fitting" USING btree ("order_id","starts_at");--> statement-breakpoint
CREATE INDEX "order_tailor_status_due_idx" ON "order" USING btree ("tailor_id","status","due_date");--> statement-breakpoint
CREATE INDEX "order_customer_idx" ON "order" USING btree ("customer_id","created_at");--> statement-breakpoint
CREATE INDEX "order_auto_release_idx" ON "order" USING btree ("auto_release_at") WHERE "order"."status" = 'delivered';--> statement-breakpoint
CREATE INDEX "progress_step_order_idx" ON "progress_step" USING btree ("order_id","recorded_at");--> statement-breakpoint
CREATE UNIQUE INDEX "ledger_entry_idempotency_account_uq" ON "ledger_entry" USING btree ("idempotency_key","account");--> statement-breakpoint
CREATE INDEX "ledger_entry_order_idx" ON "ledger_entry" USING btree ("order_id");--> statement-breakpoint
CREATE INDEX "ledger_entry_transaction_idx" ON "ledger_entry" USING btree ("transaction_id");--> statement-breakpoint
CREATE INDEX "ledger_entry_account_idx" ON "ledger_entry" USING btree ("account","currency");--> statement-breakpoint
CREATE INDEX "review_subject_published_idx" ON "review" USING btree ("subject_id","published_at");