import { Text } from "@react-email/components";
import { EmailButton, EmailGreeting, EmailLayout, emailStyles } from "./EmailLayout";

export type SignInLateEmailProps = {
  name: string | null;
  /** The sign-in page, where a new link can be asked for. */
  signInUrl: string;
};

export const SIGN_IN_LATE_SUBJECT = "Your Fringe Docket sign-in link could not be delivered in time";

/**
 * Sent in place of a sign-in link that the mail server took too long to accept: the link itself is
 * never sent once it could no longer be used, so the person is asked to request a new one.
 */
export function SignInLateEmail({ name, signInUrl }: SignInLateEmailProps) {
  return (
    <EmailLayout preview="The sign-in link you asked for expired before it could be delivered.">
      <EmailGreeting name={name} />
      <Text style={emailStyles.paragraph}>
        You asked for a link to sign in to Fringe Docket, but our mail server could not send it before the link expired,
        so it was not sent. Please ask for a new one on the sign-in page.
      </Text>
      <EmailButton href={signInUrl}>Ask for a new link</EmailButton>
      <Text style={emailStyles.small}>Did not ask for it? Then there is nothing to do.</Text>
    </EmailLayout>
  );
}
