import type { AssessmentStatus } from '../../db/schema';

/** How each pipeline state reads to the owner whose assessment it is. */
export const ownerStatusText: Record<AssessmentStatus, { label: string; explanation: string }> = {
  fresh: { label: 'Sent to consultants', explanation: 'Consultants who cover your region have been told; the first to take it on will contact you.' },
  claimed: { label: 'A consultant has it', explanation: 'A consultant has taken on your assessment and will contact you.' },
  in_touch: { label: 'In touch', explanation: 'Your consultant is talking with you about the plant.' },
  site_walk_booked: { label: 'Site visit booked', explanation: 'Your consultant will walk the lines, measure lengths and surface temperatures.' },
  report_sent: { label: 'Report sent', explanation: 'Your consultant has sent a detailed report; it is listed below.' },
  signed: { label: 'Work agreed', explanation: 'You and your consultant have agreed on the work.' },
  closed: { label: 'Closed', explanation: 'This assessment is closed.' },
  unrouted: { label: 'Finding a consultant', explanation: 'No consultant covers your postal code yet; we are finding one by hand.' },
  junk: { label: 'Not accepted', explanation: 'This submission was not accepted.' },
};
