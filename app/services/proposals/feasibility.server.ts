/**
 * Loads what the feasibility report needs for one proposal (site, band, requested configurations
 * with their stations and path offsets, targets, the cycle's period) and runs the pure computation
 * in feasibility/. A draft's report is computed on request; a submitted proposal shows the
 * report frozen with its latest version.
 */
import { and, asc, eq } from "drizzle-orm";
import type { DbOrTx } from "~/db/client.server";
import { sites } from "~/db/schema/array";
import { proposals, proposalVersions } from "~/db/schema/proposals";
import { computeFeasibility, type FeasibilityInput, type FeasibilityReport } from "./feasibility";
import { configurationsWithStations, proposalTargetRows, requestedHours } from "./queries.server";
import { targetFieldsOf } from "./targets.server";

/** The inputs of the report for a proposal (the caller has checked who may see it). */
export async function loadFeasibilityInput(
  db: DbOrTx,
  { proposalId }: { proposalId: number },
): Promise<FeasibilityInput> {
  const proposal = await db.query.proposals.findFirst({
    where: eq(proposals.id, proposalId),
    with: { cycle: true, band: { with: { instrument: true } } },
  });
  if (!proposal) throw new Error(`proposal ${proposalId} not found`);
  const { cycle, band } = proposal;
  const hours = await requestedHours(db, { proposalId });
  const requested = await configurationsWithStations(db, { configurationIds: hours.map((h) => h.configuration.id) });

  // The site: that of the requested configurations, else of the instrument, else the first one.
  const siteId = requested[0]?.siteId ?? band?.instrument.siteId ?? null;
  const [site] =
    siteId !== null
      ? await db.select().from(sites).where(eq(sites.id, siteId))
      : await db.select().from(sites).orderBy(asc(sites.id)).limit(1);
  if (!site) throw new Error("no site in the array registry");

  const { latitudeDeg, longitudeDeg, altitudeM, minElevationDeg, delayLineStrokeM } = site;
  return {
    site: { latitudeDeg, longitudeDeg, altitudeM, minElevationDeg, delayLineStrokeM },
    cycle: { name: cycle.name, observingStart: cycle.observingStart, observingEnd: cycle.observingEnd },
    band: band
      ? {
          instrumentName: band.instrument.name,
          maxTelescopes: band.instrument.maxTelescopes,
          name: band.name,
          centralWavelengthM: band.centralWavelengthM,
          bandwidthM: band.bandwidthM,
          channels: band.channels,
          limitingMagnitude: band.limitingMagnitude,
        }
      : null,
    configurations: requested.map((c) => ({
      name: c.name,
      stations: c.stations.map((m) => ({
        name: m.name,
        eastM: m.eastM,
        northM: m.northM,
        upM: m.upM,
        pathOffsetM: m.pathOffsetM,
      })),
    })),
    targets: (await proposalTargetRows(db, { proposalId })).map(targetFieldsOf),
  };
}

/** The report of a draft, computed now from the proposal as it stands. */
export async function computeProposalFeasibility(
  db: DbOrTx,
  { proposalId, now = new Date() }: { proposalId: number; now?: Date },
): Promise<FeasibilityReport> {
  return computeFeasibility(await loadFeasibilityInput(db, { proposalId }), now);
}

/** The report frozen with a version (null when the version has none). */
export async function frozenFeasibility(
  db: DbOrTx,
  { proposalId, version }: { proposalId: number; version: number },
): Promise<FeasibilityReport | null> {
  const [row] = await db
    .select({ snapshot: proposalVersions.snapshot })
    .from(proposalVersions)
    .where(and(eq(proposalVersions.proposalId, proposalId), eq(proposalVersions.version, version)));
  const report = (row?.snapshot as { feasibility?: FeasibilityReport } | undefined)?.feasibility;
  return report ?? null;
}
