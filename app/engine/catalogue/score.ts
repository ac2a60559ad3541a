/**
 * The calibrator score: 100 × (1 − Σ wᵢ cᵢ), each cost cᵢ in [0, 1] (0 best), weights summing to 1.
 *  - distance:  c = distanceDeg / maxDistanceDeg                         (nearer is better)
 *  - vis2:      c = (1 − V²) / (1 − minVis2), 0 when minVis2 = 1          (less resolved is better)
 *  - hours:     c = 1 − hoursTogether / targetHours                      (more shared time is better)
 *  - magnitude: c = min(1, |m − m_target| / scale), scale = maxMagDifference or 2 mag; 0 for every star
 *               when the target's band magnitude is unknown              (closer brightness is better)
 * The weights and the 2-mag scale are project choices.
 */

/** Weight of each cost in the score. */
export const SCORE_WEIGHTS = { distance: 0.4, vis2: 0.2, hours: 0.25, magnitude: 0.15 } as const;
/** Magnitude-difference scale when the request sets no maxMagDifference, mag. */
export const DEFAULT_MAG_SCALE = 2;

export interface ScoreTerms {
  distanceDeg: number;
  maxDistanceDeg: number;
  vis2: number;
  minVis2: number;
  hoursTogether: number;
  targetHours: number;
  /** |band magnitude − target's band magnitude|, or null when either is unknown. */
  magDifference: number | null;
  /** maxMagDifference of the request, or null. */
  maxMagDifference: number | null;
}

const clamp01 = (x: number) => Math.min(1, Math.max(0, x));

/** The score of one calibrator, 0..100. */
export function calibratorScore(t: ScoreTerms): number {
  const distance = clamp01(t.distanceDeg / t.maxDistanceDeg);
  const vis2 = t.minVis2 < 1 ? clamp01((1 - t.vis2) / (1 - t.minVis2)) : 0;
  const hours = t.targetHours > 0 ? clamp01(1 - t.hoursTogether / t.targetHours) : 1;
  const magnitude = t.magDifference === null ? 0 : clamp01(t.magDifference / (t.maxMagDifference ?? DEFAULT_MAG_SCALE));
  const w = SCORE_WEIGHTS;
  return 100 * (1 - (w.distance * distance + w.vis2 * vis2 + w.hours * hours + w.magnitude * magnitude));
}

/** One-line description of the score for responses and documentation. */
export const SCORING_TEXT =
  "score = 100 × (1 − 0.4·distance/maxDistance − 0.2·(1 − V²)/(1 − minVis2) − 0.25·(1 − hoursTogether/targetHours) " +
  "− 0.15·min(1, |Δmag|/scale)), scale = maxMagDifference or 2 mag, Δmag term 0 when the target's band magnitude is unknown";
