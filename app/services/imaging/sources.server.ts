/**
 * What a preview is made from: a Sketchpad request as it stands, or a proposal's target with what its
 * proposal asks for — the requested configuration with the most stations (the most baselines and
 * closure phases), the proposal's band with its channels, the middle night of the cycle's observing
 * period at 10-minute steps, the stricter of the site's and the target's elevation limits.
 *
 * An imaging target (for the chair's queue of a whole cycle) is a target of a submitted proposal whose
 * model has structure (not a point) and whose proposal requests a configuration of four stations or more,
 * i.e. at least three independent closure phases per instant (Monnier 2003, Rep. Prog. Phys. 66, 789
 * counts (N−1)(N−2)/2) — our rule for "asks for an image", stated on the cycle page.
 */
import { and, eq, gt, inArray } from "drizzle-orm";
import type { DbOrTx } from "~/db/client.server";
import { proposals, proposalTargets } from "~/db/schema/proposals";
import { channelWavelengthsM, parseSimulateRequest, type SimulateRequest } from "~/engine";
import { cycleNights } from "~/services/proposals/feasibility/nights";
import { loadFeasibilityInput } from "~/services/proposals/feasibility.server";
import { type ImagingSettings, simulateBodyOf } from "./schemas";

export const IMAGING_MIN_STATIONS = 4;
export const PREVIEW_STEP_MIN = 10;

/** A request that cannot become a preview: the status, the message and the field it names. */
export class PreviewSourceError extends Error {
  constructor(
    readonly status: 400 | 404 | 409 | 422,
    message: string,
    readonly field: string | null,
  ) {
    super(message);
  }
}

export type BuiltSource = { simulate: SimulateRequest; label: string };

/** The simulate request of a Sketchpad coverage body and the settings. */
export function sketchSource(coverage: Record<string, unknown>, settings: ImagingSettings): BuiltSource {
  const parsed = parseSimulateRequest(simulateBodyOf(coverage, settings));
  if (!parsed.ok) throw new PreviewSourceError(400, `source.coverage.${parsed.message}`, parsed.field);
  const name = parsed.value.target.name;
  return { simulate: parsed.value, label: name ? `${name} (Sketchpad)` : "Sketchpad target" };
}

/** The simulate request of a proposal's target (the caller has checked who may use it). */
export async function proposalTargetSource(
  db: DbOrTx,
  { proposalId, targetId, settings }: { proposalId: number; targetId: number; settings: ImagingSettings },
): Promise<BuiltSource> {
  const [target] = await db
    .select()
    .from(proposalTargets)
    .where(and(eq(proposalTargets.id, targetId), eq(proposalTargets.proposalId, proposalId)));
  if (!target) throw new PreviewSourceError(404, "This proposal has no target with this number.", "targetId");
  const input = await loadFeasibilityInput(db, { proposalId });
  const config = [...input.configurations].sort((a, b) => b.stations.length - a.stations.length)[0];
  if (!config) {
    throw new PreviewSourceError(
      409,
      "Request hours on a configuration first: the preview uses its stations.",
      "source",
    );
  }
  if (!input.band)
    throw new PreviewSourceError(409, "Choose the proposal's band first: the preview uses its channels.", "source");
  const night = cycleNights(input.cycle.observingStart, input.cycle.observingEnd)[1];
  const body = {
    site: {
      latitudeDeg: input.site.latitudeDeg,
      longitudeDeg: input.site.longitudeDeg,
      altitudeM: input.site.altitudeM,
    },
    stations: config.stations,
    target: { name: target.name, raDeg: target.raDeg, decDeg: target.decDeg, model: target.model },
    wavelengthsM: channelWavelengthsM(input.band.centralWavelengthM, input.band.bandwidthM, input.band.channels),
    night: { date: night.date, stepMin: PREVIEW_STEP_MIN },
    minElevationDeg: Math.max(input.site.minElevationDeg, target.minElevationDeg ?? Number.NEGATIVE_INFINITY),
    delayLineStrokeM: input.site.delayLineStrokeM,
  };
  const parsed = parseSimulateRequest(simulateBodyOf(body, settings));
  if (!parsed.ok) throw new PreviewSourceError(422, `The target cannot be previewed: ${parsed.message}`, parsed.field);
  return { simulate: parsed.value, label: `${target.name} (${config.name}, night of ${night.date})` };
}

/** The imaging targets of a cycle's submitted proposals, by proposal then position. */
export async function imagingTargetsOfCycle(db: DbOrTx, { cycleId }: { cycleId: number }) {
  const rows = await db
    .select({ proposalId: proposals.id, targetId: proposalTargets.id, model: proposalTargets.model })
    .from(proposalTargets)
    .innerJoin(proposals, eq(proposals.id, proposalTargets.proposalId))
    .where(
      and(
        eq(proposals.cycleId, cycleId),
        gt(proposals.currentVersion, 0),
        inArray(proposals.status, ["submitted", "under_review", "accepted", "waitlisted", "scheduled"]),
      ),
    )
    .orderBy(proposals.id, proposalTargets.position, proposalTargets.id);
  const out: { proposalId: number; targetId: number }[] = [];
  const stationsOf = new Map<number, number>();
  for (const r of rows) {
    if (r.model.type === "point") continue;
    let most = stationsOf.get(r.proposalId);
    if (most === undefined) {
      const input = await loadFeasibilityInput(db, { proposalId: r.proposalId });
      most = Math.max(0, ...input.configurations.map((c) => c.stations.length));
      stationsOf.set(r.proposalId, most);
    }
    if (most >= IMAGING_MIN_STATIONS) out.push({ proposalId: r.proposalId, targetId: r.targetId });
  }
  return out;
}
