/**
 * Loads what the feasibility report needs for one proposal (site, band, requested configurations
 * with their stations and path offsets, targets, the cycle's period) and runs the pure computation
 * in feasibility.ts. A draft's report is computed on request; a submitted proposal shows the
 * report frozen with its latest version.
 */
import { and, asc, eq, inArray } from "drizzle-orm";
import type { DbOrTx } from "~/db/client.server";
import { bands, configurationStations, configurations, instruments, sites, stations } from "~/db/schema/array";
import { cycles, proposalHours, proposals, proposalTargets, proposalVersions } from "~/db/schema/proposals";
import { computeFeasibility, type FeasibilityInput, type FeasibilityReport } from "~/services/proposals/feasibility";

/** The inputs of the report for a proposal (the caller has checked who may see it). */
export async function loadFeasibilityInput(db: DbOrTx, proposalId: number): Promise<FeasibilityInput> {
  const [row] = await db
    .select({ proposal: proposals, cycle: cycles })
    .from(proposals)
    .innerJoin(cycles, eq(cycles.id, proposals.cycleId))
    .where(eq(proposals.id, proposalId));
  if (!row) throw new Error(`proposal ${proposalId} not found`);
  const { proposal, cycle } = row;

  const requested = await db
    .select({ id: configurations.id, name: configurations.name, siteId: configurations.siteId })
    .from(proposalHours)
    .innerJoin(configurations, eq(configurations.id, proposalHours.configurationId))
    .where(eq(proposalHours.proposalId, proposalId))
    .orderBy(asc(configurations.name));
  const memberRows =
    requested.length === 0
      ? []
      : await db
          .select({
            configurationId: configurationStations.configurationId,
            name: stations.name,
            eastM: stations.eastM,
            northM: stations.northM,
            upM: stations.upM,
            pathOffsetM: stations.pathOffsetM,
          })
          .from(configurationStations)
          .innerJoin(stations, eq(stations.id, configurationStations.stationId))
          .where(
            inArray(
              configurationStations.configurationId,
              requested.map((c) => c.id),
            ),
          )
          .orderBy(asc(configurationStations.position));

  const [bandRow] = proposal.bandId
    ? await db
        .select({ band: bands, instrument: instruments })
        .from(bands)
        .innerJoin(instruments, eq(instruments.id, bands.instrumentId))
        .where(and(eq(bands.id, proposal.bandId)))
    : [];

  // The site: that of the requested configurations, else of the instrument, else the first one.
  const siteId = requested[0]?.siteId ?? bandRow?.instrument.siteId ?? null;
  const [site] =
    siteId !== null
      ? await db.select().from(sites).where(eq(sites.id, siteId))
      : await db.select().from(sites).orderBy(asc(sites.id)).limit(1);
  if (!site) throw new Error("no site in the array registry");

  const targetRows = await db
    .select()
    .from(proposalTargets)
    .where(eq(proposalTargets.proposalId, proposalId))
    .orderBy(asc(proposalTargets.position), asc(proposalTargets.id));

  return {
    site: {
      latitudeDeg: site.latitudeDeg,
      longitudeDeg: site.longitudeDeg,
      altitudeM: site.altitudeM,
      minElevationDeg: site.minElevationDeg,
      delayLineStrokeM: site.delayLineStrokeM,
    },
    cycle: { name: cycle.name, observingStart: cycle.observingStart, observingEnd: cycle.observingEnd },
    band: bandRow
      ? {
          instrumentName: bandRow.instrument.name,
          maxTelescopes: bandRow.instrument.maxTelescopes,
          name: bandRow.band.name,
          centralWavelengthM: bandRow.band.centralWavelengthM,
          bandwidthM: bandRow.band.bandwidthM,
          channels: bandRow.band.channels,
          limitingMagnitude: bandRow.band.limitingMagnitude,
        }
      : null,
    configurations: requested.map((c) => ({
      name: c.name,
      stations: memberRows
        .filter((m) => m.configurationId === c.id)
        .map((m) => ({ name: m.name, eastM: m.eastM, northM: m.northM, upM: m.upM, pathOffsetM: m.pathOffsetM })),
    })),
    targets: targetRows.map((t) => ({
      name: t.name,
      raDeg: t.raDeg,
      decDeg: t.decDeg,
      model: t.model,
      magnitudes: t.magnitudes,
      minElevationDeg: t.minElevationDeg,
      timeWindows: t.timeWindows,
    })),
  };
}

/** The report of a draft, computed now from the proposal as it stands. */
export async function computeProposalFeasibility(
  db: DbOrTx,
  proposalId: number,
  now: Date = new Date(),
): Promise<FeasibilityReport> {
  return computeFeasibility(await loadFeasibilityInput(db, proposalId), now);
}

/** The report frozen with a version (null when the version has none). */
export async function frozenFeasibility(
  db: DbOrTx,
  proposalId: number,
  version: number,
): Promise<FeasibilityReport | null> {
  const [row] = await db
    .select({ snapshot: proposalVersions.snapshot })
    .from(proposalVersions)
    .where(and(eq(proposalVersions.proposalId, proposalId), eq(proposalVersions.version, version)));
  const report = (row?.snapshot as { feasibility?: FeasibilityReport } | undefined)?.feasibility;
  return report ?? null;
}
