import { Text } from "@react-email/components";
import { EmailButton, EmailGreeting, EmailLayout, EmailLinkFallback, emailStyles } from "./EmailLayout";

export type ReviewAssignmentEmailProps = {
  name: string;
  cycleName: string;
  /** Titles of the proposals newly assigned. */
  titles: string[];
  /** e.g. "2027-01-15 12:00 UTC"; null when the chair has not set it yet. */
  reviewDeadline: string | null;
  /** "1 = best … 5 = poorest" */
  scale: string;
  url: string;
};

/** To a reviewer given new proposals to review. */
export function ReviewAssignmentEmail(p: ReviewAssignmentEmailProps) {
  const n = p.titles.length;
  return (
    <EmailLayout preview={`${n} proposal${n === 1 ? "" : "s"} of ${p.cycleName} to review.`}>
      <EmailGreeting name={p.name} />
      <Text style={emailStyles.paragraph}>
        The chair of the {p.cycleName} cycle asks you to review {n === 1 ? "this proposal" : `these ${n} proposals`}:
      </Text>
      <ul style={emailStyles.list}>
        {p.titles.map((t) => (
          <li key={t}>“{t}”</li>
        ))}
      </ul>
      <Text style={emailStyles.paragraph}>
        {p.reviewDeadline ? `Please submit your reviews before ${p.reviewDeadline}. ` : ""}Scores use the cycle's scale,{" "}
        {p.scale}. If you have a conflict of interest with one of them, or cannot review it, decline it on your Review
        desk with a reason and the chair will ask someone else.
      </Text>
      <EmailButton href={p.url}>Open the Review desk</EmailButton>
      <EmailLinkFallback url={p.url} />
      <Text style={emailStyles.small}>You receive this because you sit on the {p.cycleName} committee.</Text>
    </EmailLayout>
  );
}
