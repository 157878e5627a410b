CREATE TABLE "local_place" (
	"id" text PRIMARY KEY NOT NULL,
	"name" text NOT NULL,
	"admin" text DEFAULT '' NOT NULL,
	"country" char(2) NOT NULL,
	"lat" double precision NOT NULL,
	"lng" double precision NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "local_place_lat_range" CHECK ("local_place"."lat" between -90 and 90),
	CONSTRAINT "local_place_lng_range" CHECK ("local_place"."lng" between -180 and 180),
	CONSTRAINT "local_place_country_iso" CHECK ("local_place"."country" ~ '^[A-Z]{2}$')
);
--> statement-breakpoint
CREATE INDEX "local_place_name_idx" ON "local_place" USING btree (lower("name") text_pattern_ops);