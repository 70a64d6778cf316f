ALTER TABLE "assessments" ALTER COLUMN "currency" SET NOT NULL;--> statement-breakpoint
ALTER TABLE "assessments" ALTER COLUMN "annual_loss_cost" SET NOT NULL;--> statement-breakpoint
ALTER TABLE "assessments" ALTER COLUMN "annual_loss_cost_low" SET NOT NULL;--> statement-breakpoint
ALTER TABLE "assessments" ALTER COLUMN "annual_loss_cost_high" SET NOT NULL;--> statement-breakpoint
ALTER TABLE "assessments" ALTER COLUMN "annual_saving_cost" SET NOT NULL;--> statement-breakpoint
ALTER TABLE "assessments" ALTER COLUMN "run_count" SET NOT NULL;--> statement-breakpoint
ALTER TABLE "assessments" ALTER COLUMN "photo_count" SET NOT NULL;--> statement-breakpoint
ALTER TABLE "assessments" ALTER COLUMN "hazard_run_count" SET NOT NULL;--> statement-breakpoint
ALTER TABLE "assessments" ALTER COLUMN "services" SET NOT NULL;