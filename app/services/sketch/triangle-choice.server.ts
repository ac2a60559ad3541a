/**
 * "Use this triangle": the drafts and targets the viewer may store a ranked triangle on, and the
 * store itself (checked against the registry by the proposal's own command).
 */
import type { Database } from "~/db/client.server";
import type { Viewer } from "~/lib/guards.server";
import { ProposalRefusal } from "~/services/proposals/lock.server";
import { editableProposalTargets } from "~/services/proposals/picks.server";
import { chooseTriangle } from "~/services/proposals/triangle.server";
import { ALL_STATIONS } from "./state";
import type { ProposalTargetChoice, UseTriangleInput } from "./triangle-choice";

/** The viewer's editable drafts with their targets (none for a role without proposals of its own). */
export async function proposalTargetChoices(
  db: Database,
  { viewer, now }: { viewer: Viewer; now: Date },
): Promise<ProposalTargetChoice[]> {
  if (!viewer.permissions.has("proposals:own")) return [];
  return editableProposalTargets(db, { viewer, now });
}

/** Stores the ranked triangle on the chosen target: its name and the proposal's id, or the refusal. */
export async function storeTriangle(
  db: Database,
  { viewer, input }: { viewer: Viewer; input: UseTriangleInput },
): Promise<
  { ok: true; name: string; proposalId: number; targetId: number } | { ok: false; status: number; message: string }
> {
  const { proposalId, targetId } = input.target;
  const triangle = {
    stations: input.stations,
    site: input.site,
    instrument: input.instrument,
    band: input.band,
    configuration: input.pool === ALL_STATIONS ? null : input.pool,
  };
  try {
    const name = await chooseTriangle(db, { viewer, proposalId, targetId, triangle });
    return { ok: true, name, proposalId, targetId };
  } catch (e) {
    if (e instanceof ProposalRefusal) return { ok: false, status: e.status, message: e.message };
    throw e;
  }
}
