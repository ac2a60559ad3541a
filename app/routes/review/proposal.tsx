import { data, href } from "react-router";
import * as v from "valibot";
import { ErrorPage } from "~/components/ErrorPage";
import { ImagingPreview } from "~/components/imaging/ImagingPreview";
import { shownUtc } from "~/components/proposals/utc";
import { Alert, Badge, Card, PageHeader, TextArea } from "~/components/ui";
import { ConfirmDialog } from "~/components/ui/ConfirmDialog";
import { dbContext } from "~/context";
import { requireFormBody } from "~/lib/body.server";
import { redirectWithFlash } from "~/lib/flash.server";
import { formatUtc } from "~/lib/format";
import { forbidden, requirePermission } from "~/lib/guards.server";
import { invariantResponse } from "~/lib/not-found";
import { committeeProposalId, loadProposalForCommittee } from "~/services/committee/access.server";
import { declineAssignment } from "~/services/committee/assignments.server";
import { frozenProposal } from "~/services/committee/reading.server";
import { allReviews, othersReviews, saveReview, storedReview } from "~/services/committee/reviews.server";
import { scaleSteps, scaleText, stepLabel } from "~/services/committee/scale";
import {
  COMMENT_MAX_CHARS,
  DeclineFormSchema,
  formStrings,
  parseReviewForm,
  REASON_MAX_CHARS,
  REVIEW_KEYS,
} from "~/services/committee/schemas";
import { scoringClosedBecause } from "~/services/cycles/states";
import { FrozenProposal } from "./+shared/FrozenProposal";
import { ReviewForm, type ReviewValues, type StaleReview } from "./+shared/ReviewForm";
import { ChairReviews, OthersReviews, SubmittedReview } from "./+shared/Reviews";
import type { Route } from "./+types/proposal";

export async function loader({ request, params, context }: Route.LoaderArgs) {
  const viewer = await requirePermission(request, "review:desk");
  const db = context.get(dbContext);
  const proposalId = committeeProposalId(params.proposalId);
  const read = await loadProposalForCommittee(db, { viewer, proposalId });
  const frozen = await frozenProposal(db, { proposalId, version: read.proposal.currentVersion });
  invariantResponse(frozen, "This proposal has no frozen version.");
  const scale = { best: read.cycle.scoreBest, worst: read.cycle.scoreWorst };
  const review = read.review ? storedReview(read.review) : null;
  const submitted = Boolean(review?.submittedAt);
  return {
    proposalId,
    mode: read.mode,
    cycle: {
      id: read.cycle.id,
      name: read.cycle.name,
      reviewDeadline: read.cycle.reviewDeadline ? formatUtc(read.cycle.reviewDeadline) : null,
    },
    scale: {
      text: scaleText(scale),
      steps: scaleSteps(scale).map((s) => ({ value: s, label: stepLabel(s, scale) })),
    },
    frozen,
    review,
    closedBecause: read.mode === "reviewer" ? scoringClosedBecause(read.cycle, new Date()) : null,
    others:
      read.mode === "reviewer" && submitted
        ? await othersReviews(db, { proposalId, reviewerId: viewer.user.id })
        : null,
    all:
      read.mode === "chair"
        ? (await allReviews(db, { proposalId })).map((r) => ({
            ...r,
            submitted: r.submittedAt !== null,
            submittedAt: undefined,
          }))
        : null,
  };
}

export async function action({ request, params, context }: Route.ActionArgs) {
  const viewer = await requirePermission(request, "review:desk");
  const db = context.get(dbContext);
  const proposalId = committeeProposalId(params.proposalId);
  const read = await loadProposalForCommittee(db, { viewer, proposalId });
  if (read.mode !== "reviewer" || !read.assignment)
    forbidden("Only a reviewer assigned to this proposal may review it.");
  const form = await requireFormBody(request, { maxBytes: 128_000 });
  const intent = String(form.get("intent") ?? "");
  const here = href("/review/proposals/:proposalId", { proposalId: String(proposalId) });
  if (intent === "decline") {
    const parsed = v.safeParse(DeclineFormSchema, { reason: String(form.get("reason") ?? "") });
    if (!parsed.success) return data({ intent, error: parsed.issues[0].message }, { status: 400 });
    const result = await declineAssignment(db, {
      assignmentId: read.assignment.id,
      reviewerId: viewer.user.id,
      reason: parsed.output.reason,
    });
    if (!result.ok) return data({ intent, error: result.message }, { status: 409 });
    return redirectWithFlash(href("/review"), {
      kind: "info",
      text: "Assignment declined; the chair will ask someone else.",
    });
  }
  if (intent !== "save" && intent !== "submit") return data({ intent, error: "Unknown action." }, { status: 400 });
  const values = formStrings(form, REVIEW_KEYS);
  const scale = { best: read.cycle.scoreBest, worst: read.cycle.scoreWorst };
  const parsed = parseReviewForm(values, scale, intent === "submit");
  if (!parsed.ok) return data({ intent, values, errors: parsed.errors }, { status: 400 });
  const { version, ...fields } = parsed.value;
  const result = await saveReview(db, {
    assignmentId: read.assignment.id,
    reviewerId: viewer.user.id,
    baseVersion: version,
    fields,
    submit: intent === "submit",
  });
  if (!result.ok && result.kind === "stale")
    return data({ intent, values, stale: result.current, staleMessage: result.message }, { status: 409 });
  if (!result.ok) return data({ intent, values, error: result.message }, { status: 409 });
  return redirectWithFlash(here, {
    kind: "success",
    text: result.submitted ? "Review submitted. The other reviewers' scores are shown below." : "Draft saved.",
  });
}

