ALTER TABLE "payments" ADD COLUMN "failure_message" text;--> statement-breakpoint
ALTER TABLE "payments" ADD COLUMN "receipt_number" text;--> statement-breakpoint
ALTER TABLE "payments" ADD COLUMN "period_start" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "payments" ADD COLUMN "period_end" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "subscriptions" ADD COLUMN "current_period_start" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "subscriptions" ADD COLUMN "canceled_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "uploads" ADD COLUMN "assignment_student_id" uuid;--> statement-breakpoint
ALTER TABLE "uploads" ADD COLUMN "stage_index" integer;--> statement-breakpoint
ALTER TABLE "uploads" ADD CONSTRAINT "uploads_assignment_student_id_assignment_students_id_fk" FOREIGN KEY ("assignment_student_id") REFERENCES "public"."assignment_students"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "payments_plan_created_idx" ON "payments" USING btree ("plan_id","created_at");