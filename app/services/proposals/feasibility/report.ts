/**
 * The feasibility report of a proposal: for each target × each requested configuration, over the
 * cycle, whether the array can do what the proposal asks. Pure computation on top of the engine
 * (no database, HTTP or React imports); feasibility.server.ts loads the inputs.
 *
 * Each target × configuration gets lines with a verdict (pass / caution / fail) and the reason in
 * plain words (the rules are in lines.ts and windows.ts):
 *  - Combiner: the configuration's station count against the instrument's telescope limit.
 *  - Observable time: hours the target is observable (elevation ≥ the limit, Sun below −18°, every
 *    baseline within the delay-line stroke) on the first, middle and last night of the cycle.
 *  - Time-critical windows (when the target has any): observable hours inside each window.
 *  - Resolution: the resolution element λ/(2 B_max) (central wavelength, longest projected
 *    baseline seen) against the model's characteristic size. Baselines and visibilities are taken
 *    where the target is up in darkness and that baseline is within the delay-line stroke (a
 *    subset of the stations can observe when the whole configuration cannot).
 *  - Squared visibility: the expected V² range over every observable point and channel, with the
 *    "too resolved" and "unresolved" flags (thresholds in types.ts).
 *  - Magnitude: the target's magnitude in the band against the band's limit.
 *  - Closure phases: station triangles observable at least once on the sampled nights.
 * The verdict of a target × configuration is its worst line; the proposal's verdict is the worst of
 * everything, including proposal-level problems (no band, no target, no configuration).
 */
import * as v from "valibot";
import {
  channelWavelengthsM,
  independentClosurePhaseCount,
  RAD_TO_MAS,
  roundTo,
  stationTriangles,
  TargetModelSchema,
} from "~/engine";
import {
  closureLine,
  combinerLine,
  lineOf,
  magnitudeIn,
  magnitudeLine,
  modelSizeMas,
  observableTimeLine,
  resolutionLine,
  unobservedLines,
  visibilityLine,
} from "./lines";
import { type CellSubject, combineNights, cycleNights, FeasibilityInputError, observeNight } from "./nights";
import {
  FEASIBILITY_THRESHOLDS,
  type FeasibilityBand,
  type FeasibilityCell,
  type FeasibilityConfiguration,
  type FeasibilityInput,
  type FeasibilityLine,
  type FeasibilityReport,
  type FeasibilityTarget,
  worstVerdict,
} from "./types";
import { windowLines } from "./windows";

const roundOrNull = (x: number | null, digits: number) => (x === null ? null : roundTo(x, digits));

/** A failed cell with no figures yet, to which the assessment adds its lines. */
function emptyCell(
  target: FeasibilityTarget,
  config: FeasibilityConfiguration,
  lines: FeasibilityLine[],
): FeasibilityCell {
  return {
    target: target.name,
    configuration: config.name,
    verdict: "fail",
    nights: [],
    figures: {
      longestBaselineM: null,
      shortestBaselineM: null,
      resolutionMas: null,
      sizeMas: null,
      vis2Min: null,
      vis2Max: null,
      observableTriangles: null,
      triangles: stationTriangles(config.stations.length).count,
    },
    lines,
  };
}

/** One target with one configuration, in the band of the proposal. */
type CellInput = {
  input: FeasibilityInput;
  band: FeasibilityBand;
  config: FeasibilityConfiguration;
  target: FeasibilityTarget;
  stepMin: number;
};

