import { Text } from "@react-email/components";
import { EmailButton, EmailGreeting, EmailLayout, EmailLinkFallback, emailStyles } from "./EmailLayout";

export type ReviewReminderEmailProps = {
  name: string;
  cycleName: string;
  /** Proposals whose review is not submitted yet, with "draft saved" or "not started". */
  pending: { title: string; progress: string }[];
  reviewDeadline: string | null;
  url: string;
};

/** To a reviewer with reviews still to submit. */
export function ReviewReminderEmail(p: ReviewReminderEmailProps) {
  const n = p.pending.length;
  return (
    <EmailLayout preview={`${n} review${n === 1 ? "" : "s"} of ${p.cycleName} still to submit.`}>
      <EmailGreeting name={p.name} />
      <Text style={emailStyles.paragraph}>
        A reminder from the chair of the {p.cycleName} cycle: {n === 1 ? "one review is" : `${n} reviews are`} not
        submitted yet{p.reviewDeadline ? `, and the review deadline is ${p.reviewDeadline}` : ""}.
      </Text>
      <ul style={emailStyles.list}>
        {p.pending.map((x) => (
          <li key={x.title}>
            “{x.title}” — {x.progress}
          </li>
        ))}
      </ul>
      <Text style={emailStyles.paragraph}>Drafts are kept as you save them; a review counts once it is submitted.</Text>
      <EmailButton href={p.url}>Open the Review desk</EmailButton>
      <EmailLinkFallback url={p.url} />
      <Text style={emailStyles.small}>You receive this because you sit on the {p.cycleName} committee.</Text>
    </EmailLayout>
  );
}
