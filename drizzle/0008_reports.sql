CREATE TYPE "public"."report_status" AS ENUM('draft', 'sent');--> statement-breakpoint
CREATE TABLE "consultant_price_tables" (
	"user_id" uuid PRIMARY KEY NOT NULL,
	"currency" char(3) NOT NULL,
	"price_table" jsonb NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "reports" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"assessment_id" uuid NOT NULL,
	"author_user_id" uuid,
	"status" "report_status" DEFAULT 'draft' NOT NULL,
	"version" integer,
	"base_revision_number" integer NOT NULL,
	"composition" jsonb NOT NULL,
	"plant_input" jsonb,
	"result_snapshot" jsonb,
	"engine_version" text,
	"consultant" jsonb,
	"sent_at" timestamp with time zone,
	"pdf_object_key" text,
	"pdf_byte_size" integer,
	"pdf_rendered_at" timestamp with time zone,
	"answer" text,
	"answer_reason" text,
	"answered_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "reports_version_when_sent" CHECK (("reports"."status" = 'draft') = ("reports"."version" is null) and ("reports"."version" is null or "reports"."version" >= 1)),
	CONSTRAINT "reports_frozen_when_sent" CHECK ("reports"."status" = 'draft' or ("reports"."result_snapshot" is not null and "reports"."plant_input" is not null and "reports"."sent_at" is not null)),
	CONSTRAINT "reports_answer_kind" CHECK ("reports"."answer" is null or "reports"."answer" in ('accepted', 'declined'))
);
--> statement-breakpoint
ALTER TABLE "consultant_price_tables" ADD CONSTRAINT "consultant_price_tables_user_id_user_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."user"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "reports" ADD CONSTRAINT "reports_assessment_id_assessments_id_fk" FOREIGN KEY ("assessment_id") REFERENCES "public"."assessments"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "reports" ADD CONSTRAINT "reports_author_user_id_user_id_fk" FOREIGN KEY ("author_user_id") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "reports_assessment_idx" ON "reports" USING btree ("assessment_id","created_at");--> statement-breakpoint
CREATE UNIQUE INDEX "reports_assessment_version_key" ON "reports" USING btree ("assessment_id","version");--> statement-breakpoint
CREATE UNIQUE INDEX "reports_one_draft_key" ON "reports" USING btree ("assessment_id") WHERE "reports"."status" = 'draft';