/**
 * The mails of the admin area: a consultant's invitation, a password-reset link, the admin's
 * notices about leads that need a person, and a lead handed to a consultant by the admin.
 */
import { Button, Heading, Section, Text } from '@react-email/components';
import { buttonStyle, Frame, mailColours, textStyle } from './Frame';

const boxStyle = { backgroundColor: mailColours.paper, borderRadius: 6, padding: '14px 18px', margin: '0 0 16px' } as const;

export interface ConsultantInvitationProps {
  name: string;
  firm: string;
  invitedByName: string;
  inviteUrl: string;
  /** When the link stops working, already worded (e.g. "9 December 2026"). */
  expiresOn: string;
}

export const consultantInvitationSubject = (p: Pick<ConsultantInvitationProps, 'firm'>) => `Your Lagwise consultant account for ${p.firm}`;

export function ConsultantInvitation(p: ConsultantInvitationProps) {
  return (
    <Frame preview={`Set a password to start taking leads on Lagwise. The link works until ${p.expiresOn}.`}>
      <Heading as="h1" style={{ fontSize: 22, margin: '0 0 14px' }}>
        Welcome to Lagwise, {p.name}
      </Heading>
      <Text style={textStyle}>
        {p.invitedByName} has made a consultant account for you at {p.firm}. Owners of food plants in your regions send us
        inventories of their pipe runs; you see them on your desk, take on the ones you want and follow them through to a report.
      </Text>
      <Text style={textStyle}>Choose a password to finish. The link works once, until {p.expiresOn}.</Text>
      <Button href={p.inviteUrl} style={buttonStyle}>
        Choose my password
      </Button>
      <Text style={{ ...textStyle, color: mailColours.muted, margin: '16px 0 0' }}>
        Not expecting this? Ignore it: without a password nobody can use the account.
      </Text>
    </Frame>
  );
}

export interface PasswordResetProps {
  name: string;
  resetUrl: string;
}

export const passwordResetSubject = 'Choose a new Lagwise password';

export function PasswordReset(p: PasswordResetProps) {
  return (
    <Frame preview="A link to choose a new password; it works once, within the hour.">
      <Heading as="h1" style={{ fontSize: 22, margin: '0 0 14px' }}>
        A new password
      </Heading>
      <Text style={textStyle}>
        Hello {p.name}, someone (we hope you) asked to choose a new password for your Lagwise account. The link works once,
        within the hour; choosing a new password signs you out everywhere else.
      </Text>
      <Button href={p.resetUrl} style={buttonStyle}>
        Choose a new password
      </Button>
      <Text style={{ ...textStyle, color: mailColours.muted, margin: '16px 0 0' }}>
        If you did not ask, ignore this mail; your password stays as it is.
      </Text>
    </Frame>
  );
}

export interface UnroutedNoticeProps {
  adminName: string;
  reference: string;
  plantType: string;
  place: string;
  /** From the shared presentation; null when the stored figures cannot be shown. */
  annualCost: string | null;
  leadUrl: string;
  attentionUrl: string;
}

export const unroutedNoticeSubject = (p: Pick<UnroutedNoticeProps, 'reference' | 'place'>) => `No region covers ${p.place}: ${p.reference} waits for you`;

export function UnroutedNotice(p: UnroutedNoticeProps) {
  return (
    <Frame preview={`An assessment from ${p.place} matched no region; it waits until you route it.`}>
      <Heading as="h1" style={{ fontSize: 22, margin: '0 0 14px' }}>
        An assessment matched no region
      </Heading>
      <Text style={textStyle}>
        Hello {p.adminName}, an owner has sent an assessment from a postal code no region covers, so no consultant was told.
        The owner has been told a person will route it.
      </Text>
      <Section style={boxStyle}>
        <Text style={{ ...textStyle, margin: '0 0 4px' }}>
          <strong>{p.reference}</strong> · {p.plantType} · {p.place}
        </Text>
        {p.annualCost && <Text style={{ ...textStyle, margin: 0 }}>Estimated loss {p.annualCost} a year.</Text>}
      </Section>
      <Text style={textStyle}>Hand it to a consultant, or add the postal code to a region: it is then routed at once.</Text>
      <Button href={p.attentionUrl} style={buttonStyle}>
        Open the leads that need a person
      </Button>
      <Text style={{ ...textStyle, margin: '16px 0 0' }}>
        <a href={p.leadUrl}>The lead itself</a>
      </Text>
    </Frame>
  );
}

export interface StaleDigestProps {
  adminName: string;
  staleAfterHours: number;
  leads: { reference: string; regionName: string; waitingHours: number; url: string }[];
  /** How many more wait beyond the ones listed. */
  more: number;
  attentionUrl: string;
}

export const staleDigestSubject = (p: Pick<StaleDigestProps, 'leads' | 'more'>) => {
  const n = p.leads.length + p.more;
  return `${n} open lead${n === 1 ? '' : 's'} nobody has taken on`;
};

function waited(hours: number): string {
  return hours < 72 ? `${hours} h` : `${Math.floor(hours / 24)} days`;
}

export function StaleDigest(p: StaleDigestProps) {
  const n = p.leads.length + p.more;
  return (
    <Frame preview={`${n} lead${n === 1 ? ' has' : 's have'} waited more than ${p.staleAfterHours} hours for a consultant.`}>
      <Heading as="h1" style={{ fontSize: 22, margin: '0 0 14px' }}>
        Leads waiting too long
      </Heading>
      <Text style={textStyle}>
        Hello {p.adminName}, {n === 1 ? 'this lead has' : 'these leads have'} been open for more than {p.staleAfterHours} hours
        without a consultant taking {n === 1 ? 'it' : 'them'} on. This mail comes at most once a day.
      </Text>
      <Section style={boxStyle}>
        {p.leads.map((lead) => (
          <Text key={lead.reference} style={{ ...textStyle, margin: '0 0 4px' }}>
            <a href={lead.url}>{lead.reference}</a> · {lead.regionName} · open {waited(lead.waitingHours)}
          </Text>
        ))}
        {p.more > 0 && <Text style={{ ...textStyle, margin: 0 }}>… and {p.more} more.</Text>}
      </Section>
      <Button href={p.attentionUrl} style={buttonStyle}>
        Open the leads that need a person
      </Button>
    </Frame>
  );
}

export interface LeadAssignedProps {
  consultantName: string;
  reference: string;
  plantType: string;
  area: string;
  reason: string;
  leadUrl: string;
}

export const leadAssignedSubject = (p: Pick<LeadAssignedProps, 'reference' | 'plantType'>) =>
  `A lead for you: ${p.plantType.toLowerCase()} (${p.reference})`;

export function LeadAssigned(p: LeadAssignedProps) {
  return (
    <Frame preview={`The admin has handed you ${p.reference}; it is on your desk under My leads.`}>
      <Heading as="h1" style={{ fontSize: 22, margin: '0 0 14px' }}>
        A lead handed to you
      </Heading>
      <Text style={textStyle}>
        Hello {p.consultantName}, the Lagwise admin has handed you a lead: {p.reference}, a {p.plantType.toLowerCase()} in postal
        area {p.area}. The owner has been told you will be in touch.
      </Text>
      <Section style={boxStyle}>
        <Text style={{ ...textStyle, margin: 0 }}>Why: {p.reason}</Text>
      </Section>
      <Button href={p.leadUrl} style={buttonStyle}>
        Open the lead
      </Button>
    </Frame>
  );
}
