/**
 * Everything one night's pages and commands start from: the configuration installed (and its cycle),
 * the site and the configuration's stations, the stored plan with its blocks, and the candidates with
 * the hours they are owed at the start of the night.
 */
import { asc, eq } from "drizzle-orm";
import type { DbOrTx } from "~/db/client.server";
import { configurationStations, configurations, sites, stations } from "~/db/schema/array";
import {
  type NightPlan,
  type NightPlanSettingsJson,
  nightConfigurations,
  nightPlanBlocks,
  nightPlans,
} from "~/db/schema/nights";
import { cycles } from "~/db/schema/proposals";
import { PLAN_DEFAULTS } from "~/engine";
import { configurationOf } from "~/lib/joins.server";
import { type Candidate, makeCandidates, type PlanSetting } from "./candidates";
import { programTargets } from "./programs.server";
import type { StoredBlock } from "./view";

export type Installation = {
  cycleId: number;
  cycleName: string;
  observingStart: string;
  observingEnd: string;
  configurationId: number;
  configurationName: string;
};

export type SiteRow = typeof sites.$inferSelect;

export type LoadedNight = {
  date: string;
  installation: Installation | null;
  site: SiteRow | null;
  stationNames: string[];
  plan: NightPlan | null;
  blocks: StoredBlock[];
  candidates: Candidate[];
  /** What a plan request needs besides its targets; null without an installed configuration. */
  setting: PlanSetting | null;
};

/** The settings of a new plan: the site's elevation limit and the planner's defaults. */
export function defaultSettings(site: Pick<SiteRow, "minElevationDeg">): NightPlanSettingsJson {
  return {
    minElevationDeg: site.minElevationDeg,
    moonMinSeparationDeg: PLAN_DEFAULTS.moonMinSeparationDeg,
    sunMinSeparationDeg: PLAN_DEFAULTS.sunMinSeparationDeg,
    scienceBlockMin: PLAN_DEFAULTS.scienceBlockMin,
    calibratorBlockMin: PLAN_DEFAULTS.calibratorBlockMin,
  };
}

/** The configuration installed on the night of `date`, with its cycle; null when none is. */
export async function installationOf(db: DbOrTx, { date }: { date: string }): Promise<Installation | null> {
  const [row] = await db
    .select({
      cycleId: cycles.id,
      cycleName: cycles.name,
      observingStart: cycles.observingStart,
      observingEnd: cycles.observingEnd,
      configurationId: configurations.id,
      configurationName: configurations.name,
    })
    .from(nightConfigurations)
    .innerJoin(cycles, eq(cycles.id, nightConfigurations.cycleId))
    .innerJoin(configurations, configurationOf(nightConfigurations.configurationId))
    .where(eq(nightConfigurations.nightDate, date));
  return row ?? null;
}

/** The stored plan of a night (locked for update inside a transaction when asked) and its blocks in order. */
export async function planOf(db: DbOrTx, { date, lock = false }: { date: string; lock?: boolean }) {
  const query = db.select().from(nightPlans).where(eq(nightPlans.nightDate, date));
  const [plan] = lock ? await query.for("update") : await query;
  if (!plan) return { plan: null, blocks: [] as StoredBlock[] };
  const blocks = await db
    .select({
      id: nightPlanBlocks.id,
      position: nightPlanBlocks.position,
      kind: nightPlanBlocks.kind,
      target: nightPlanBlocks.target,
      object: nightPlanBlocks.object,
      proposalId: nightPlanBlocks.proposalId,
      proposalTargetId: nightPlanBlocks.proposalTargetId,
      startUtc: nightPlanBlocks.startUtc,
      endUtc: nightPlanBlocks.endUtc,
      outcome: nightPlanBlocks.outcome,
      note: nightPlanBlocks.note,
    })
    .from(nightPlanBlocks)
    .where(eq(nightPlanBlocks.planId, plan.id))
    .orderBy(asc(nightPlanBlocks.position), asc(nightPlanBlocks.startUtc));
  return { plan, blocks };
}

/** Loads the night of `date` (the plan row locked when `lock`, inside a transaction). */
export async function loadNight(
  db: DbOrTx,
  { date, lock = false }: { date: string; lock?: boolean },
): Promise<LoadedNight> {
  const installation = await installationOf(db, { date });
  const { plan, blocks } = await planOf(db, { date, lock });
  let site: SiteRow | null = null;
  let stationRows: (typeof stations.$inferSelect)[] = [];
  if (installation) {
    const [row] = await db
      .select({ site: sites })
      .from(configurations)
      .innerJoin(sites, eq(sites.id, configurations.siteId))
      .where(eq(configurations.id, installation.configurationId));
    site = row?.site ?? null;
    const members = await db
      .select({ station: stations })
      .from(configurationStations)
      .innerJoin(stations, eq(stations.id, configurationStations.stationId))
      .where(eq(configurationStations.configurationId, installation.configurationId))
      .orderBy(asc(configurationStations.position));
    stationRows = members.map((m) => m.station);
  } else {
    [site] = await db.select().from(sites).orderBy(asc(sites.id)).limit(1);
    site ??= null;
  }
  const candidates = installation
    ? makeCandidates(
        await programTargets(db, {
          cycleId: installation.cycleId,
          configurationId: installation.configurationId,
          date,
        }),
      )
    : [];
  const setting: PlanSetting | null =
    installation && site
      ? {
          site: { latitudeDeg: site.latitudeDeg, longitudeDeg: site.longitudeDeg, altitudeM: site.altitudeM },
          date,
          stations: stationRows.map((s) => ({
            name: s.name,
            eastM: s.eastM,
            northM: s.northM,
            upM: s.upM,
            pathOffsetM: s.pathOffsetM,
          })),
          delayLineStrokeM: site.delayLineStrokeM,
          settings: plan?.settings ?? defaultSettings(site),
        }
      : null;
  return { date, installation, site, stationNames: stationRows.map((s) => s.name), plan, blocks, candidates, setting };
}
