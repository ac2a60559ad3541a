/**
 * The one editor of a proposal's target, for a new target (`targets/new`) and an existing one: what
 * the page shows, and the save. The route module only hands its arguments here.
 */
import { data, href, type RouterContextProvider } from "react-router";
import { describeModel } from "~/components/targets/describe-model";
import { dbContext } from "~/context";
import { redirectWithFlash } from "~/lib/flash.server";
import { requirePermission } from "~/lib/guards.server";
import { invariantResponse } from "~/lib/not-found";
import { loadProposalForViewer, proposalIdFrom } from "~/services/proposals/access.server";
import { ProposalRefusal } from "~/services/proposals/lock.server";
import { PROPOSAL_LIMITS } from "~/services/proposals/schemas";
import {
  blankTargetForm,
  readProposalTargetForm,
  type TargetFormState,
  targetFormOf,
} from "~/services/proposals/target-form.server";
import { readProposalTarget, saveTarget, targetFormContext } from "~/services/proposals/targets.server";
import { readProposalForm } from "~/services/proposals/upload.server";

type TargetRouteArgs = {
  request: Request;
  params: { proposalId?: string; targetId?: string };
  context: Readonly<RouterContextProvider>;
};

/** The guard, the ids ("new" or a target's) and the proposal, or the 404 for someone not on its team. */
async function openTarget({ request, params, context }: TargetRouteArgs) {
  const viewer = await requirePermission(request, "proposals:own");
  const proposalId = proposalIdFrom(params.proposalId);
  const targetId = params.targetId === "new" ? null : proposalIdFrom(params.targetId);
  const db = context.get(dbContext);
  const loaded = await loadProposalForViewer(db, { viewer, proposalId });
  return { viewer, proposalId, targetId, db, ...loaded };
}

export async function loadTargetEditor(args: TargetRouteArgs) {
  const { db, proposalId, targetId, proposal, abilities } = await openTarget(args);
  const base = {
    proposalId,
    proposalTitle: proposal.title,
    editable: abilities.canEdit,
    limits: { windowsMax: PROPOSAL_LIMITS.windowsMax, calibratorsMax: PROPOSAL_LIMITS.calibratorsMax },
    ...(await targetFormContext(db)),
  };
  if (targetId === null) {
    invariantResponse(abilities.canEdit, abilities.lockedBecause ?? "The proposal cannot be changed.", 409);
    return { ...base, targetId: null, name: "New target", model: null, closureTriangle: null, ...blankTargetForm() };
  }
  const t = await readProposalTarget(db, { proposalId, targetId });
  return {
    ...base,
    targetId: t.id,
    name: t.name,
    model: describeModel(t.model) as string | null,
    closureTriangle: t.closureTriangle,
    ...targetFormOf(t),
  };
}

export type TargetEditorAnswer = TargetFormState & { errors: Record<string, string> };

export async function saveTargetEditor(args: TargetRouteArgs) {
  const { db, viewer, proposalId, targetId } = await openTarget(args);
  const body = await readProposalForm(args.request);
  if (!body.ok) {
    const empty: TargetEditorAnswer = { values: {}, windows: [], calibrators: [], errors: { form: body.error } };
    return data(empty, { status: body.status });
  }
  const { target, ...shown } = readProposalTargetForm(body.form, await targetFormContext(db));
  if (!target) return data<TargetEditorAnswer>(shown, { status: 400 });
  try {
    await saveTarget(db, { viewer, proposalId, targetId, input: target });
  } catch (e) {
    if (!(e instanceof ProposalRefusal)) throw e;
    return data<TargetEditorAnswer>({ ...shown, errors: { [e.field ?? "form"]: e.message } }, { status: e.status });
  }
  return redirectWithFlash(href("/proposals/:proposalId", { proposalId: String(proposalId) }), {
    kind: "success",
    text: `${target.name} ${targetId === null ? "added to" : "saved in"} the proposal.`,
  });
}
