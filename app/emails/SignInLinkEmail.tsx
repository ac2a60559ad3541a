import { Text } from "@react-email/components";
import { EmailButton, EmailGreeting, EmailLayout, EmailLinkFallback, emailStyles } from "./EmailLayout";

export type SignInLinkEmailProps = {
  /** The person's name when the account exists; null for a first sign-in. */
  name: string | null;
  /** The single-use sign-in address. */
  url: string;
  /** How long the link stays valid, minutes. */
  expiresMinutes?: number;
};

export const SIGN_IN_LINK_SUBJECT = "Your sign-in link for Fringe Docket";

function minutes(n: number) {
  return n === 1 ? "1 minute" : `${n} minutes`;
}

/** The e-mail-link sign-in: one button, the address spelled out, and what to do if it was not you. */
export function SignInLinkEmail({ name, url, expiresMinutes = 15 }: SignInLinkEmailProps) {
  const valid = minutes(expiresMinutes);
  return (
    <EmailLayout preview={`Your sign-in link, valid for ${valid}.`}>
      <EmailGreeting name={name} />
      <Text style={emailStyles.paragraph}>
        Here is the link you asked for to sign in to Fringe Docket. It works once, within the next {valid}.
      </Text>
      <EmailButton href={url}>Sign in to Fringe Docket</EmailButton>
      <EmailLinkFallback url={url} />
      <Text style={emailStyles.small}>
        Did not ask for it? Then you can let this message be: nobody signs in without the link, and it expires by
        itself.
      </Text>
    </EmailLayout>
  );
}
