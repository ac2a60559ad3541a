/** The feasibility report's public names: the computation, its building blocks and its shapes. */
export {
  closureLine,
  combinerLine,
  magnitudeIn,
  magnitudeLine,
  modelSizeMas,
  observableTimeLine,
  resolutionLine,
  visibilityLine,
} from "./lines";
export { addDays, cycleNights, daysBetween, FeasibilityInputError } from "./nights";
export { computeFeasibility } from "./report";
export {
  FEASIBILITY_THRESHOLDS,
  type FeasibilityBand,
  type FeasibilityCell,
  type FeasibilityCheck,
  type FeasibilityConfiguration,
  type FeasibilityInput,
  type FeasibilityLine,
  type FeasibilityNight,
  type FeasibilityReport,
  type FeasibilitySite,
  type FeasibilityTarget,
  VERDICTS,
  type Verdict,
  worstVerdict,
} from "./types";
