import { Text } from "@react-email/components";
import { EmailLayout, EmailLinkFallback, emailStyles } from "./EmailLayout";
import { ProposalButton } from "./ProposalButton";

export type CoInvestigatorAddedEmailProps = {
  /** The co-investigator's name when they have an account; null otherwise. */
  name: string | null;
  piName: string;
  title: string;
  cycleName: string;
  /** The cycle's submission deadline, e.g. "2027-01-15 12:00 UTC". */
  deadline: string;
  /** The proposal's page. */
  url: string;
  /** Whether an account with this address exists (else the message explains how to get one). */
  hasAccount: boolean;
};

/** Tells a person that a PI put them on a proposal's team, and where to find it. */
export function CoInvestigatorAddedEmail({
  name,
  piName,
  title,
  cycleName,
  deadline,
  url,
  hasAccount,
}: CoInvestigatorAddedEmailProps) {
  const shown = title.trim() === "" ? "an untitled proposal" : `“${title}”`;
  return (
    <EmailLayout preview={`${piName} added you as a co-investigator on ${shown}.`}>
      <Text style={emailStyles.heading}>{name ? `Hello ${name},` : "Hello,"}</Text>
      <Text style={emailStyles.paragraph}>
        {piName} added you as a co-investigator on {shown}, a proposal for the {cycleName} cycle. As a co-investigator
        you can read and edit the draft, and submit it, until the deadline: <strong>{deadline}</strong>.
      </Text>
      <ProposalButton url={url} label="Open the proposal" />
      {hasAccount ? null : (
        <Text style={emailStyles.paragraph}>
          You do not have a Fringe Docket account with this address yet. Sign in with this e-mail address (single
          sign-on or an e-mail link) and the proposal appears under “My proposals”.
        </Text>
      )}
      <EmailLinkFallback url={url} />
      <Text style={emailStyles.small}>Not expecting this? Please tell {piName}; only the PI can change the team.</Text>
    </EmailLayout>
  );
}
