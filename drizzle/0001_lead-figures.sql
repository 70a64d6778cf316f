CREATE TABLE "consultant_profiles" (
	"user_id" uuid PRIMARY KEY NOT NULL,
	"firm" text NOT NULL,
	"phone" text,
	"open_claim_cap" integer DEFAULT 5 NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "consultant_profiles_cap_range" CHECK ("consultant_profiles"."open_claim_cap" between 1 and 100)
);
--> statement-breakpoint
ALTER TABLE "assessments" ADD COLUMN "currency" char(3);--> statement-breakpoint
ALTER TABLE "assessments" ADD COLUMN "annual_loss_cost" double precision;--> statement-breakpoint
ALTER TABLE "assessments" ADD COLUMN "annual_loss_cost_low" double precision;--> statement-breakpoint
ALTER TABLE "assessments" ADD COLUMN "annual_loss_cost_high" double precision;--> statement-breakpoint
ALTER TABLE "assessments" ADD COLUMN "annual_saving_cost" double precision;--> statement-breakpoint
ALTER TABLE "assessments" ADD COLUMN "run_count" integer;--> statement-breakpoint
ALTER TABLE "assessments" ADD COLUMN "photo_count" integer;--> statement-breakpoint
ALTER TABLE "assessments" ADD COLUMN "hazard_run_count" integer;--> statement-breakpoint
ALTER TABLE "assessments" ADD COLUMN "services" text[];--> statement-breakpoint
ALTER TABLE "consultant_profiles" ADD CONSTRAINT "consultant_profiles_user_id_user_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."user"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "assessments_open_list_idx" ON "assessments" USING btree ("region_id","created_at" DESC NULLS LAST,"id" DESC NULLS LAST) WHERE "assessments"."status" = 'fresh';