CREATE TYPE "public"."refund_attempt_status" AS ENUM('pending', 'done', 'failed');--> statement-breakpoint
CREATE TABLE "refund_attempts" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"payment_id" uuid NOT NULL,
	"amount" integer NOT NULL,
	"reason" text NOT NULL,
	"created_by" uuid,
	"idempotency_key" text NOT NULL,
	"stripe_refund_id" text,
	"status" "refund_attempt_status" DEFAULT 'pending' NOT NULL,
	"error" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"finished_at" timestamp with time zone,
	CONSTRAINT "refund_attempts_stripe_refund_id_unique" UNIQUE("stripe_refund_id"),
	CONSTRAINT "refund_attempts_amount_pos" CHECK ("refund_attempts"."amount" > 0)
);
--> statement-breakpoint
ALTER TABLE "webhook_events" ADD COLUMN "error" text;--> statement-breakpoint
ALTER TABLE "refund_attempts" ADD CONSTRAINT "refund_attempts_payment_id_payments_id_fk" FOREIGN KEY ("payment_id") REFERENCES "public"."payments"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "refund_attempts" ADD CONSTRAINT "refund_attempts_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "refund_attempts_one_pending_idx" ON "refund_attempts" USING btree ("payment_id") WHERE "refund_attempts"."status" = 'pending';