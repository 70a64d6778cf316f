import { Button, Heading, Section, Text } from '@react-email/components';
import { buttonStyle, Frame, mailColours, textStyle } from './Frame';

/** To the owner when a version of the report is sent: the headline figures, the link, the PDF attached. */
export interface ReportSentProps {
  contactName: string;
  reference: string;
  plantLabel: string;
  version: number;
  corrects: boolean;
  consultantLine: string;
  saving: string;
  savingRange: string | null;
  installedCost: string;
  payback: string;
  reportUrl: string;
  fileName: string;
}

export const reportSentSubject = (p: Pick<ReportSentProps, 'reference' | 'version' | 'corrects'>) =>
  p.corrects ? `Corrected report for ${p.reference} (version ${p.version})` : `Your follow-up report for ${p.reference}`;

export function ReportSent(p: ReportSentProps) {
  return (
    <Frame preview={`${p.consultantLine} sent ${p.corrects ? 'a corrected' : 'the'} report on ${p.plantLabel}: about ${p.saving} a year to save.`}>
      <Heading as="h1" style={{ fontSize: 22, margin: '0 0 14px' }}>
        {p.corrects ? `Version ${p.version} of your report` : 'Your follow-up report'}
      </Heading>
      <Text style={textStyle}>
        Hello {p.contactName}, {p.consultantLine} has {p.corrects ? 'corrected' : 'written'} the report on {p.plantLabel} ({p.reference}).
        {p.corrects ? ' It replaces the earlier version, which stays readable.' : ''} The PDF is attached ({p.fileName}).
      </Text>
      <Section style={{ backgroundColor: mailColours.paper, borderRadius: 6, padding: '14px 18px', margin: '0 0 16px' }}>
        <Text style={{ ...textStyle, margin: '0 0 4px' }}>
          Saving a year: <strong>{p.saving}</strong>
          {p.savingRange ? ` (likely ${p.savingRange})` : ''}
        </Text>
        <Text style={{ ...textStyle, margin: '0 0 4px' }}>
          Installed cost: <strong>{p.installedCost}</strong>
        </Text>
        <Text style={{ ...textStyle, margin: 0 }}>
          Payback: <strong>{p.payback}</strong>
        </Text>
      </Section>
      <Text style={textStyle}>Read it on any screen, download it again, and tell your consultant whether to go ahead:</Text>
      <Button href={p.reportUrl} style={buttonStyle}>
        Read the report
      </Button>
    </Frame>
  );
}

/** To the consultant holding the lead when the owner answers a version. */
export interface ReportAnsweredProps {
  consultantName: string;
  reference: string;
  plantLabel: string;
  version: number;
  accepted: boolean;
  reason: string | null;
  contactName: string;
  leadUrl: string;
}

export const reportAnsweredSubject = (p: Pick<ReportAnsweredProps, 'reference' | 'accepted' | 'version'>) =>
  p.accepted ? `${p.reference}: the owner wants to go ahead (version ${p.version})` : `${p.reference}: the owner declined version ${p.version}`;

export function ReportAnswered(p: ReportAnsweredProps) {
  return (
    <Frame preview={p.accepted ? `${p.contactName} accepted your report and asks you to get in touch.` : `${p.contactName} declined your report.`}>
      <Heading as="h1" style={{ fontSize: 22, margin: '0 0 14px' }}>
        {p.accepted ? 'The owner wants to go ahead' : 'The owner declined the report'}
      </Heading>
      <Text style={textStyle}>
        Hello {p.consultantName}, {p.contactName} {p.accepted ? 'accepted' : 'declined'} version {p.version} of your report on {p.plantLabel} ({p.reference})
        {p.accepted ? ' and asks you to contact them to go ahead.' : '.'}
      </Text>
      {p.reason && (
        <Text style={{ ...textStyle, borderLeft: `3px solid ${mailColours.line}`, paddingLeft: 12 }}>
          “{p.reason}”
        </Text>
      )}
      <Text style={textStyle}>
        {p.accepted ? 'Once the work is agreed, mark the lead “Work agreed” on your desk.' : 'When you have spoken with them, close the lead on your desk.'}
      </Text>
      <Button href={p.leadUrl} style={buttonStyle}>
        Open the lead
      </Button>
    </Frame>
  );
}
