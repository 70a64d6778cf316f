import { Button, Heading, Section, Text } from '@react-email/components';
import { buttonStyle, Frame, mailColours, textStyle } from './Frame';

/** Deliberately without the owner's name, company, e-mail or phone: those go to whoever claims it. */
export interface ConsultantAlertProps {
  consultantName: string;
  reference: string;
  regionName: string;
  plantType: string;
  area: string;
  runCount: number;
  services: string;
  /** From the shared presentation; null when the stored figures cannot be shown. */
  figures: { annualCost: string; annualSaving: string; runsWithHazards: number } | null;
  claimUrl: string;
  /** The lead was handed back by the consultant who held it and is open again. */
  reopened?: boolean;
}

export const consultantAlertSubject = (p: Pick<ConsultantAlertProps, 'regionName' | 'plantType' | 'reference' | 'reopened'>) =>
  `${p.reopened ? 'Open again' : 'New lead'} in ${p.regionName}: ${p.plantType.toLowerCase()} (${p.reference})`;

export function ConsultantAlert(p: ConsultantAlertProps) {
  return (
    <Frame
      preview={
        p.figures
          ? `A ${p.plantType.toLowerCase()} in ${p.area} is losing about ${p.figures.annualCost} a year through bare pipe.`
          : `A ${p.plantType.toLowerCase()} in ${p.area} has sent an assessment.`
      }
    >
      <Heading as="h1" style={{ fontSize: 22, margin: '0 0 14px' }}>
        {p.reopened ? `A lead is open again in ${p.regionName}` : `A new lead in ${p.regionName}`}
      </Heading>
      <Text style={textStyle}>
        {p.reopened
          ? `Hello ${p.consultantName}, the consultant who took on this assessment has handed it back; it is open to claim again.`
          : `Hello ${p.consultantName}, an owner in your region has sent an assessment.`}
      </Text>
      <Section style={{ backgroundColor: mailColours.paper, borderRadius: 6, padding: '14px 18px', margin: '0 0 16px' }}>
        <Text style={{ ...textStyle, margin: '0 0 4px' }}>
          <strong>{p.reference}</strong> · {p.plantType} · postal area {p.area}
        </Text>
        <Text style={{ ...textStyle, margin: '0 0 4px' }}>
          {p.runCount} pipe run{p.runCount === 1 ? '' : 's'}: {p.services}
        </Text>
        {p.figures && (
          <Text style={{ ...textStyle, margin: '0 0 4px' }}>
            Estimated loss {p.figures.annualCost} a year; the proposal saves about {p.figures.annualSaving} a year.
          </Text>
        )}
        {p.figures && p.figures.runsWithHazards > 0 && (
          <Text style={{ ...textStyle, color: mailColours.ember, margin: 0 }}>
            {p.figures.runsWithHazards} run{p.figures.runsWithHazards === 1 ? '' : 's'} flagged for burns or condensation.
          </Text>
        )}
      </Section>
      <Text style={textStyle}>The owner’s contact details are shown to the consultant who claims the lead first.</Text>
      <Button href={p.claimUrl} style={buttonStyle}>
        Sign in to claim it
      </Button>
    </Frame>
  );
}
