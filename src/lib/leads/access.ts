/**
 * Who may reach a lead and which parts of it they see: the one place that decides. A consultant
 * reaches the leads of their regions (open or held by anyone) and the leads they hold; a lead
 * outside that is answered exactly like one that does not exist. Whoever may reassign leads
 * (admins) reaches every lead. The owner's contact details, the plant's name and full postal
 * code, the photos and the timeline go only to the consultant holding the lead and to admins —
 * never to the open list, in HTML or JSON.
 */
import { and, eq, inArray, ne, notInArray, or, sql, type SQL } from 'drizzle-orm';
import { assessments, regionConsultants, type AssessmentStatus } from '../../db/schema';
import { can } from '../guards';
import type { SessionUser } from '../session';
import { isHeldStage, isRevisableStage, pipeline, type MoveTarget } from './pipeline';

export interface LeadViewer {
  userId: string;
  /** `all`: every lead (admins); `regions`: the viewer's regions and the leads they hold. */
  reach: 'all' | 'regions';
}

export function leadViewerOf(user: SessionUser): LeadViewer {
  return { userId: user.id, reach: can(user, 'lead', 'reassign') ? 'all' : 'regions' };
}

/** Statuses a consultant never sees in their regions: not routed yet, or set aside as junk. */
const hiddenFromRegions: AssessmentStatus[] = ['unrouted', 'junk'];

/** The SQL condition on `assessments` for the leads `viewer` reaches. */
export function reachCondition(viewer: LeadViewer): SQL | undefined {
  if (viewer.reach === 'all') return undefined;
  const myRegions = sql`(select ${regionConsultants.regionId} from ${regionConsultants} where ${regionConsultants.userId} = ${viewer.userId})`;
  // Junk leaves every consultant's view, even the one who held it.
  return and(
    ne(assessments.status, 'junk'),
    or(eq(assessments.claimedByUserId, viewer.userId), and(notInArray(assessments.status, hiddenFromRegions), inArray(assessments.regionId, myRegions))),
  );
}

export interface LeadParts {
  /** Owner's name, company, e-mail and phone; the plant's name and full postal code. */
  contact: boolean;
  /** The photos themselves (signed links); everyone who reaches the lead sees how many there are. */
  photos: boolean;
  /** Notes, moves and the rest of the lead's history. */
  timeline: boolean;
  /** May take it on now. */
  claim: boolean;
  /** Moves the pipeline allows from here, for this viewer. */
  moves: MoveTarget[];
  release: boolean;
  note: boolean;
  /** May save a site-walk revision of the inventory. */
  revise: boolean;
}

/** What `viewer` sees of and may do with a lead they reach. */
export function leadPartsFor(viewer: LeadViewer, lead: { status: AssessmentStatus; claimedByUserId: string | null }): LeadParts {
  const holds = lead.claimedByUserId === viewer.userId && isHeldStage(lead.status);
  const inCharge = holds || (viewer.reach === 'all' && isHeldStage(lead.status));
  const full = holds || viewer.reach === 'all';
  return {
    contact: full,
    photos: full,
    timeline: full,
    claim: lead.status === 'fresh',
    moves: inCharge && isHeldStage(lead.status) ? [...pipeline[lead.status].moves] : [],
    release: inCharge && isHeldStage(lead.status) && pipeline[lead.status].release,
    note: inCharge,
    revise: inCharge && isRevisableStage(lead.status),
  };
}

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/** Whether a path segment can be a lead id at all; anything else is answered as not found. */
export function isLeadId(value: string | undefined): value is string {
  return typeof value === 'string' && UUID.test(value);
}

/**
 * The postal area everyone who reaches a lead sees: the first three characters of the code
 * (a US sectional center, a Canadian forward sortation area, a UK district), never all of it.
 */
export function postalArea(postalCodeNormalised: string): string {
  return postalCodeNormalised.slice(0, 3);
}
