import { Text } from "@react-email/components";
import { EmailGreeting, EmailLayout, emailStyles } from "./EmailLayout";
import { ProposalButton } from "./ProposalButton";

export type DecisionEmailProps = {
  name: string | null;
  title: string;
  cycleName: string;
  decision: "accept" | "waitlist" | "decline";
  /** Hours granted per configuration (accepted proposals). */
  hours: { configuration: string; hours: number }[];
  /** The chair's message to the team. */
  message: string;
  /** The reviewers' comments to the PI, without their names. */
  comments: { label: string; text: string }[];
  url: string;
};

const HEADLINE: Record<DecisionEmailProps["decision"], string> = {
  accept: "has been accepted",
  waitlist: "is on the waiting list",
  decline: "has not been accepted",
};

/** The committee's decision on a proposal, to the PI and every co-investigator. */
export function DecisionEmail(p: DecisionEmailProps) {
  const total = p.hours.reduce((s, h) => s + h.hours, 0);
  return (
    <EmailLayout preview={`“${p.title}” ${HEADLINE[p.decision]} (${p.cycleName}).`}>
      <EmailGreeting name={p.name} />
      <Text style={emailStyles.paragraph}>
        The time-allocation committee of the {p.cycleName} cycle has decided: <strong>“{p.title}”</strong>{" "}
        {HEADLINE[p.decision]}.
      </Text>
      {p.decision === "accept" ? (
        <>
          <Text style={emailStyles.paragraph}>Time granted, {total.toFixed(1)} h in all:</Text>
          <ul style={emailStyles.list}>
            {p.hours.map((h) => (
              <li key={h.configuration}>
                {h.configuration}: {h.hours.toFixed(1)} h
              </li>
            ))}
          </ul>
          <Text style={emailStyles.paragraph}>
            The schedulers will place your targets in the night plans of the cycle.
          </Text>
        </>
      ) : null}
      {p.decision === "waitlist" ? (
        <Text style={emailStyles.paragraph}>
          If time becomes free during the cycle, proposals on the waiting list are scheduled in their order.
        </Text>
      ) : null}
      {p.message ? (
        <>
          <Text style={emailStyles.paragraph}>From the chair:</Text>
          <Text style={{ ...emailStyles.paragraph, whiteSpace: "pre-wrap" }}>{p.message}</Text>
        </>
      ) : null}
      {p.comments.length ? (
        <>
          <Text style={emailStyles.paragraph}>The reviewers' comments to you:</Text>
          {p.comments.map((c) => (
            <Text key={c.label} style={{ ...emailStyles.paragraph, whiteSpace: "pre-wrap" }}>
              <strong>{c.label}:</strong> {c.text}
            </Text>
          ))}
        </>
      ) : null}
      <ProposalButton url={p.url} label="See the decision" />
      <Text style={emailStyles.small}>You receive this because you are on the proposal's team.</Text>
    </EmailLayout>
  );
}
