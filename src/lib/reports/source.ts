/**
 * What a stored report is presented from (../present's ReportSource): for a sent version only
 * what it froze, so the same version always reads the same.
 */
import type { LeadRecord } from '../../db/queries/leads';
import type { Report } from '../../db/schema';
import type { PlantResult } from '../../engine';
import type { ReportView } from '../../schemas/reports';
import { unitSystemOf } from '../assessments/questionnaire';
import type { ReportSource } from './present';
import { compositionOf, type ReportPerson } from './composition';

/** A sent version's source, from its frozen columns and the lead's name and units. */
export function frozenSource(report: Report, lead: LeadRecord['lead'], replacedBy: ReportSource['replacedBy']): ReportSource {
  if (report.status !== 'sent' || !report.resultSnapshot || !report.plantInput) throw new Error('only a sent version has a frozen source');
  return {
    result: report.resultSnapshot as PlantResult,
    composition: compositionOf(report),
    plantInput: report.plantInput as Record<string, unknown>,
    consultant: report.consultant as ReportPerson,
    plant: { name: lead.plantName || lead.companyName, reference: lead.reference, unitSystem: unitSystemOf(lead.questionnaire) },
    version: report.version,
    sentAt: report.sentAt ? report.sentAt.toISOString() : null,
    replacedBy,
    baseRevisionNumber: report.baseRevisionNumber,
  };
}

/** The source of a report as the API answers it (the page and the composer's preview read this). */
export function viewSource(view: ReportView): ReportSource {
  return {
    result: view.result as unknown as PlantResult,
    composition: view.composition,
    plantInput: view.plantInput,
    consultant: view.consultant,
    plant: { name: view.plant.name, reference: view.lead.reference, unitSystem: view.plant.unitSystem },
    version: view.version,
    sentAt: view.sentAt,
    replacedBy: view.replacedBy,
    baseRevisionNumber: view.baseRevisionNumber,
  };
}
