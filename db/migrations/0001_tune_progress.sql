CREATE TABLE "tune_progress" (
	"user_id" uuid NOT NULL,
	"tune_id" uuid NOT NULL,
	"reached_stage" integer DEFAULT 0 NOT NULL,
	"started_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "tune_progress_user_id_tune_id_pk" PRIMARY KEY("user_id","tune_id"),
	CONSTRAINT "tune_progress_stage_nonneg" CHECK ("tune_progress"."reached_stage" >= 0)
);
--> statement-breakpoint
ALTER TABLE "tune_progress" ADD CONSTRAINT "tune_progress_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "tune_progress" ADD CONSTRAINT "tune_progress_tune_id_tunes_id_fk" FOREIGN KEY ("tune_id") REFERENCES "public"."tunes"("id") ON DELETE cascade ON UPDATE no action;