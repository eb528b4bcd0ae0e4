CREATE TYPE "public"."listening_status" AS ENUM('done', 'failed');--> statement-breakpoint
CREATE TABLE "check_in_listenings" (
	"check_in_id" uuid PRIMARY KEY NOT NULL,
	"status" "listening_status" NOT NULL,
	"result" jsonb,
	"error" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "check_in_listenings" ADD CONSTRAINT "check_in_listenings_check_in_id_check_ins_id_fk" FOREIGN KEY ("check_in_id") REFERENCES "public"."check_ins"("id") ON DELETE cascade ON UPDATE no action;