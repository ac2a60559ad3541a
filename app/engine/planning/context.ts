/**
 * Everything the planner and the plan validator derive from a request before looking at blocks: the
 * night's sky, the baselines, and a track of every target and calibrator with its elevation limit,
 * its Sun-avoidance status and the science time it may receive.
 */
import { buildBaselines } from "../interferometry/baselines";
import { stationsToEquatorial } from "../interferometry/stations";
import { DEG_TO_RAD } from "../math";
import type { PlanInput, PlanTargetInput } from "./inputs";
import { buildNightSky, type NightSky } from "./night-sky";
import { buildObjectTrack, type ObjectTrack, type TrackSetting } from "./object-track";

export interface PlanTarget {
  /** Position in the request's target list. */
  index: number;
  input: PlanTargetInput;
  science: ObjectTrack;
  /** One track per listed calibrator, in the request's order. */
  calibrators: ObjectTrack[];
  /** False for a calibrator closer to the Sun than the avoidance angle. */
  calibratorUsable: boolean[];
  /** The target itself is closer to the Sun than the avoidance angle. */
  sunExcluded: boolean;
  /** Elevation limit of the science target: its own, else the request's, degrees. */
  elevationLimitDeg: number;
  /**
   * Elevation limit of its calibrators: the larger of the science limit and the request's, degrees
   * (so the block holds whichever of the two a reader applies to a calibrator).
   */
  calibratorElevationLimitDeg: number;
  /** Most science blocks: hoursOwed rounded up to whole blocks. */
  maxBlocks: number;
  /** Most science time, seconds: maxBlocks nominal blocks. */
  allowedSec: number;
}

export interface PlanContext {
  input: PlanInput;
  sky: NightSky;
  setting: TrackSetting;
  /** Block lengths, whole seconds (the minutes rounded down). */
  scienceSec: number;
  calibratorSec: number;
  /** Calibrator + science + calibrator, seconds. */
  sequenceSec: number;
  sunMinRad: number;
  targets: PlanTarget[];
  byName: Map<string, PlanTarget>;
}

/** Whole science blocks that cover `hoursOwed` (0 for nothing owed); a 1e-9 slack absorbs round-off. */
export function maxScienceBlocks(hoursOwed: number, scienceBlockMin: number): number {
  if (!(hoursOwed > 0)) return 0;
  return Math.max(1, Math.ceil((hoursOwed * 60) / scienceBlockMin - 1e-9));
}

/** Builds the planning context of a validated request. */
export function buildPlanContext(input: PlanInput): PlanContext {
  const sky = buildNightSky(input.date, input.site.latitudeDeg, input.site.longitudeDeg);
  const xyz = stationsToEquatorial(input.stations, sky.latRad);
  const baselines = buildBaselines(
    xyz,
    input.stations.map((s) => s.pathOffsetM),
  );
  const setting: TrackSetting = {
    sky,
    baselines,
    delayLineStrokeM: input.delayLineStrokeM,
    moonMinRad: input.moonMinSeparationDeg * DEG_TO_RAD,
  };
  const sunMinRad = input.sunMinSeparationDeg * DEG_TO_RAD;
  const cache = new Map<string, ObjectTrack>();
  const track = (name: string, raDeg: number, decDeg: number, limitDeg: number) => {
    const key = `${name}\u0000${raDeg}\u0000${decDeg}\u0000${limitDeg}`;
    let t = cache.get(key);
    if (!t) {
      t = buildObjectTrack(setting, name, raDeg, decDeg, limitDeg);
      cache.set(key, t);
    }
    return t;
  };

  const scienceSec = Math.floor(input.scienceBlockMin * 60 + 1e-9);
  const calibratorSec = Math.floor(input.calibratorBlockMin * 60 + 1e-9);
  const targets = input.targets.map((t, index): PlanTarget => {
    const elevationLimitDeg = t.minElevationDeg ?? input.minElevationDeg;
    const calibratorElevationLimitDeg = Math.max(elevationLimitDeg, input.minElevationDeg);
    const science = track(t.name, t.raDeg, t.decDeg, elevationLimitDeg);
    const calibrators = t.calibrators.map((c) => track(c.name, c.raDeg, c.decDeg, calibratorElevationLimitDeg));
    const maxBlocks = maxScienceBlocks(t.hoursOwed, input.scienceBlockMin);
    return {
      index,
      input: t,
      science,
      calibrators,
      calibratorUsable: calibrators.map((c) => c.sunSeparationRad >= sunMinRad),
      sunExcluded: science.sunSeparationRad < sunMinRad,
      elevationLimitDeg,
      calibratorElevationLimitDeg,
      maxBlocks,
      allowedSec: maxBlocks * input.scienceBlockMin * 60,
    };
  });
  return {
    input,
    sky,
    setting,
    scienceSec,
    calibratorSec,
    sequenceSec: 2 * calibratorSec + scienceSec,
    sunMinRad,
    targets,
    byName: new Map(targets.map((t) => [t.input.name, t])),
  };
}
