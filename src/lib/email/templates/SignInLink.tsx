import { Button, Heading, Link, Text } from '@react-email/components';
import { buttonStyle, Frame, mailColours, textStyle } from './Frame';

export const signInLinkSubject = 'Your Lagwise sign-in link';

export function SignInLink({ signInUrl }: { signInUrl: string }) {
  return (
    <Frame preview="Open this link to see your assessments.">
      <Heading as="h1" style={{ fontSize: 22, margin: '0 0 14px' }}>
        Sign in to Lagwise
      </Heading>
      <Text style={textStyle}>Open the link below to see your assessments and any reports a consultant has sent you.</Text>
      <Button href={signInUrl} style={buttonStyle}>
        Open my assessments
      </Button>
      <Text style={{ ...textStyle, color: mailColours.muted, fontSize: 13, marginTop: 18 }}>
        The link works once, within 24 hours. If the button does not work, paste this address into your browser:{' '}
        <Link href={signInUrl}>{signInUrl}</Link>. If you did not ask to sign in, you can ignore this e-mail.
      </Text>
    </Frame>
  );
}
