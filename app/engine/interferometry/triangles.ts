/**
 * The triangle finder behind `cli triangles` and `POST /api/triangles`: ranks
 * every station triple of the request's station pool for the target (see
 * triangle-ranking.ts for the figures and the score).
 */
import type { TrianglesInput } from "../inputs";
import { roundTo } from "../math";
import { closureCube, independentClosurePhaseCount, stationTriangles, triangleCount } from "./closure";
import { prepareObservation } from "./observation";
import { rankTriangleSet, SCORE_WEIGHTS } from "./triangle-ranking";
import { modelVisibilityCube } from "./visibilities";

export interface TrianglesResponse {
  /** Best first, at most maxTriangles entries. */
  triangles: {
    rank: number;
    stations: [string, string, string];
    /** 0..1, see `scoring`. */
    score: number;
    closurePhaseSignalDeg: number;
    meanTripleAmplitude: number;
    /** 0..1 */
    uvSpread: number;
    observableHours: number;
    observableSamples: number;
    reasons: string[];
  }[];
  stationCount: number;
  triangleCount: number;
  independentClosurePhases: number;
  sampleCount: number;
  /** Time per sample, hours (night step, or median hour-angle spacing of a list). */
  sampleDurationH: number;
  scoring: string;
}

/** Ranks the station triangles of a validated request. */
export function rankTriangles(request: TrianglesInput): TrianglesResponse {
  const obs = prepareObservation(request);
  const n = obs.stationNames.length;
  const cube = modelVisibilityCube(obs.model, obs.tracks, obs.wavelengthsM);
  const triangles = stationTriangles(n);
  const closure = closureCube(cube, triangles);
  const skyReasons = obs.observability.reasons.map((r, s) => (obs.observability.skyOk[s] ? null : r));
  const ranked = rankTriangleSet({
    triangles,
    closure,
    skyOk: obs.observability.skyOk,
    baselineInRange: obs.observability.baselineInRange,
    skyReasons,
    tracks: obs.tracks,
    baselines: obs.baselines,
    wavelengthsM: obs.wavelengthsM,
    sampleDurationH: obs.samples.sampleDurationH,
    stationNames: obs.stationNames,
  });
  return {
    triangles: ranked.slice(0, request.maxTriangles).map((t, idx) => ({
      rank: idx + 1,
      stations: t.stations,
      score: roundTo(t.score, 4),
      closurePhaseSignalDeg: roundTo(t.closurePhaseSignalDeg, 4),
      meanTripleAmplitude: roundTo(t.meanTripleAmplitude, 6),
      uvSpread: roundTo(t.uvSpread, 4),
      observableHours: roundTo(t.observableHours, 4),
      observableSamples: t.observableSamples,
      reasons: t.reasons,
    })),
    stationCount: n,
    triangleCount: triangleCount(n),
    independentClosurePhases: independentClosurePhaseCount(n),
    sampleCount: obs.tracks.nSamples,
    sampleDurationH: roundTo(obs.samples.sampleDurationH, 6),
    scoring: `score = ${SCORE_WEIGHTS.signal}·signal/best signal + ${SCORE_WEIGHTS.uvSpread}·uv spread + ${SCORE_WEIGHTS.hours}·hours/most hours; 0 when never observable`,
  };
}