function assessCell({ input, band, config, target, stepMin }: CellInput): FeasibilityCell {
  const nStations = config.stations.length;
  const nTriangles = stationTriangles(nStations).count;
  const lines: FeasibilityLine[] = [combinerLine(band, config.name, nStations)];

  const modelParse = v.safeParse(TargetModelSchema, target.model);
  if (!modelParse.success) {
    lines.push(
      lineOf("model", "Model")(
        "fail",
        "The target's model could not be read; edit the target and choose a model again.",
      ),
    );
    return emptyCell(target, config, lines);
  }
  const model = modelParse.output;
  const minElevationDeg = Math.max(input.site.minElevationDeg, target.minElevationDeg ?? -Infinity);
  const wavelengthsM = channelWavelengthsM(band.centralWavelengthM, band.bandwidthM, band.channels);
  const subject: CellSubject = { input, config, target, model, wavelengthsM, minElevationDeg, stepMin };

  const sampled = cycleNights(input.cycle.observingStart, input.cycle.observingEnd).map((n) => ({
    ...n,
    result: observeNight(subject, n.date),
  }));
  const nights = sampled.map(({ date, when, result: r }) => ({
    date,
    when,
    darkHours: roundTo(r.darkHours, 2),
    upHours: roundTo(r.upHours, 2),
    observableHours: roundTo(r.observableHours, 2),
  }));

  lines.push(
    observableTimeLine(nights, {
      configName: config.name,
      nStations,
      minElevationDeg,
      siteMinElevationDeg: input.site.minElevationDeg,
      delayLineStrokeM: input.site.delayLineStrokeM,
    }),
  );
  if (target.timeWindows.length > 0) lines.push(...windowLines(subject));

  // Baselines and visibilities over every observable point of the three nights.
  const seen = combineNights(
    sampled.map((n) => n.result),
    nTriangles,
  );
  const { minLen, maxLen, atShortest, vMin, vMax } = seen;
  const sizeMas = modelSizeMas(model);
  const resolutionMas = maxLen !== null && maxLen > 0 ? (band.centralWavelengthM / (2 * maxLen)) * RAD_TO_MAS : null;
  if (resolutionMas === null || atShortest === null || vMin === null || vMax === null) lines.push(...unobservedLines());
  else lines.push(resolutionLine(resolutionMas, sizeMas, model.type), visibilityLine(atShortest, vMin, vMax));

  lines.push(magnitudeLine(magnitudeIn(target.magnitudes, band.name), band));

  const observableTriangles = nStations < 3 ? null : seen.observableTriangles;
  lines.push(
    closureLine(config.name, nStations, {
      triangles: seen.observableTriangles,
      of: nTriangles,
      independent: nStations < 3 ? 0 : independentClosurePhaseCount(nStations),
    }),
  );

  return {
    target: target.name,
    configuration: config.name,
    verdict: worstVerdict(lines.map((l) => l.verdict)),
    nights,
    figures: {
      longestBaselineM: roundOrNull(maxLen, 2),
      shortestBaselineM: roundOrNull(minLen, 2),
      resolutionMas: roundOrNull(resolutionMas, 3),
      sizeMas: roundTo(sizeMas, 3),
      vis2Min: roundOrNull(vMin, 4),
      vis2Max: roundOrNull(vMax, 4),
      observableTriangles,
      triangles: nTriangles,
    },
    lines,
  };
}

/** The assessed cell, or a failed one naming what the engine refused. */
function cellOrRefusal(cell: CellInput): FeasibilityCell {
  try {
    return assessCell(cell);
  } catch (e) {
    if (!(e instanceof FeasibilityInputError)) throw e;
    const refused = lineOf("model", "Input")("fail", `The engine refused this target or configuration: ${e.message}.`);
    return emptyCell(cell.target, cell.config, [refused]);
  }
}

/** Problems of the proposal as a whole: no band, no target, no configuration. */
function proposalProblems(input: FeasibilityInput): FeasibilityLine[] {
  const problems: FeasibilityLine[] = [];
  if (!input.band)
    problems.push(
      lineOf("combiner", "Instrument and band")("fail", "No instrument band chosen: choose one in the proposal."),
    );
  if (input.targets.length === 0)
    problems.push(lineOf("observable-time", "Targets")("fail", "The proposal has no target yet."));
  if (input.configurations.length === 0)
    problems.push(lineOf("observable-time", "Configurations")("fail", "No hours requested for any configuration yet."));
  return problems;
}

/**
 * Computes the report. Never throws for a target the engine refuses: that cell fails with the
 * reason. `now` is the instant written into the report.
 */
export function computeFeasibility(input: FeasibilityInput, now: Date = new Date()): FeasibilityReport {
  const started = performance.now();
  const stepMin = input.stepMin ?? FEASIBILITY_THRESHOLDS.stepMin;
  const problems = proposalProblems(input);
  const cells: FeasibilityCell[] = [];
  const band = input.band;
  if (band) {
    for (const target of input.targets) {
      for (const config of input.configurations) cells.push(cellOrRefusal({ input, band, config, target, stepMin }));
    }
  }
  return {
    computedAt: now.toISOString(),
    cycle: input.cycle.name,
    band: band ? `${band.instrumentName} ${band.name}` : null,
    stepMin,
    thresholds: FEASIBILITY_THRESHOLDS,
    verdict: worstVerdict([...problems, ...cells].map((x) => x.verdict)),
    problems,
    cells,
    elapsedMs: Math.round(performance.now() - started),
  };
}
