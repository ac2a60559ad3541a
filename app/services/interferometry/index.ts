/**
 * Public face of the interferometry engine (pure numerical code: no database,
 * HTTP or React). Radians, metres and wavelengths inside; degrees, mas and
 * hours only in the request/response objects.
 */
export * from "./math";
export * from "./bessel";
export * from "./stations";
export * from "./baselines";
export * from "./uv-tracks";
export * from "./sampling";
export * from "./observability";
export * from "./models";
export * from "./visibilities";
export * from "./closure";
export * from "./fft2d";
export * from "./dirty-beam";
export * from "./beam-fit";
export * from "./direct-dft";
export * from "./coverage-quality";
export * from "./triangle-ranking";
export * from "./observation";
export { computeCoverage, computeCoverageArrays } from "./coverage";
export type {
  CoverageArrays,
  CoverageBaseline,
  CoverageBeam,
  CoverageClosure,
  CoverageNight,
  CoverageResponse,
  CoverageSample,
} from "./coverage";
export { rankTriangles } from "./triangles";
export type { TrianglesResponse } from "./triangles";
