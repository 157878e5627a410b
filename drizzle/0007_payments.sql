CREATE TYPE "public"."payment_kind" AS ENUM('charge', 'advance_transfer', 'release_transfer', 'refund', 'reversal');--> statement-breakpoint
CREATE TYPE "public"."payment_status" AS ENUM('pending', 'succeeded', 'failed');--> statement-breakpoint
CREATE TABLE "payment" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"order_id" uuid NOT NULL,
	"kind" "payment_kind" NOT NULL,
	"processor_id" text NOT NULL,
	"amount_minor" bigint NOT NULL,
	"currency" char(3) NOT NULL,
	"status" "payment_status" DEFAULT 'pending' NOT NULL,
	"idempotency_key" text NOT NULL,
	"failure_reason" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "payment_processor_id_unique" UNIQUE("processor_id"),
	CONSTRAINT "payment_idempotency_key_unique" UNIQUE("idempotency_key"),
	CONSTRAINT "payment_currency_iso" CHECK ("payment"."currency" ~ '^[A-Z]{3}$'),
	CONSTRAINT "payment_amount_positive" CHECK ("payment"."amount_minor" > 0)
);
--> statement-breakpoint
ALTER TABLE "ledger_entry" ADD COLUMN "payment_id" uuid;--> statement-breakpoint
ALTER TABLE "payment" ADD CONSTRAINT "payment_order_id_order_id_fk" FOREIGN KEY ("order_id") REFERENCES "public"."order"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "payment_order_idx" ON "payment" USING btree ("order_id","created_at");--> statement-breakpoint
ALTER TABLE "ledger_entry" ADD CONSTRAINT "ledger_entry_payment_id_payment_id_fk" FOREIGN KEY ("payment_id") REFERENCES "public"."payment"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "ledger_entry_payment_idx" ON "ledger_entry" USING btree ("payment_id");--> statement-breakpoint
-- Double entry, enforced by the database: at commit, the entries of every ledger transaction touched sum to
-- zero in each currency. Deferred, so a transaction's entries may be inserted one by one.
CREATE FUNCTION "ledger_transaction_balances"() RETURNS trigger LANGUAGE plpgsql AS $$
DECLARE
	unbalanced record;
BEGIN
	SELECT currency, sum(amount_minor) AS total INTO unbalanced
	FROM ledger_entry
	WHERE transaction_id = NEW.transaction_id
	GROUP BY currency
	HAVING sum(amount_minor) <> 0
	LIMIT 1;
	IF FOUND THEN
		RAISE EXCEPTION 'ledger transaction % does not sum to zero in % (off by %)',
			NEW.transaction_id, unbalanced.currency, unbalanced.total
			USING ERRCODE = 'check_violation', CONSTRAINT = 'ledger_transaction_sums_to_zero';
	END IF;
	RETURN NULL;
END;
$$;--> statement-breakpoint
CREATE CONSTRAINT TRIGGER "ledger_transaction_sums_to_zero"
	AFTER INSERT OR UPDATE ON "ledger_entry"
	DEFERRABLE INITIALLY DEFERRED
	FOR EACH ROW EXECUTE FUNCTION "ledger_transaction_balances"();--> statement-breakpoint
-- Entries are append-only: corrections are new transactions.
CREATE FUNCTION "ledger_entry_append_only"() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
	RAISE EXCEPTION 'ledger entries are append-only; post a correcting transaction instead'
		USING ERRCODE = 'restrict_violation';
END;
$$;--> statement-breakpoint
CREATE TRIGGER "ledger_entry_no_update_or_delete"
	BEFORE UPDATE OR DELETE ON "ledger_entry"
	FOR EACH ROW EXECUTE FUNCTION "ledger_entry_append_only"();