export const meta: Route.MetaFunction = ({ data: d }) => [
  { title: `Review — ${d?.frozen.title ?? "Proposal"} — Fringe Docket` },
];

type ActionAnswer = {
  intent: string;
  error?: string;
  values?: ReviewValues & { version: string };
  errors?: Record<string, string>;
  stale?: StaleReview;
  staleMessage?: string;
};

export default function ReviewProposal({ loaderData: d, actionData }: Route.ComponentProps) {
  const a = actionData as ActionAnswer | undefined;
  const r = d.review;
  const stored: ReviewValues = {
    score: r?.score == null ? "" : String(r.score),
    commentToPi: r?.commentToPi ?? "",
    commentToCommittee: r?.commentToCommittee ?? "",
    confidence: r?.confidence ?? "",
  };
  const scienceCase = href("/review/proposals/:proposalId/science-case", { proposalId: String(d.proposalId) });
  return (
    <>
      <PageHeader
        title={d.frozen.title}
        lead={
          <>
            <Badge tone="info">Version {d.frozen.version}</Badge> submitted {shownUtc(d.frozen.submittedAt)} to cycle{" "}
            {d.cycle.name}. Review deadline {d.cycle.reviewDeadline ?? "not set"}.
          </>
        }
        back={
          d.mode === "chair"
            ? { to: href("/board/:cycleId", { cycleId: String(d.cycle.id) }), label: "Back to the Ranking board" }
            : { to: href("/review"), label: "Back to the Review desk" }
        }
      />
      {a?.error ? <Alert className="mb-4">{a.error}</Alert> : null}
      <div className="grid grid-cols-[minmax(0,1fr)] gap-6 xl:grid-cols-[minmax(0,3fr)_minmax(0,2fr)]">
        <div className="grid min-w-0 content-start gap-6">
          <FrozenProposal p={d.frozen} scienceCaseHref={scienceCase} />
          <ImagingPreview
            source={{ kind: "proposal", proposalId: d.proposalId }}
            readOnly
            intro="The imaging previews made for this proposal's targets (by its team or the chair): the data the coverage would yield, the image reconstructed from them and how faithful it is. Read-only."
          />
        </div>
        <div className="grid content-start gap-6">
          {d.mode === "chair" ? <ChairReviews reviews={d.all ?? []} /> : null}
          {d.mode === "reviewer" && r?.submittedAt ? (
            <SubmittedReview review={{ ...r, submittedAt: shownUtc(r.submittedAt) }} scale={d.scale.text} />
          ) : null}
          {d.mode === "reviewer" && !r?.submittedAt && d.closedBecause ? (
            <Alert tone="info">{d.closedBecause}</Alert>
          ) : null}
          {d.mode === "reviewer" && !r?.submittedAt && !d.closedBecause ? (
            <ReviewForm
              scale={d.scale}
              values={a?.values ?? stored}
              version={a?.stale ? a.stale.version : (r?.version ?? 0)}
              errors={a?.errors ?? {}}
              stale={a?.stale ?? null}
              staleMessage={a?.staleMessage ?? null}
              savedAt={r ? shownUtc(r.updatedAt) : null}
              maxChars={COMMENT_MAX_CHARS}
            />
          ) : null}
          {d.others ? <OthersReviews reviews={d.others} /> : null}
          {d.mode === "reviewer" && !r?.submittedAt && !d.closedBecause ? (
            <Card title="Cannot review it?">
              <p className="mb-3 text-sm text-night-700">
                Decline with a reason (a conflict, not your field); the chair sees it and asks someone else.
              </p>
              <ConfirmDialog
                label="Decline this assignment"
                title="Decline this assignment?"
                intent="decline"
                confirmLabel="Yes, decline"
                variant="danger"
                closeOn={a}
                fields={<TextArea label="Reason for declining" name="reason" maxLength={REASON_MAX_CHARS} required />}
              >
                Your draft, if any, is dropped from the review; you cannot take the assignment back yourself.
              </ConfirmDialog>
            </Card>
          ) : null}
        </div>
      </div>
    </>
  );
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
