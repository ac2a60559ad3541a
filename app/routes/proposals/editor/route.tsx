import { href, type ShouldRevalidateFunctionArgs } from "react-router";
import { ErrorPage } from "~/components/ErrorPage";
import { ButtonLink, FormErrors, PageHeader } from "~/components/ui";
import { dbContext } from "~/context";
import { SCIENCE_CATEGORIES } from "~/db/schema/proposals";
import { formatBytes, formatUtc } from "~/lib/format";
import { requirePermission } from "~/lib/guards.server";
import { loadProposalForViewer, proposalIdFrom } from "~/services/proposals/access.server";
import { loadEditorDetails } from "~/services/proposals/editor.server";
import { computeProposalFeasibility } from "~/services/proposals/feasibility.server";
import { MAX_PDF_BYTES } from "~/services/proposals/pdf";
import { missingForSubmission } from "~/services/proposals/queries.server";
import { PROPOSAL_LIMITS } from "~/services/proposals/schemas";
import { targetSummary } from "~/services/proposals/target-summary";
import { readProposalPost } from "~/services/proposals/upload.server";
import { acknowledgementText, failingLines, failingLineText } from "~/services/proposals/warnings";
import { deadlineCountdown, STATUS_WORDS } from "~/services/proposals/words";
import { StatusBadge } from "../+shared/Badges";
import { DetailsCard, type DetailsCardProps } from "../+shared/editor/DetailsCard";
import { DocumentCard, type DocumentCardProps } from "../+shared/editor/DocumentCard";
import { saveDetailsIntent } from "../+shared/editor/details.server";
import { removeDocumentIntent, uploadDocumentIntent } from "../+shared/editor/document.server";
import { HoursCard, type HoursCardProps } from "../+shared/editor/HoursCard";
import { saveHoursIntent } from "../+shared/editor/hours.server";
import { fail, type IntentArgs, refusalAnswer, textOf } from "../+shared/editor/intent.server";
import { type ActionResult, resultFor } from "../+shared/editor/result";
import { COURSE_INTENTS, SubmitCard, type SubmitCardProps } from "../+shared/editor/SubmitCard";
import { deleteIntent, reopenIntent, submitIntent, withdrawIntent } from "../+shared/editor/submission.server";
import { TargetsCard, type TargetsCardProps } from "../+shared/editor/TargetsCard";
import { TeamCard, type TeamCardProps } from "../+shared/editor/TeamCard";
import { addMyTargetIntent, moveTargetIntent, removeTargetIntent } from "../+shared/editor/targets.server";
import { addMemberIntent, removeMemberIntent } from "../+shared/editor/team.server";
import { VersionsCard, type VersionsCardProps } from "../+shared/editor/VersionsCard";
import type { Route } from "./+types/route";

