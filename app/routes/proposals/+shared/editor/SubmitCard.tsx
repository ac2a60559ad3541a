/**
 * A draft: what it still lacks, and the submission. Past the draft: its status, the withdrawal (the
 * PI, while the committee has not decided) and the reopening (the PI, before the deadline).
 */
import { useNavigation } from "react-router";
import { Card } from "~/components/ui";
import type { ProposalStatus } from "~/db/schema/proposals";
import { StatusBadge } from "../Badges";
import { shownUtc } from "../utc";
import { IntentButton } from "./IntentButton";
import type { ActionResult } from "./result";

/** The intents whose refusals this card shows (not the page's banner). */
export const COURSE_INTENTS = ["submit", "withdraw", "reopen"];

export type SubmitCardProps = {
  proposal: { status: ProposalStatus; statusLabel: string; currentVersion: number; submittedAt: string | null };
  abilities: { deadlinePassed: boolean; canSubmit: boolean; canWithdraw: boolean; canReopen: boolean };
  /** The cycle's deadline, and the time left before it in words. */
  deadline: string;
  countdown: string;
  missing: string[];
  result?: ActionResult;
};

function Refusal({ message }: { message?: string }) {
  if (!message) return null;
  return (
    <p
      role="alert"
      className="mb-3 rounded-lg bg-danger-50 p-3 text-sm font-medium text-danger-700 ring-1 ring-danger-700/20"
    >
      {message}
    </p>
  );
}

function DraftCard({ abilities: a, deadline, countdown, missing, result }: Omit<SubmitCardProps, "proposal">) {
  const navigation = useNavigation();
  const busy = navigation.state === "submitting" && navigation.formData?.get("intent") === "submit";
  return (
    <Card title="Submit">
      <Refusal message={result?.errors.form} />
      {a.deadlinePassed ? (
        <p className="text-sm text-night-700">
          The deadline ({deadline}) has passed; this draft can no longer be submitted.
        </p>
      ) : missing.length > 0 ? (
        <>
          <p className="text-sm text-night-700">Before it can be submitted, the proposal still needs:</p>
          <ul className="mt-2 list-disc pl-5 text-sm text-night-800" aria-label="Missing before submission">
            {missing.map((m) => (
              <li key={m}>{m}</li>
            ))}
          </ul>
        </>
      ) : (
        <p className="text-sm text-night-700">
          Complete. Submitting freezes this version, with its feasibility report and PDF, for the committee; the team
          gets a notice. Deadline: {deadline} ({countdown}).
        </p>
      )}
      {a.canSubmit ? (
        <IntentButton intent="submit" formClassName="mt-4" disabled={busy || missing.length > 0}>
          {busy ? "Submitting…" : "Submit the proposal"}
        </IntentButton>
      ) : null}
    </Card>
  );
}

export function SubmitCard(props: SubmitCardProps) {
  const { proposal, abilities: a, result } = props;
  if (proposal.status === "draft") return <DraftCard {...props} />;
  const note = (text: string) => <p className="mb-2 text-sm text-night-700">{text}</p>;
  return (
    <Card title="Status">
      <Refusal message={result?.errors.form} />
      <p className="flex items-center gap-2 text-sm">
        <StatusBadge status={proposal.status} label={proposal.statusLabel} />
        {proposal.submittedAt ? (
          <span className="text-night-700">
            version {proposal.currentVersion} submitted {shownUtc(proposal.submittedAt)}
          </span>
        ) : null}
      </p>
      {a.canWithdraw ? (
        <IntentButton
          intent="withdraw"
          formClassName="mt-4"
          variant="danger"
          before={note(
            "Withdrawing takes the proposal out of the committee's hands. Until the deadline you can reopen it as a draft and submit it again.",
          )}
        >
          Withdraw the proposal
        </IntentButton>
      ) : null}
      {a.canReopen ? (
        <IntentButton
          intent="reopen"
          formClassName="mt-4"
          variant="secondary"
          before={note(
            "The deadline has not passed: you can turn it back into a draft, change it and submit a new version.",
          )}
        >
          Reopen as a draft
        </IntentButton>
      ) : null}
    </Card>
  );
}
