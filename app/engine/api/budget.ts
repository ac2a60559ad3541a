/**
 * The cost budget of the computations, checked on a validated request before anything is computed.
 * A request over budget is refused (HTTP 422, CLI exit 2) with one line naming the field to change,
 * the figure and the limit, e.g.
 * `target.model: 40 components × 900 000 uv points = 36 000 000 component evaluations (limit 10 000 000)`.
 *
 * The figures are upper bounds known from the request alone: night sampling counts the samples of the
 * longest night at the site's latitude (as the size limits do) and every sample counts as observable. The limits are chosen so
 * that the costliest request they accept takes about 2 s of one core (docs/cli.md, "Cost budget";
 * measured in docs/benchmarks-load.md). Pure: no I/O.
 */
import type { CoverageInput, ObservationInput, TrianglesInput } from "../inputs";
import { sampleCountBound } from "./limits";
import { grouped, modelShape } from "./model-shape";

/** Most model evaluations one request may cost: uv points × model components. */
export const MAX_COMPONENT_EVALUATIONS = 10_000_000;
/** Largest response a request may produce, estimated before computing it, bytes (48 MB). */
export const MAX_RESPONSE_BYTES = 48_000_000;
/** Most closure phases the triangle finder may rank in one request: triangles × samples × wavelengths. */
export const MAX_RANKED_CLOSURE_PHASES = 4_000_000;

/**
 * Upper bounds of the JSON text, bytes, per item of a response (from the response shapes in
 * docs/cli.md, with the longest numbers and reasons they print).
 */
const BYTES = {
  /** A sample with its longest reason (elevation and delay line both failing). */
  sample: 260,
  /** The instant, sidereal time and Sun altitude a night sample adds. */
  nightSample: 90,
  /** A baseline or triangle entry (names, length). */
  group: 80,
  /** A baseline point without its V² values (hour angle, u, v, w). */
  uvPoint: 95,
  /** A V² value: a double printed in full, 1.2345678901234567e-10. */
  vis2: 24,
  /** A closure point without its values. */
  closurePoint: 45,
  /** A closure phase printed to 6 decimals: -179.999999. */
  closurePhase: 12,
  /** A pixel of the beam or dirty image printed to 6 decimals. */
  pixel: 10,
  /** A ranked triangle with its reasons. */
  rankedTriangle: 420,
  /** Beam figures, night events, notes and the rest. */
  fixed: 4000,
} as const;

/** What a request will cost, counted before computing it. */
export interface CostEstimate {
  samples: number;
  baselines: number;
  triangles: number;
  wavelengths: number;
  /** baselines × samples × wavelengths */
  uvPoints: number;
  /** triangles × samples × wavelengths */
  closurePhases: number;
  /** Models that are not sums, at every depth of the target's model. */
  components: number;
  /** uvPoints × components */
  componentEvaluations: number;
  /** gridSize², 0 without a beam */
  beamCells: number;
  /** Estimated length of the JSON response, bytes. */
  responseBytes: number;
}

function observationCost(req: ObservationInput): Omit<CostEstimate, "beamCells" | "responseBytes"> {
  const n = req.stations.length;
  const baselines = (n * (n - 1)) / 2;
  const triangles = (n * (n - 1) * (n - 2)) / 6;
  const samples = sampleCountBound(req);
  const wavelengths = req.wavelengthsM.length;
  const uvPoints = baselines * samples * wavelengths;
  const { components } = modelShape(req.target.model);
  return {
    samples,
    baselines,
    triangles,
    wavelengths,
    uvPoints,
    closurePhases: triangles * samples * wavelengths,
    components,
    componentEvaluations: uvPoints * components,
  };
}

