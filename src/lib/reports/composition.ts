/**
 * A stored report's parts as the rest of the report reads them. Pure of the database, so the
 * composer's island can load it (./source builds the preview's source with it).
 */
import type { Report } from '../../db/schema';
import { reportCompositionSchema, type ReportComposition } from '../../schemas/reports';

/** The report's people as it names them. */
export interface ReportPerson {
  name: string;
  firm: string | null;
  email: string | null;
  phone: string | null;
}

/** A stored composition, read with today's contract (a draft saved before a field existed gets its default). */
export function compositionOf(report: Pick<Report, 'composition'>): ReportComposition {
  const parsed = reportCompositionSchema.safeParse(report.composition ?? {});
  return parsed.success ? parsed.data : reportCompositionSchema.parse({});
}
