/**
 * The follow-up report's part of /api/openapi.json: drafts and versions, sending, the PDF, the
 * owner's answer and a consultant's price table — generated from the zod schemas in
 * src/schemas/reports.ts that the endpoints parse and answer with. Merged by ./openapi.
 */
import { z } from 'zod';
import {
  createReportSchema,
  priceTableRequestSchema,
  priceTableResponseSchema,
  reportAnswerSchema,
  reportListResponseSchema,
  reportPatchSchema,
  reportResponseSchema,
} from '../schemas/reports';

const toSchema = (schema: z.ZodType, io: 'input' | 'output') =>
  z.toJSONSchema(schema, { io, unrepresentable: 'any', target: 'draft-2020-12' }) as Record<string, unknown>;

const error = (description: string) => ({ description, content: { 'application/json': { schema: { $ref: '#/components/schemas/Error' } } } });
const answer = (description: string, ref: string) => ({ description, content: { 'application/json': { schema: { $ref: `#/components/schemas/${ref}` } } } });
const body = (ref: string, required = true) => ({ required, content: { 'application/json': { schema: { $ref: `#/components/schemas/${ref}` } } } });

const guarded = {
  '401': error('Not signed in (or the account is deactivated).'),
  '404': error(
    'No report (or lead) with this id among those you can read: only the plant’s owner (sent versions), the consultant holding the lead and admins read a report. A malformed id answers the same.',
  ),
};
const forbidden = { '403': error('The account’s role may not do this.') };
const id = (description: string) => ({ name: 'id', in: 'path', required: true, description, schema: { type: 'string', format: 'uuid' } });
const leadId = id('The assessment id.');
const reportId = id('The report id.');

export function reportPaths() {
  return {
    '/api/leads/{id}/reports': {
      get: {
        summary: 'A lead’s report versions (and, for the consultant holding it, its draft), newest first',
        parameters: [leadId],
        responses: { '200': answer('The list; each version says whether a later one replaced it and whether the owner answered.', 'ReportList'), ...guarded },
      },
      post: {
        summary: 'Open the lead’s draft: the one already open, or a new one from the latest site-walk revision',
        description: 'A new draft copies the latest version’s composition (a correction), or the one named by fromVersion; blank starts from nothing. The body may be left out.',
        parameters: [leadId],
        requestBody: body('CreateReport', false),
        responses: {
          '201': answer('A new draft.', 'ReportResponse'),
          '200': answer('The draft that was already open.', 'ReportResponse'),
          '400': error('Invalid body, or no such version to copy.'),
          '409': error('The lead is at a stage no report can be sent from (signed or closed).'),
          ...forbidden,
          ...guarded,
        },
      },
    },
    '/api/reports/{id}': {
      get: {
        summary: 'One report whole: a version’s frozen figures, or a draft’s as composed now with the engine’s suggestion per run',
        parameters: [reportId],
        responses: { '200': answer('The report.', 'ReportResponse'), ...guarded },
      },
      patch: {
        summary: 'Save part of a draft (each part given replaces the draft’s) and get its figures back',
        parameters: [reportId],
        requestBody: body('ReportPatch'),
        responses: {
          '200': answer('Saved; the figures as composed now.', 'ReportResponse'),
          '400': error('Invalid body, a run or photo the lead does not have, or a choice the engine refuses (a material not rated for the line); each issue names its field.'),
          '409': error('The report is a sent version: sent versions never change; open a new draft to correct it.'),
          ...forbidden,
          ...guarded,
        },
      },
    },
    '/api/reports/{id}/send': {
      post: {
        summary: 'Send the draft: it is frozen as the next numbered version, the lead moves to report_sent, the PDF is rendered and mailed to the owner',
        description: 'Sending a version again changes nothing and answers 200 with it. A change from the engine’s suggestion needs its reason.',
        parameters: [reportId],
        responses: {
          '201': answer('Sent now as the next version.', 'ReportResponse'),
          '200': answer('Already sent: the version as it is.', 'ReportResponse'),
          '400': error('Something keeps the draft from being sent (a reason missing, a run no longer there); each issue names its field.'),
          '409': error('The lead is at a stage no report can be sent from.'),
          ...forbidden,
          ...guarded,
        },
      },
    },
    '/api/reports/{id}/pdf': {
      get: {
        summary: 'A sent version’s PDF, as a download',
        parameters: [reportId],
        responses: {
          '200': { description: 'The PDF (Content-Disposition: attachment; a sandboxing Content-Security-Policy).', content: { 'application/pdf': { schema: { type: 'string', contentMediaType: 'application/pdf' } } } },
          '409': error('A draft has no PDF.'),
          '503': error('The PDF is still being rendered, or storage does not answer; try again in a few seconds.'),
          ...guarded,
        },
      },
    },
    '/api/reports/{id}/answer': {
      post: {
        summary: 'The owner’s answer to the latest version: accept (asks to be contacted to go ahead) or decline, with an optional reason',
        description: 'The consultant is alerted by e-mail; the lead moves to signed or closed when the consultant confirms it with a pipeline move. Answering again the same way changes nothing.',
        parameters: [reportId],
        requestBody: body('ReportAnswer'),
        responses: {
          '200': answer('Answered.', 'ReportResponse'),
          '400': error('Invalid body; each issue names its field.'),
          '403': error('Only the plant’s owner answers a report.'),
          '409': error('Answered the other way already, or a later version replaced this one.'),
          ...guarded,
        },
      },
    },
    '/api/consultants/me/prices': {
      get: {
        summary: 'My installed-price table (null before the first save) and the demo grid to start from',
        responses: { '200': answer('The table.', 'PriceTableResponse'), '401': guarded['401'], ...forbidden },
      },
      put: {
        summary: 'Replace my installed-price table; the composer uses it in place of the demo table for plants priced in its currency',
        requestBody: body('PriceTableRequest'),
        responses: { '200': answer('Saved.', 'PriceTableResponse'), '400': error('Invalid table; each issue names its cell.'), '401': guarded['401'], ...forbidden },
      },
    },
  };
}

export function reportSchemas() {
  return {
    ReportList: toSchema(reportListResponseSchema, 'output'),
    CreateReport: toSchema(createReportSchema, 'input'),
    ReportPatch: toSchema(reportPatchSchema, 'input'),
    ReportResponse: toSchema(reportResponseSchema, 'output'),
    ReportAnswer: toSchema(reportAnswerSchema, 'input'),
    PriceTableRequest: toSchema(priceTableRequestSchema, 'input'),
    PriceTableResponse: toSchema(priceTableResponseSchema, 'output'),
  };
}
