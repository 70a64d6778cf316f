-- Custom SQL migration file, put your code below! --
-- Fills the desk's headline columns of assessments stored before the columns existed, reading
-- the same places of the result snapshot as src/lib/assessments/headline.ts (which fills them
-- on submission and recompute); photos are the image attachments.
UPDATE "assessments" AS a SET
	"currency" = a."result_snapshot"->>'currency',
	"annual_loss_cost" = (a."result_snapshot"->'range'->'currentAnnualCost'->>'likely')::double precision,
	"annual_loss_cost_low" = (a."result_snapshot"->'range'->'currentAnnualCost'->>'low')::double precision,
	"annual_loss_cost_high" = (a."result_snapshot"->'range'->'currentAnnualCost'->>'high')::double precision,
	"annual_saving_cost" = (a."result_snapshot"->'range'->'annualCostSaving'->>'likely')::double precision,
	"run_count" = jsonb_array_length(a."result_snapshot"->'runs'),
	"photo_count" = (SELECT count(*) FROM "attachments" f WHERE f."assessment_id" = a."id" AND f."content_type" LIKE 'image/%'),
	"hazard_run_count" = (
		SELECT count(*) FROM jsonb_array_elements(a."result_snapshot"->'runs') AS run
		WHERE jsonb_array_length(run->'hazards') > 0
	),
	"services" = (
		SELECT coalesce(array_agg(DISTINCT run->>'service' ORDER BY run->>'service'), '{}')
		FROM jsonb_array_elements(a."result_snapshot"->'runs') AS run
	)
WHERE a."run_count" IS NULL;
