/**
 * The reviewer's form: score on the cycle's scale (shown), comment to the PI, comment to the committee,
 * confidence. "Save draft" keeps it; "Submit…" asks first, then sends it for good. A stale save shows
 * the newer text that was kept, beside what the reviewer typed.
 */
import { useRef } from "react";
import { Form, useNavigation } from "react-router";
import { Alert, Button, Card, FormErrors, SelectField, TextArea } from "~/components/ui";
import { cx } from "~/components/ui/cx";

export type ReviewValues = { score: string; commentToPi: string; commentToCommittee: string; confidence: string };
export type StaleReview = {
  score: number | null;
  commentToPi: string;
  commentToCommittee: string;
  confidence: string | null;
  version: number;
  updatedAt: string;
};

export type ReviewFormProps = {
  scale: { text: string; steps: { value: number; label: string }[] };
  values: ReviewValues;
  version: number;
  errors: Record<string, string>;
  stale: StaleReview | null;
  staleMessage: string | null;
  savedAt: string | null;
  maxChars: number;
};

const CONFIDENCE = [
  { value: "low", label: "Low" },
  { value: "medium", label: "Medium" },
  { value: "high", label: "High" },
];

/** The two comments: field, label, and who reads it. */
const COMMENTS = [
  ["commentToPi", "Comment to the PI", "Sent to the team with the decision, without your name."],
  [
    "commentToCommittee",
    "Comment to the committee",
    "Read by the chair and, once they have submitted, the other reviewers of this proposal — without your name.",
  ],
] as const;

function StaleCopy({ stale, message }: { stale: StaleReview; message: string }) {
  return (
    <Alert tone="caution" as="div" className="mb-4">
      <p className="font-semibold">{message}</p>
      <dl className="mt-2 grid gap-1 text-night-900">
        <div>
          <dt className="inline font-medium">Saved score: </dt>
          <dd className="inline">{stale.score ?? "none"}</dd>
        </div>
        <div>
          <dt className="inline font-medium">Saved confidence: </dt>
          <dd className="inline">{stale.confidence ?? "none"}</dd>
        </div>
        <div>
          <dt className="font-medium">Saved comment to the PI:</dt>
          <dd className="whitespace-pre-wrap" data-testid="stale-comment-to-pi">
            {stale.commentToPi || "—"}
          </dd>
        </div>
        <div>
          <dt className="font-medium">Saved comment to the committee:</dt>
          <dd className="whitespace-pre-wrap">{stale.commentToCommittee || "—"}</dd>
        </div>
      </dl>
    </Alert>
  );
}

export function ReviewForm(p: ReviewFormProps) {
  const dialog = useRef<HTMLDialogElement>(null);
  const busy = useNavigation().state === "submitting";
  return (
    <Card title="Your review">
      {p.stale && p.staleMessage ? <StaleCopy stale={p.stale} message={p.staleMessage} /> : null}
      <FormErrors errors={Object.values(p.errors)} />
      <Form method="post" id="review-form" className="mt-2 grid gap-4" aria-label="Your review">
        <input type="hidden" name="version" value={p.version} />
        <SelectField
          label="Score"
          name="score"
          defaultValue={p.values.score}
          error={p.errors.score}
          hint={`The cycle's scale: ${p.scale.text}.`}
        >
          <option value="">— no score yet —</option>
          {p.scale.steps.map((s) => (
            <option key={s.value} value={s.value}>
              {s.label}
            </option>
          ))}
        </SelectField>
        <fieldset className="grid gap-1">
          <legend className="text-sm font-medium text-night-800">Confidence</legend>
          <div className="flex flex-wrap gap-4">
            {CONFIDENCE.map((c) => (
              <label key={c.value} className="flex items-center gap-2 text-sm">
                <input
                  type="radio"
                  name="confidence"
                  value={c.value}
                  defaultChecked={p.values.confidence === c.value}
                  className="h-4 w-4 accent-ember-700"
                />
                {c.label}
              </label>
            ))}
          </div>
          {p.errors.confidence ? (
            <p role="alert" className="text-sm font-medium text-danger-700">
              {p.errors.confidence}
            </p>
          ) : null}
        </fieldset>
        {COMMENTS.map(([name, label, hint]) => (
          <TextArea
            key={name}
            label={label}
            name={name}
            maxLength={p.maxChars}
            defaultValue={p.values[name]}
            error={p.errors[name]}
            hint={hint}
          />
        ))}
        <div className="flex flex-wrap items-center gap-2">
          <Button type="submit" name="intent" value="save" variant="secondary" disabled={busy}>
            Save draft
          </Button>
          <Button onClick={() => dialog.current?.showModal()} disabled={busy}>
            Submit…
          </Button>
          {p.savedAt ? <span className="num text-sm text-night-600">Draft saved {p.savedAt}</span> : null}
        </div>
      </Form>
      <dialog
        ref={dialog}
        aria-labelledby="submit-review-title"
        className={cx(
          "m-auto w-[min(30rem,calc(100vw-2rem))] rounded-xl bg-white p-5 shadow-xl ring-1 ring-night-200",
          "backdrop:bg-night-950/40",
        )}
      >
        <h2 id="submit-review-title" className="text-lg font-semibold">
          Submit your review?
        </h2>
        <p className="mt-2 text-sm text-night-700">
          A submitted review cannot change. You will then see the other reviewers' scores and comments to the committee
          (without names).
        </p>
        <div className="mt-4 flex justify-end gap-2">
          <Button variant="secondary" onClick={() => dialog.current?.close()}>
            Cancel
          </Button>
          <Button
            type="submit"
            form="review-form"
            name="intent"
            value="submit"
            onClick={() => setTimeout(() => dialog.current?.close(), 0)}
          >
            Yes, submit
          </Button>
        </div>
      </dialog>
    </Card>
  );
}
