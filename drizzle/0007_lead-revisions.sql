CREATE TABLE "lead_revisions" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"assessment_id" uuid NOT NULL,
	"number" integer NOT NULL,
	"base_number" integer NOT NULL,
	"plant_input" jsonb NOT NULL,
	"result_snapshot" jsonb NOT NULL,
	"engine_version" text NOT NULL,
	"author_user_id" uuid,
	"reason" text NOT NULL,
	"client_key" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "lead_revisions_number_follows_base" CHECK ("lead_revisions"."number" = "lead_revisions"."base_number" + 1 and "lead_revisions"."base_number" >= 0)
);
--> statement-breakpoint
ALTER TABLE "assessments" ADD COLUMN "revision_number" integer DEFAULT 0 NOT NULL;--> statement-breakpoint
ALTER TABLE "lead_revisions" ADD CONSTRAINT "lead_revisions_assessment_id_assessments_id_fk" FOREIGN KEY ("assessment_id") REFERENCES "public"."assessments"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "lead_revisions" ADD CONSTRAINT "lead_revisions_author_user_id_user_id_fk" FOREIGN KEY ("author_user_id") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "lead_revisions_assessment_number_key" ON "lead_revisions" USING btree ("assessment_id","number");--> statement-breakpoint
CREATE UNIQUE INDEX "lead_revisions_assessment_client_key" ON "lead_revisions" USING btree ("assessment_id","client_key");