export async function loader({ request, params, context }: Route.LoaderArgs) {
  const viewer = await requirePermission(request, "proposals:own");
  const id = proposalIdFrom(params.proposalId);
  const db = context.get(dbContext);
  const now = new Date();
  const { proposal, cycle, abilities } = await loadProposalForViewer(db, { viewer, proposalId: id, now });
  const [details, missing] = await Promise.all([
    loadEditorDetails(db, { proposal, viewerId: viewer.user.id }),
    missingForSubmission(db, { proposal }),
  ]);
  const editable = abilities.canEdit;
  const statusLabel = STATUS_WORDS[proposal.status];
  const deadline = formatUtc(cycle.submissionDeadline);
  const countdown = deadlineCountdown(cycle.submissionDeadline, now);
  const hoursBy = new Map(details.hours.map((h) => [h.configuration.id, h.hours]));
  const doc = details.document;
  // The lines a submission would have to acknowledge: only worth computing once nothing is missing.
  const failing =
    abilities.canSubmit && missing.length === 0
      ? failingLines(await computeProposalFeasibility(db, { proposalId: id, now })).map(failingLineText)
      : [];
  const onProposal = new Set(details.targets.map((t) => t.sourceTargetId));
  const namesOnProposal = new Set(details.targets.map((t) => t.name.toLowerCase()));
  return {
    proposal: { id: proposal.id, title: proposal.title, status: proposal.status, statusLabel },
    cycle: { name: cycle.name, observing: `${cycle.observingStart} to ${cycle.observingEnd}`, deadline, countdown },
    abilities,
    details: {
      proposal: {
        id: proposal.id,
        title: proposal.title,
        abstract: proposal.abstract,
        scienceCategory: proposal.scienceCategory,
        bandId: proposal.bandId,
        updatedAt: proposal.updatedAt.toISOString(),
      },
      bands: details.bands.map((b) => ({
        id: b.band.id,
        label: `${b.instrumentName} — ${b.band.name} (${(b.band.centralWavelengthM * 1e6).toFixed(2)} µm, limit ${b.band.limitingMagnitude} mag)`,
      })),
      categories: [...SCIENCE_CATEGORIES],
      limits: { titleMaxChars: PROPOSAL_LIMITS.titleMaxChars, abstractMaxWords: PROPOSAL_LIMITS.abstractMaxWords },
      cycleName: cycle.name,
      editable,
    } satisfies Omit<DetailsCardProps, "result">,
    hours: {
      configurations: details.offered.map((c) => ({
        id: c.id,
        name: c.name,
        stations: c.stations.map((s) => s.name),
        hours: hoursBy.get(c.id) ?? null,
      })),
      hoursMax: PROPOSAL_LIMITS.hoursMax,
      editable,
    } satisfies Omit<HoursCardProps, "result">,
    targets: {
      proposalId: id,
      targets: details.targets.map((t) => ({ id: t.id, ...targetSummary(t), windows: t.timeWindows.length })),
      myTargets: details.myTargets.map((t) => ({
        id: t.id,
        name: t.name,
        added: onProposal.has(t.id) || namesOnProposal.has(t.name.toLowerCase()),
      })),
      editable,
    } satisfies Omit<TargetsCardProps, "result">,
    submission: {
      proposal: {
        status: proposal.status,
        statusLabel,
        currentVersion: proposal.currentVersion,
        submittedAt: proposal.submittedAt?.toISOString() ?? null,
      },
      abilities: {
        deadlinePassed: abilities.deadlinePassed,
        canSubmit: abilities.canSubmit,
        canWithdraw: abilities.canWithdraw,
        canReopen: abilities.canReopen,
        canDelete: abilities.canDelete,
      },
      deadline,
      countdown,
      missing,
      failing,
    } satisfies Omit<SubmitCardProps, "result">,
    team: {
      pi: details.pi ?? { name: "?", email: "" },
      members: details.team.map((m) => ({ id: m.id, email: m.email, name: m.user?.name ?? null })),
      manage: abilities.canManageTeam,
      piOnlyNote: abilities.relation === "co-investigator" && editable,
    } satisfies Omit<TeamCardProps, "result">,
    document: {
      proposalId: id,
      document: doc && {
        filename: doc.filename,
        size: formatBytes(doc.sizeBytes),
        sha256: doc.sha256,
        uploadedAt: doc.uploadedAt.toISOString(),
        uploadedBy: doc.uploadedBy,
      },
      limits: { pdfBytes: MAX_PDF_BYTES, pdfLabel: formatBytes(MAX_PDF_BYTES) },
      editable,
    } satisfies Omit<DocumentCardProps, "result">,
    versions: {
      proposalId: id,
      versions: details.versions.map(({ acknowledgement: ack, ...x }) => ({
        ...x,
        submittedAt: x.submittedAt.toISOString(),
        acknowledged: ack ? acknowledgementText(ack) : null,
      })),
    } satisfies VersionsCardProps,
  };
}

