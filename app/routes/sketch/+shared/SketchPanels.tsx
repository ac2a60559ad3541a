/**
 * The Sketchpad's live panels, drawn from the last answer that could be computed and the request it
 * answers (not from the form, which may have changed since).
 */
import { memo, useMemo } from "react";
import { BeamPanel } from "~/components/plots/BeamPanel";
import { ElevationPanel } from "~/components/plots/ElevationPanel";
import { FiguresPanel, NotesPanel } from "~/components/plots/SummaryPanels";
import { UvPlanePanel, type UvUnit } from "~/components/plots/UvPlanePanel";
import { ClosurePanel, VisibilityPanel } from "~/components/plots/VisibilityPanels";
import type { CoverageResponse, EphemerisResponse } from "~/engine";
import { sketchNotes } from "~/services/sketch/figures";
import type { RegistryLike } from "~/services/sketch/registry";
import type { CoverageBody } from "~/services/sketch/request";

/** An answer of the coverage API and the request it answers. */
export interface Shown {
  result: CoverageResponse;
  body: CoverageBody;
}

/**
 * Memoized: typing in a field re-renders the page, not the panels; they draw again only when the
 * answer, the ephemeris or the uv unit changes.
 */
export const SketchPanels = memo(function SketchPanels({
  shown,
  beam,
  ephemeris,
  site,
  uvUnit,
  onUvUnit,
}: {
  shown: Shown;
  /** The dirty beam of the sketch (from its own, slower request); undefined until it first comes. */
  beam: CoverageResponse["beam"] | undefined;
  ephemeris: EphemerisResponse | undefined;
  site: RegistryLike["site"];
  uvUnit: UvUnit;
  onUvUnit: (unit: UvUnit) => void;
}) {
  const { result, body } = shown;
  const notes = useMemo(() => sketchNotes(body, result.samples, ephemeris), [body, result, ephemeris]);
  return (
    <div className="grid gap-4 xl:grid-cols-2">
      <FiguresPanel coverage={result} stations={body.stations.length} />
      <UvPlanePanel coverage={result} unit={uvUnit} onUnit={onUvUnit} />
      <ElevationPanel
        coverage={result}
        ephemeris={ephemeris}
        site={site}
        raDeg={body.target.raDeg}
        decDeg={body.target.decDeg}
        stepMin={body.night?.stepMin ?? null}
        minElevationDeg={body.minElevationDeg}
      />
      <div className="xl:col-span-2">
        <BeamPanel beam={beam} model={body.target.model} />
      </div>
      <VisibilityPanel coverage={result} model={body.target.model} />
      <ClosurePanel coverage={result} />
      <NotesPanel coverage={result} cautions={notes.cautions} moonLine={notes.moon} windows={notes.windows} />
    </div>
  );
});
