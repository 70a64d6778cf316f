import { Button, Heading, Link, Section, Text } from '@react-email/components';
import { cautions } from '../../cautions';
import { buttonStyle, Frame, mailColours, textStyle } from './Frame';

export interface SubmissionConfirmationProps {
  contactName: string;
  reference: string;
  plantLabel: string;
  runCount: number;
  signInUrl: string;
  signInPageUrl: string;
  regionName: string | null;
  postalCode: string;
  /** Figures from the shared presentation, so the template only lays out; null when they cannot be shown. */
  figures: {
    annualCost: { likely: string; low: string; high: string };
    annualSaving: string;
    payback: string;
    runsWithHazards: number;
  } | null;
}

export const submissionConfirmationSubject = (reference: string) => `Your Lagwise assessment ${reference} is in`;

export function SubmissionConfirmation(p: SubmissionConfirmationProps) {
  return (
    <Frame
      preview={
        p.figures
          ? `We have your assessment of ${p.plantLabel}: about ${p.figures.annualCost.likely} a year lost through its pipe runs.`
          : `We have your assessment of ${p.plantLabel}.`
      }
    >
      <Heading as="h1" style={{ fontSize: 22, margin: '0 0 14px' }}>
        Thank you, {p.contactName}
      </Heading>
      <Text style={textStyle}>
        We have your assessment of {p.plantLabel} ({p.runCount} pipe run{p.runCount === 1 ? '' : 's'}). Its reference is{' '}
        <strong>{p.reference}</strong>.
      </Text>
      {p.figures && (
        <Section style={{ backgroundColor: mailColours.paper, borderRadius: 6, padding: '14px 18px', margin: '0 0 16px' }}>
          <Text style={{ ...textStyle, margin: '0 0 6px' }}>
            Heat lost through these runs costs about <strong>{p.figures.annualCost.likely} a year</strong> (likely between{' '}
            {p.figures.annualCost.low} and {p.figures.annualCost.high}).
          </Text>
          <Text style={{ ...textStyle, margin: 0 }}>
            Insulating them as proposed would save about <strong>{p.figures.annualSaving} a year</strong> and pay back in {p.figures.payback}.
          </Text>
          {p.figures.runsWithHazards > 0 && (
            <Text style={{ ...textStyle, color: mailColours.ember, margin: '6px 0 0' }}>
              {p.figures.runsWithHazards} run{p.figures.runsWithHazards === 1 ? ' has' : 's have'} a safety flag (a surface hot enough to
              burn or cold enough to sweat).
            </Text>
          )}
        </Section>
      )}
      <Text style={textStyle}>
        {p.regionName
          ? `An insulation consultant who covers ${p.regionName} will look at it and contact you to arrange a site visit.`
          : `No consultant covers postal code ${p.postalCode} yet. We will find one by hand and let you know.`}
      </Text>
      <Button href={p.signInUrl} style={buttonStyle}>
        See my assessment
      </Button>
      <Text style={{ ...textStyle, color: mailColours.muted, fontSize: 13, marginTop: 18 }}>
        The button signs you in; it works once, within 24 hours. Later, ask for a new link at{' '}
        <Link href={p.signInPageUrl}>{p.signInPageUrl}</Link>.
      </Text>
      <Text style={{ ...textStyle, color: mailColours.muted, fontSize: 13 }}>
        Before anyone works on the lines: {cautions.map((c) => c.title.toLowerCase()).join('; ')}.
      </Text>
    </Frame>
  );
}
