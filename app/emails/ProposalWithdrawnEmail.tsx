import { Text } from "@react-email/components";
import { EmailLayout, emailStyles } from "./EmailLayout";
import { ProposalButton } from "./ProposalButton";

export type ProposalWithdrawnEmailProps = {
  name: string | null;
  title: string;
  cycleName: string;
  withdrawnBy: string;
  /** The deadline until which the PI may reopen it as a draft; null when it has passed. */
  reopenUntil: string | null;
  url: string;
};

/** The notice when the PI withdraws a submitted proposal. */
export function ProposalWithdrawnEmail({
  name,
  title,
  cycleName,
  withdrawnBy,
  reopenUntil,
  url,
}: ProposalWithdrawnEmailProps) {
  return (
    <EmailLayout preview={`“${title}” was withdrawn from ${cycleName}.`}>
      <Text style={emailStyles.heading}>{name ? `Hello ${name},` : "Hello,"}</Text>
      <Text style={emailStyles.paragraph}>
        {withdrawnBy} withdrew <strong>“{title}”</strong> from the {cycleName} cycle. The committee will not review it.
        The versions submitted so far are kept.
      </Text>
      <Text style={emailStyles.paragraph}>
        {reopenUntil
          ? `The PI can reopen it as a draft and submit it again until the deadline, ${reopenUntil}.`
          : "The submission deadline has passed, so it cannot be submitted again this cycle."}
      </Text>
      <ProposalButton url={url} />
      <Text style={emailStyles.small}>You receive this because you are on the proposal's team.</Text>
    </EmailLayout>
  );
}
