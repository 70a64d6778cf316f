/**
 * Pipeline states of an assessment, in our own words (see the product brief). Apart from the
 * schema module so browser code (the desk's islands) can read them without the database layer.
 */
export const assessmentStatuses = [
  'fresh',
  'claimed',
  'in_touch',
  'site_walk_booked',
  'report_sent',
  'signed',
  'closed',
  'unrouted',
  'junk',
] as const;
export type AssessmentStatus = (typeof assessmentStatuses)[number];
