/** The shell every Lagwise e-mail shares: our name, one column, the footer line. */
import { Body, Container, Head, Hr, Html, Preview, Section, Text } from '@react-email/components';
import type { ReactNode } from 'react';

export const mailColours = {
  paper: '#f5f1e8',
  card: '#fcfaf5',
  graphite: '#22262b',
  muted: '#4b5058',
  ember: '#a8461c',
  line: '#d6cdbd',
} as const;

const font = "Manrope, 'Segoe UI', Helvetica, Arial, sans-serif";

export function Frame({ preview, children }: { preview: string; children: ReactNode }) {
  return (
    <Html lang="en">
      <Head />
      <Preview>{preview}</Preview>
      <Body style={{ backgroundColor: mailColours.paper, color: mailColours.graphite, fontFamily: font, margin: 0, padding: '24px 0' }}>
        <Container style={{ backgroundColor: mailColours.card, border: `1px solid ${mailColours.line}`, borderRadius: 8, maxWidth: 560, padding: '28px 32px' }}>
          <Text style={{ color: mailColours.ember, fontSize: 18, fontWeight: 800, letterSpacing: '0.02em', margin: '0 0 16px' }}>Lagwise</Text>
          <Section>{children}</Section>
          <Hr style={{ borderColor: mailColours.line, margin: '28px 0 12px' }} />
          <Text style={{ color: mailColours.muted, fontSize: 12, lineHeight: '18px', margin: 0 }}>
            Lagwise estimates are not an engineering design. Follow local codes and licensed practice.
          </Text>
        </Container>
      </Body>
    </Html>
  );
}

export const textStyle = { fontSize: 15, lineHeight: '23px', margin: '0 0 14px' } as const;

export const buttonStyle = {
  backgroundColor: mailColours.ember,
  borderRadius: 6,
  color: '#ffffff',
  display: 'inline-block',
  fontSize: 15,
  fontWeight: 700,
  padding: '12px 20px',
  textDecoration: 'none',
} as const;
