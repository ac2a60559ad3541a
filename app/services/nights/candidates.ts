/**
 * Candidates of a night (pure): the targets of accepted programs with the hours still owed, turned into
 * the planner's request, and each target's observable window that night read from the planner's own
 * tracks (elevation, darkness, delay lines and Moon together, with the planner's safety margins).
 */

import type { NightPlanSettingsJson } from "~/db/schema/nights";
import {
  buildPlanContext,
  PLAN_SAFETY_MARGINS,
  type PlanBlockRef,
  type PlanContext,
  type PlanInput,
  parsePlanRequest,
  RAD_TO_DEG,
  roundTo,
  type SiteInput,
  type StationInput,
} from "~/engine";

/** One target of an accepted program, as the database gives it for a configuration. */
export type ProgramTarget = {
  proposalId: number;
  proposalTitle: string;
  piName: string;
  /** 1 = planned first. */
  rank: number;
  proposalTargetId: number;
  name: string;
  raDeg: number;
  decDeg: number;
  minElevationDeg: number | null;
  calibrators: readonly { name: string; raDeg: number; decDeg: number }[];
  /** Science hours this target may receive on the configuration (its share of the program's). */
  grantedHours: number;
  /** Science hours already executed on other nights with this configuration. */
  executedHours: number;
};

export type Candidate = Omit<ProgramTarget, "calibrators"> & {
  /** The target's name in the plan request: its own, made distinct when two programs share a name. */
  key: string;
  owedHours: number;
  calibrators: { name: string; raDeg: number; decDeg: number }[];
};

const inRange = (x: unknown, lo: number, hi: number) =>
  typeof x === "number" && Number.isFinite(x) && x >= lo && x <= hi;
const clip = (s: string) => s.trim().slice(0, 200);

/** Distinct request names and usable calibrators (distinct, in range, not named like the target, at most 20). */
export function makeCandidates(rows: readonly ProgramTarget[]): Candidate[] {
  const count = new Map<string, number>();
  for (const r of rows) count.set(clip(r.name), (count.get(clip(r.name)) ?? 0) + 1);
  const used = new Set<string>();
  return rows.map((r) => {
    let key = clip(r.name) || `Target ${r.proposalTargetId}`;
    if ((count.get(clip(r.name)) ?? 0) > 1 || used.has(key))
      key = `${key.slice(0, 180)} [P${r.proposalId}-${r.proposalTargetId}]`;
    used.add(key);
    const names = new Set<string>();
    const calibrators = [];
    for (const c of r.calibrators) {
      const name = clip(String(c.name ?? ""));
      if (!name || name === key || names.has(name) || !inRange(c.raDeg, 0, 360) || !inRange(c.decDeg, -90, 90))
        continue;
      names.add(name);
      calibrators.push({ name, raDeg: c.raDeg, decDeg: c.decDeg });
      if (calibrators.length === 20) break;
    }
    const owedHours = roundTo(Math.max(0, r.grantedHours - r.executedHours), 4);
    return { ...r, key, owedHours, calibrators };
  });
}

export type PlanSetting = {
  site: SiteInput;
  date: string;
  stations: StationInput[];
  delayLineStrokeM: number | null;
  settings: NightPlanSettingsJson;
};

/** The planner's request for a night: every candidate (`onlyOwed`: those with hours owed). Throws on a bug. */
export function planRequest(
  setting: PlanSetting,
  candidates: readonly Candidate[],
  options: { onlyOwed?: boolean; notBeforeUtc?: string | null; executedBlocks?: PlanBlockRef[] } = {},
): PlanInput {
  const targets = candidates
    .filter((c) => !options.onlyOwed || c.owedHours > 0)
    .map((c) => ({
      name: c.key,
      raDeg: c.raDeg,
      decDeg: c.decDeg,
      priority: c.rank,
      hoursOwed: Math.min(10_000, c.owedHours),
      minElevationDeg: inRange(c.minElevationDeg, 0, 90) ? c.minElevationDeg : null,
      calibrators: c.calibrators,
    }));
  const parsed = parsePlanRequest({
    site: setting.site,
    date: setting.date,
    stations: setting.stations,
    delayLineStrokeM: setting.stations.length >= 2 ? setting.delayLineStrokeM : null,
    ...setting.settings,
    targets,
    notBeforeUtc: options.notBeforeUtc ?? null,
    executedBlocks: options.executedBlocks ?? [],
  });
  if (!parsed.ok) throw new Error(`night plan request: ${parsed.message}`);
  return parsed.value;
}

export type ObservableRun = { startUtc: string; endUtc: string; hours: number };

export type CandidateWindow = {
  key: string;
  runs: ObservableRun[];
  /** Highest elevation during darkness, degrees (null without darkness). */
  maxElevationDeg: number | null;
  /** Least distance from the Moon during darkness, degrees. */
  minMoonSeparationDeg: number | null;
  /** Why there is no window, when there is none. */
  reason: string | null;
};

const isoOfSec = (sec: number) => new Date(sec * 1000).toISOString().replace(".000Z", "Z");

/** Each target's observable runs that night (whole grid steps), best values and, without a run, the reason. */
export function candidateWindows(ctx: PlanContext): CandidateWindow[] {
  const { sky, input } = ctx;
  const m = PLAN_SAFETY_MARGINS;
  return ctx.targets.map((t) => {
    const track = t.science;
    const runs: ObservableRun[] = [];
    let k = 0;
    while (k < sky.count) {
      if (track.bad[k] !== 0) {
        k++;
        continue;
      }
      const end = track.runEnd[k];
      const s = sky.originSec + k * sky.stepSec;
      const e = sky.originSec + end * sky.stepSec;
      if (e > s) runs.push({ startUtc: isoOfSec(s), endUtc: isoOfSec(e), hours: roundTo((e - s) / 3600, 2) });
      k = end + 1;
    }
    let maxEl = -Infinity;
    let minMoon = Infinity;
    let highEnough = false;
    let delayOk = false;
    const elLimit = (t.elevationLimitDeg + m.elevationDeg) / RAD_TO_DEG;
    const stroke = input.delayLineStrokeM === null ? Infinity : input.delayLineStrokeM - m.delayLineM;
    for (let i = 0; i < sky.count; i++) {
      maxEl = Math.max(maxEl, track.elevRad[i]);
      minMoon = Math.min(minMoon, track.moonSepRad[i]);
      if (track.elevRad[i] >= elLimit) {
        highEnough = true;
        if (track.delayNeedM[i] <= stroke) delayOk = true;
      }
    }
    let reason: string | null = null;
    if (t.sunExcluded) reason = `closer to the Sun than the ${input.sunMinSeparationDeg}° avoidance angle`;
    else if (sky.count === 0) reason = "no astronomical darkness this night";
    else if (runs.length === 0) {
      if (!highEnough)
        reason = `never above ${t.elevationLimitDeg}° in darkness (highest ${(maxEl * RAD_TO_DEG).toFixed(1)}°)`;
      else if (!delayOk) reason = "delay lines out of range whenever it is high enough";
      else reason = `closer than ${input.moonMinSeparationDeg}° to the Moon whenever otherwise observable`;
    }
    return {
      key: t.input.name,
      runs,
      maxElevationDeg: sky.count ? roundTo(maxEl * RAD_TO_DEG, 1) : null,
      minMoonSeparationDeg: sky.count ? roundTo(minMoon * RAD_TO_DEG, 1) : null,
      reason,
    };
  });
}

/** The planning context of a request (the night, its grid and every object's track). */
export function planContext(input: PlanInput): PlanContext {
  return buildPlanContext(input);
}
