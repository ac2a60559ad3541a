/** A proposal's target in a few words, for the lists of the pages (editor, frozen version, review desk). */
import { closureTriangleLine } from "~/components/targets/closure-triangle";
import { describeModel } from "~/components/targets/describe-model";
import type { ClosureTriangleJson } from "~/db/schema/proposals";
import type { TargetFields } from "./targets.server";
import { describeMagnitudes } from "./words";

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
export type TargetSummary = ReturnType<typeof targetSummary>;

/** A frozen target as its version lists it: the summary, its windows (UTC), the closure triangle, notes. */
export function frozenTargetView(t: TargetFields & { closureTriangle?: ClosureTriangleJson | null }) {
  return {
    ...targetSummary(t),
    timeWindows: t.timeWindows,
    triangle: closureTriangleLine(t.closureTriangle),
    notes: t.notes,
  };
}
