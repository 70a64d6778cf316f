CREATE TABLE "sign_in_throttles" (
	"key" text PRIMARY KEY NOT NULL,
	"failures" integer DEFAULT 0 NOT NULL,
	"locked_until" timestamp with time zone,
	"last_failure_at" timestamp with time zone NOT NULL
);
--> statement-breakpoint
ALTER TABLE "assessments" ADD COLUMN "idempotency_fingerprint" text;