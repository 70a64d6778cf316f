import { Button, Heading, Link, Section, Text } from '@react-email/components';
import { buttonStyle, Frame, mailColours, textStyle } from './Frame';

/** Sent to the owner when a consultant claims their assessment: who will contact them, and how to reach them first. */
export interface ConsultantIntroductionProps {
  contactName: string;
  reference: string;
  plantLabel: string;
  consultantName: string;
  firm: string | null;
  phone: string | null;
  email: string;
  assessmentUrl: string;
}

export const consultantIntroductionSubject = (p: Pick<ConsultantIntroductionProps, 'reference' | 'consultantName' | 'firm'>) =>
  `${p.consultantName}${p.firm ? ` of ${p.firm}` : ''} will contact you about ${p.reference}`;

export function ConsultantIntroduction(p: ConsultantIntroductionProps) {
  const who = p.firm ? `${p.consultantName} of ${p.firm}` : p.consultantName;
  return (
    <Frame preview={`${who} has taken on your assessment of ${p.plantLabel} and will be in touch.`}>
      <Heading as="h1" style={{ fontSize: 22, margin: '0 0 14px' }}>
        Your consultant for {p.reference}
      </Heading>
      <Text style={textStyle}>
        Hello {p.contactName}, {who} has taken on your assessment of {p.plantLabel}. They cover your area and will contact you to talk
        it through and arrange a visit to walk the lines.
      </Text>
      <Section style={{ backgroundColor: mailColours.paper, borderRadius: 6, padding: '14px 18px', margin: '0 0 16px' }}>
        <Text style={{ ...textStyle, margin: '0 0 4px' }}>
          <strong>{p.consultantName}</strong>
          {p.firm ? `, ${p.firm}` : ''}
        </Text>
        {p.phone && <Text style={{ ...textStyle, margin: '0 0 4px' }}>Phone: {p.phone}</Text>}
        <Text style={{ ...textStyle, margin: 0 }}>
          E-mail: <Link href={`mailto:${p.email}`}>{p.email}</Link>
        </Text>
      </Section>
      <Text style={textStyle}>You are welcome to call or write to them first. Your assessment and its figures stay where they were:</Text>
      <Button href={p.assessmentUrl} style={buttonStyle}>
        See my assessment
      </Button>
      <Text style={{ ...textStyle, color: mailColours.muted, fontSize: 13, marginTop: 18 }}>
        Lagwise passed your assessment only to this consultant. If nobody gets in touch within a few working days, reply to this e-mail.
      </Text>
    </Frame>
  );
}
