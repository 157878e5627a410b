CREATE TABLE "commission_measurements" (
	"commission_id" uuid PRIMARY KEY NOT NULL,
	"profile_id" uuid,
	"label" text NOT NULL,
	"unit" "length_unit" DEFAULT 'cm' NOT NULL,
	"values_mm" jsonb NOT NULL,
	"taken_by" "measurement_taker" DEFAULT 'self' NOT NULL,
	"taken_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "commission_size_band" (
	"commission_id" uuid NOT NULL,
	"dimension" text NOT NULL,
	"position" integer NOT NULL,
	"lower_mm" integer NOT NULL,
	"upper_mm" integer NOT NULL,
	CONSTRAINT "commission_size_band_commission_id_dimension_pk" PRIMARY KEY("commission_id","dimension"),
	CONSTRAINT "commission_size_band_order" CHECK ("commission_size_band"."lower_mm" < "commission_size_band"."upper_mm")
);
--> statement-breakpoint
CREATE TABLE "portfolio_photo" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"item_id" uuid NOT NULL,
	"storage_key" text NOT NULL,
	"thumb_key" text NOT NULL,
	"content_type" text NOT NULL,
	"bytes" integer NOT NULL,
	"width" integer NOT NULL,
	"height" integer NOT NULL,
	"alt_text" text DEFAULT '' NOT NULL,
	"sort_order" integer DEFAULT 0 NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "portfolio_photo_storage_key_unique" UNIQUE("storage_key"),
	CONSTRAINT "portfolio_photo_thumb_key_unique" UNIQUE("thumb_key"),
	CONSTRAINT "portfolio_photo_size_positive" CHECK ("portfolio_photo"."bytes" > 0 and "portfolio_photo"."width" > 0 and "portfolio_photo"."height" > 0)
);
--> statement-breakpoint
DROP INDEX "user_email_lower_idx";--> statement-breakpoint
ALTER TABLE "commission" ADD COLUMN "garment_other" text DEFAULT '' NOT NULL;--> statement-breakpoint
ALTER TABLE "commission" ADD COLUMN "measurement_profile_id" uuid;--> statement-breakpoint
ALTER TABLE "commission" ADD COLUMN "country_code" char(2);--> statement-breakpoint
ALTER TABLE "commission" ADD COLUMN "expires_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "commission_photo" ADD COLUMN "thumb_key" text;--> statement-breakpoint
ALTER TABLE "commission_photo" ADD COLUMN "alt_text" text DEFAULT '' NOT NULL;--> statement-breakpoint
ALTER TABLE "tailor_profile" ADD COLUMN "country_code" char(2);--> statement-breakpoint
ALTER TABLE "tailor_profile" ADD COLUMN "lead_times" jsonb DEFAULT '{}'::jsonb NOT NULL;--> statement-breakpoint
ALTER TABLE "tailor_profile" ADD COLUMN "hourly_rate_minor" integer;--> statement-breakpoint
ALTER TABLE "tailor_profile" ADD COLUMN "rate_currency" char(3);--> statement-breakpoint
ALTER TABLE "tailor_profile" ADD COLUMN "labour_hours" jsonb DEFAULT '{}'::jsonb NOT NULL;--> statement-breakpoint
ALTER TABLE "tailor_profile" ADD COLUMN "fabric_markup_percent" integer DEFAULT 0 NOT NULL;--> statement-breakpoint
ALTER TABLE "tailor_profile" ADD COLUMN "onboarded_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "measurement_profile" ADD COLUMN "unit" "length_unit" DEFAULT 'cm' NOT NULL;--> statement-breakpoint
ALTER TABLE "commission_measurements" ADD CONSTRAINT "commission_measurements_commission_id_commission_id_fk" FOREIGN KEY ("commission_id") REFERENCES "public"."commission"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "commission_size_band" ADD CONSTRAINT "commission_size_band_commission_id_commission_id_fk" FOREIGN KEY ("commission_id") REFERENCES "public"."commission"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "portfolio_photo" ADD CONSTRAINT "portfolio_photo_item_id_portfolio_item_id_fk" FOREIGN KEY ("item_id") REFERENCES "public"."portfolio_item"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "commission_size_band_dimension_idx" ON "commission_size_band" USING btree ("dimension","lower_mm");--> statement-breakpoint
CREATE INDEX "portfolio_photo_item_idx" ON "portfolio_photo" USING btree ("item_id","sort_order");--> statement-breakpoint
ALTER TABLE "commission" ADD CONSTRAINT "commission_measurement_profile_id_measurement_profile_id_fk" FOREIGN KEY ("measurement_profile_id") REFERENCES "public"."measurement_profile"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "user_email_lower_uq" ON "user" USING btree (lower("email"));--> statement-breakpoint
CREATE INDEX "commission_open_expiry_idx" ON "commission" USING btree ("expires_at") WHERE "commission"."status" = 'open';--> statement-breakpoint
ALTER TABLE "commission_photo" ADD CONSTRAINT "commission_photo_thumb_key_unique" UNIQUE("thumb_key");--> statement-breakpoint
ALTER TABLE "tailor_profile" ADD CONSTRAINT "tailor_profile_rate_positive" CHECK ("tailor_profile"."hourly_rate_minor" > 0);--> statement-breakpoint
ALTER TABLE "tailor_profile" ADD CONSTRAINT "tailor_profile_rate_currency_iso" CHECK ("tailor_profile"."rate_currency" ~ '^[A-Z]{3}$');--> statement-breakpoint
ALTER TABLE "tailor_profile" ADD CONSTRAINT "tailor_profile_markup_range" CHECK ("tailor_profile"."fabric_markup_percent" between 0 and 500);--> statement-breakpoint
INSERT INTO "commission_measurements" ("commission_id", "profile_id", "label", "values_mm", "taken_by", "taken_at")
SELECT "id", ("measurement_snapshot"->>'profileId')::uuid, "measurement_snapshot"->>'label',
	"measurement_snapshot"->'valuesMm', ("measurement_snapshot"->>'takenBy')::"measurement_taker",
	("measurement_snapshot"->>'takenAt')::timestamptz
FROM "commission" WHERE "measurement_snapshot" IS NOT NULL;
