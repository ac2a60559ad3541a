import { describeModel } from "~/components/targets/describe-model";
import type { TargetFields } from "~/services/proposals/targets.server";
import { describeMagnitudes } from "~/services/proposals/words";

/** A proposal's target in a few words for the lists of the pages (editor, frozen version). */
export function targetSummary(t: TargetFields) {
  return {
    name: t.name,
    raDeg: t.raDeg,
    decDeg: t.decDeg,
    model: describeModel(t.model),
    magnitudes: describeMagnitudes(t.magnitudes),
    minElevationDeg: t.minElevationDeg,
    calibrators: t.calibrators.map((c) => c.name),
  };
}
