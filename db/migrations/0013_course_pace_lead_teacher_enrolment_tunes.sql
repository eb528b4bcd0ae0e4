CREATE TYPE "public"."course_pace" AS ENUM('self_paced', 'teacher_sign_off');--> statement-breakpoint
CREATE TABLE "enrolment_tunes" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"enrolment_id" uuid NOT NULL,
	"tune_id" uuid NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "enrolment_tunes_uq" UNIQUE("enrolment_id","tune_id")
);
--> statement-breakpoint
ALTER TABLE "stage_states" ALTER COLUMN "assignment_student_id" DROP NOT NULL;--> statement-breakpoint
-- Existing courses are led by the teacher who wrote them; existing enrolments follow their course's lead teacher.
ALTER TABLE "courses" ADD COLUMN "lead_teacher_id" uuid;--> statement-breakpoint
UPDATE "courses" SET "lead_teacher_id" = "teacher_id";--> statement-breakpoint
ALTER TABLE "courses" ALTER COLUMN "lead_teacher_id" SET NOT NULL;--> statement-breakpoint
ALTER TABLE "courses" ADD COLUMN "pace" "course_pace" DEFAULT 'teacher_sign_off' NOT NULL;--> statement-breakpoint
ALTER TABLE "enrolments" ADD COLUMN "teacher_id" uuid;--> statement-breakpoint
ALTER TABLE "enrolments" ADD COLUMN "teacher_since" timestamp with time zone DEFAULT now() NOT NULL;--> statement-breakpoint
UPDATE "enrolments" e SET "teacher_id" = c."lead_teacher_id", "teacher_since" = e."enrolled_at" FROM "courses" c WHERE c."id" = e."course_id";--> statement-breakpoint
ALTER TABLE "enrolments" ALTER COLUMN "teacher_id" SET NOT NULL;--> statement-breakpoint
INSERT INTO "roster_entries" ("teacher_id", "student_id") SELECT DISTINCT "teacher_id", "user_id" FROM "enrolments" ON CONFLICT DO NOTHING;--> statement-breakpoint
ALTER TABLE "enrolments" ADD COLUMN "welcomed_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "check_ins" ADD COLUMN "self_signed_off" boolean DEFAULT false NOT NULL;--> statement-breakpoint
ALTER TABLE "stage_states" ADD COLUMN "enrolment_tune_id" uuid;--> statement-breakpoint
ALTER TABLE "email_outbox" ADD COLUMN "send_after" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "uploads" ADD COLUMN "enrolment_tune_id" uuid;--> statement-breakpoint
ALTER TABLE "enrolment_tunes" ADD CONSTRAINT "enrolment_tunes_enrolment_id_enrolments_id_fk" FOREIGN KEY ("enrolment_id") REFERENCES "public"."enrolments"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "enrolment_tunes" ADD CONSTRAINT "enrolment_tunes_tune_id_tunes_id_fk" FOREIGN KEY ("tune_id") REFERENCES "public"."tunes"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "enrolment_tunes_tune_idx" ON "enrolment_tunes" USING btree ("tune_id");--> statement-breakpoint
ALTER TABLE "courses" ADD CONSTRAINT "courses_lead_teacher_id_users_id_fk" FOREIGN KEY ("lead_teacher_id") REFERENCES "public"."users"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "enrolments" ADD CONSTRAINT "enrolments_teacher_id_users_id_fk" FOREIGN KEY ("teacher_id") REFERENCES "public"."users"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "stage_states" ADD CONSTRAINT "stage_states_enrolment_tune_id_enrolment_tunes_id_fk" FOREIGN KEY ("enrolment_tune_id") REFERENCES "public"."enrolment_tunes"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "uploads" ADD CONSTRAINT "uploads_enrolment_tune_id_enrolment_tunes_id_fk" FOREIGN KEY ("enrolment_tune_id") REFERENCES "public"."enrolment_tunes"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "enrolments_teacher_since_idx" ON "enrolments" USING btree ("teacher_id","teacher_since");--> statement-breakpoint
ALTER TABLE "stage_states" ADD CONSTRAINT "stage_states_enrolment_tune_uq" UNIQUE("enrolment_tune_id","stage_index");--> statement-breakpoint
ALTER TABLE "stage_states" ADD CONSTRAINT "stage_states_one_holder" CHECK (num_nonnulls("stage_states"."assignment_student_id", "stage_states"."enrolment_tune_id") = 1);