/** Each intent goes to the handler beside the card that posts it. */
export async function action({ request, params, context }: Route.ActionArgs) {
  const viewer = await requirePermission(request, "proposals:own");
  const proposalId = proposalIdFrom(params.proposalId);
  const db = context.get(dbContext);
  // Someone who may not see the proposal gets the 404 before anything they sent is read.
  await loadProposalForViewer(db, { viewer, proposalId });
  const post = await readProposalPost(request);
  if (!post.ok)
    return fail(post.field === "document" ? "upload-document" : "form", { [post.field]: post.error }, post.status);
  const intent = textOf(post.form, "intent");
  // Only the science case comes as an upload, and only as one.
  if (post.multipart !== (intent === "upload-document")) return fail(intent, { form: "Unknown action." }, 400);
  const here = href("/proposals/:proposalId", { proposalId: String(proposalId) });
  const args: IntentArgs = { db, viewer, proposalId, form: post.form, intent, here };
  try {
    switch (intent) {
      case "save":
      case "autosave":
        return await saveDetailsIntent(args);
      case "hours":
        return await saveHoursIntent(args);
      case "add-member":
        return await addMemberIntent(args);
      case "remove-member":
        return await removeMemberIntent(args);
      case "add-my-target":
        return await addMyTargetIntent(args);
      case "move-target":
        return await moveTargetIntent(args);
      case "remove-target":
        return await removeTargetIntent(args);
      case "upload-document":
        return await uploadDocumentIntent(args);
      case "remove-document":
        return await removeDocumentIntent(args);
      case "submit":
        return await submitIntent(args);
      case "withdraw":
        return await withdrawIntent(args);
      case "reopen":
        return await reopenIntent(args);
      case "delete":
        return await deleteIntent(args);
      default:
        return fail(intent, { form: "Unknown action." }, 400);
    }
  } catch (e) {
    return refusalAnswer(e, intent, post.form);
  }
}

/** Autosave answers with a time only; the page's data has not changed for anyone else to see. */
export function shouldRevalidate({ formData, defaultShouldRevalidate }: ShouldRevalidateFunctionArgs) {
  if (formData?.get("intent") === "autosave") return false;
  return defaultShouldRevalidate;
}

export const meta: Route.MetaFunction = ({ data }) => [
  { title: `${data?.proposal.title || "Proposal"} — Fringe Docket` },
];

export default function ProposalEditor({ loaderData: d, actionData }: Route.ComponentProps) {
  const result = actionData as ActionResult | undefined;
  const { proposal, cycle, abilities } = d;
  const formError = result?.errors.form;
  return (
    <>
      <PageHeader
        title={proposal.title || "(untitled proposal)"}
        lead={
          <>
            <StatusBadge status={proposal.status} label={proposal.statusLabel} /> Cycle{" "}
            <span className="font-medium">{cycle.name}</span> · observing {cycle.observing} · deadline {cycle.deadline}
            {proposal.status === "draft" ? ` (${cycle.countdown})` : ""}
          </>
        }
        actions={
          <>
            <ButtonLink
              to={href("/proposals/:proposalId/feasibility", { proposalId: String(proposal.id) })}
              variant="secondary"
            >
              Feasibility report
            </ButtonLink>
            <ButtonLink to={href("/proposals")} variant="ghost">
              My proposals
            </ButtonLink>
          </>
        }
      />
      {formError && !COURSE_INTENTS.includes(result?.intent ?? "") ? (
        <div className="mb-4">
          <FormErrors errors={[formError]} />
        </div>
      ) : null}
      {!abilities.canEdit && abilities.lockedBecause ? (
        <p className="mb-4 rounded-lg bg-info-50 p-3 text-sm text-info-700 ring-1 ring-info-700/20">
          {abilities.lockedBecause} What you see is read-only.
        </p>
      ) : null}
      <div className="grid gap-6 lg:grid-cols-[minmax(0,3fr)_minmax(0,2fr)]">
        <div className="grid content-start gap-6">
          <DetailsCard {...d.details} result={resultFor(result, "save", "autosave")} />
          <HoursCard {...d.hours} result={resultFor(result, "hours")} />
          <TargetsCard {...d.targets} result={resultFor(result, "add-my-target")} />
        </div>
        <div className="grid content-start gap-6">
          <SubmitCard {...d.submission} result={resultFor(result, ...COURSE_INTENTS)} />
          <TeamCard {...d.team} result={resultFor(result, "add-member")} />
          <DocumentCard {...d.document} result={resultFor(result, "upload-document")} />
          <VersionsCard {...d.versions} />
        </div>
      </div>
      {abilities.canEdit ? null : <span className="sr-only">read-only</span>}
    </>
  );
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