/** The cost of a validated coverage request. */
export function coverageCost(req: CoverageInput): CostEstimate {
  const c = observationCost(req);
  const beamCells = req.beam ? req.beam.gridSize ** 2 : 0;
  const images = req.beam?.includeImages ? 2 * beamCells * BYTES.pixel : 0;
  const responseBytes =
    BYTES.fixed +
    c.samples * (BYTES.sample + (req.night ? BYTES.nightSample : 0)) +
    c.baselines * BYTES.group +
    c.baselines * c.samples * BYTES.uvPoint +
    c.uvPoints * BYTES.vis2 +
    c.triangles * BYTES.group +
    c.triangles * c.samples * BYTES.closurePoint +
    c.closurePhases * BYTES.closurePhase +
    images;
  return { ...c, beamCells, responseBytes };
}

/** The cost of a validated triangle-finder request. */
export function trianglesCost(req: TrianglesInput): CostEstimate {
  const c = observationCost(req);
  const responseBytes = BYTES.fixed + Math.min(req.maxTriangles, c.triangles) * BYTES.rankedTriangle;
  return { ...c, beamCells: 0, responseBytes };
}

export interface BudgetFailure {
  /** The field to change, as in validation failures. */
  field: string;
  /** One line: `field: figure (limit …)`. */
  message: string;
}

const plural = (n: number, one: string, many = `${one}s`) => `${grouped(n)} ${n === 1 ? one : many}`;
const megabytes = (bytes: number) => `${(bytes / 1e6).toFixed(bytes < 1e8 ? 1 : 0)} MB`;

function failure(field: string, text: string): BudgetFailure {
  return { field, message: `${field}: ${text}` };
}

function evaluationFailure(c: CostEstimate): BudgetFailure | null {
  if (c.componentEvaluations <= MAX_COMPONENT_EVALUATIONS) return null;
  return failure(
    "target.model",
    `${plural(c.components, "component")} × ${plural(c.uvPoints, "uv point")} = ` +
      `${grouped(c.componentEvaluations)} component evaluations (limit ${grouped(MAX_COMPONENT_EVALUATIONS)}); ` +
      "use fewer components, stations, samples or channels",
  );
}

/** The sampling field a request uses: where fewer samples are asked for. */
const samplingField = (req: ObservationInput) => (req.night ? "night.stepMin" : "hourAnglesH");

/** Why a validated coverage request is over budget (the first figure over its limit), or null. */
export function coverageBudgetFailure(req: CoverageInput): BudgetFailure | null {
  const c = coverageCost(req);
  return evaluationFailure(c) ?? coverageResponseFailure(req, c);
}

function coverageResponseFailure(req: CoverageInput, c: CostEstimate): BudgetFailure | null {
  if (c.responseBytes > MAX_RESPONSE_BYTES) {
    return failure(
      samplingField(req),
      `the response would be about ${megabytes(c.responseBytes)} ` +
        `(${plural(c.uvPoints, "uv point")} and ${plural(c.closurePhases, "closure phase")} ` +
        `from ${plural(c.samples, "sample")}) (limit ${MAX_RESPONSE_BYTES / 1e6} MB); ` +
        "use fewer samples, channels or stations",
    );
  }
  return null;
}

/** Why a validated triangle-finder request is over budget (the first figure over its limit), or null. */
export function trianglesBudgetFailure(req: TrianglesInput): BudgetFailure | null {
  const c = trianglesCost(req);
  return evaluationFailure(c) ?? rankingFailure(c);
}

function rankingFailure(c: CostEstimate): BudgetFailure | null {
  if (c.closurePhases > MAX_RANKED_CLOSURE_PHASES) {
    return failure(
      "stations",
      `${plural(c.triangles, "triangle")} × ${plural(c.samples, "sample")} × ${plural(c.wavelengths, "wavelength")} = ` +
        `${grouped(c.closurePhases)} closure phases to rank (limit ${grouped(MAX_RANKED_CLOSURE_PHASES)}); ` +
        "use fewer stations, samples or channels",
    );
  }
  // The response (at most 41 664 ranked triangles of 64 stations, under 18 MB) is always within budget.
  return null;
}
