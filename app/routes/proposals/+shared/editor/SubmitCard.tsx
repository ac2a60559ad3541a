/**
 * A draft: what it still lacks, the submission (asked first, and "submit anyway" when feasibility lines
 * fail) and the deletion (the PI). Past the draft: its status, the withdrawal (the PI, while the committee
 * has not decided; asked first) and the reopening (the PI, before the deadline).
 */
import { Card } from "~/components/ui";
import { ConfirmDialog } from "~/components/ui/ConfirmDialog";
import type { ProposalStatus } from "~/db/schema/proposals";
import { StatusBadge } from "../Badges";
import { shownUtc } from "../utc";
import { IntentButton } from "./IntentButton";
import type { ActionResult } from "./result";

/** The intents whose refusals this card shows (not the page's banner). */
export const COURSE_INTENTS = ["submit", "withdraw", "reopen", "delete"];

export type SubmitCardProps = {
  proposal: { status: ProposalStatus; statusLabel: string; currentVersion: number; submittedAt: string | null };
  abilities: {
    deadlinePassed: boolean;
    canSubmit: boolean;
    canWithdraw: boolean;
    canReopen: boolean;
    /** The PI may delete this draft (never submitted). */
    canDelete: boolean;
  };
  /** The cycle's deadline, and the time left before it in words. */
  deadline: string;
  countdown: string;
  missing: string[];
  /** The failing lines of the feasibility report, one sentence each (none when nothing fails). */
  failing: string[];
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

/** The submit button and its dialog; with failing lines, the dialog lists them and asks to submit anyway. */
function SubmitDialog({ failing, disabled, result }: { failing: string[]; disabled: boolean; result?: ActionResult }) {
  const warned = failing.length > 0;
  const n = failing.length;
  const acknowledge = (
    <label className="flex items-start gap-2 text-sm font-medium text-night-900">
      <input type="checkbox" name="acknowledge" value="yes" required className="mt-0.5 h-4 w-4 accent-ember-700" />I
      have read the {n === 1 ? "failing line" : `${n} failing lines`} and submit anyway.
    </label>
  );
  return (
    <ConfirmDialog
      label="Submit the proposal"
      title={warned ? "Submit with failing feasibility lines?" : "Submit the proposal?"}
      intent="submit"
      confirmLabel={warned ? "Submit anyway" : "Yes, submit"}
      disabled={disabled}
      fields={warned ? acknowledge : undefined}
      closeOn={result}
    >
      {warned ? (
        <>
          <p>The feasibility report says {n === 1 ? "this line fails" : `these ${n} lines fail`}:</p>
          <ul className="mt-2 list-disc space-y-1 pl-5" aria-label="Failing feasibility lines">
            {failing.map((line) => (
              <li key={line}>{line}</li>
            ))}
          </ul>
          <p className="mt-2">
            The committee sees the report. Your acknowledgement is recorded with the version, under your name.
          </p>
        </>
      ) : (
        <p>
          This version, with its feasibility report and PDF, is frozen for the committee and the team gets a notice. You
          can withdraw it later and, before the deadline, reopen it.
        </p>
      )}
    </ConfirmDialog>
  );
}

function DeleteDraft({ result }: { result?: ActionResult }) {
  return (
    <div className="mt-5 border-t border-night-100 pt-4">
      <p className="mb-2 text-sm text-night-700">
        Deleting the draft removes it with its team, hours, targets and science case.
      </p>
      <ConfirmDialog
        label="Delete the draft"
        title="Delete this draft?"
        intent="delete"
        confirmLabel="Yes, delete the draft"
        variant="danger"
        closeOn={result}
      >
        The draft goes for good, with everything in it; the co-investigators lose it too. This cannot be undone.
      </ConfirmDialog>
    </div>
  );
}

function DraftCard({ abilities: a, deadline, countdown, missing, failing, result }: Omit<SubmitCardProps, "proposal">) {
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
          {failing.length > 0
            ? ` ${failing.length === 1 ? "One feasibility line fails" : `${failing.length} feasibility lines fail`}: you will be asked to confirm.`
            : ""}
        </p>
      )}
      {a.canSubmit ? (
        <div className="mt-4">
          <SubmitDialog failing={failing} disabled={missing.length > 0} result={result} />
        </div>
      ) : null}
      {a.canDelete ? <DeleteDraft result={result} /> : null}
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
        <div className="mt-4">
          {note(
            "Withdrawing takes the proposal out of the committee's hands. Until the deadline you can reopen it as a draft and submit it again.",
          )}
          <ConfirmDialog
            label="Withdraw the proposal"
            title="Withdraw the proposal?"
            intent="withdraw"
            confirmLabel="Yes, withdraw"
            variant="danger"
            closeOn={result}
          >
            The committee no longer sees it and the team gets a notice. The submitted versions stay on record.
          </ConfirmDialog>
        </div>
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
