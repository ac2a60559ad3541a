import { useMemo } from "react";
import type { CoverageResponse, TargetModel } from "~/engine";
import { beamEllipse, dirtyImageHalfWidthMas, imageWindow } from "~/services/sketch/figures";
import { plural } from "~/services/sketch/words";
import { Panel } from "./Panel";
import { HEAT, Plot, plotLayout, skyAxes } from "./Plot";

const OUTLINE = "#5ad1e6";

type Beam = NonNullable<CoverageResponse["beam"]>;

/**
 * The dirty beam (point-spread function of the coverage) with its fitted half-power ellipse, and the
 * dirty image of the model (the model seen through that beam), both with east to the left.
 */
export function BeamPanel({ beam, model }: { beam: Beam | null | undefined; model: TargetModel }) {
  const figures = useMemo(() => {
    if (!beam?.image) return null;
    // Zoom the beam on its main lobe and first sidelobes: ±6 FWHM (whole image when undefined).
    const half = beam.fwhmMajorMas ? 6 * beam.fwhmMajorMas : Infinity;
    const w = imageWindow(beam.image, beam.gridSize, beam.pixelMas, half);
    let zmin = 0;
    for (const row of w.z) for (const v of row) zmin = Math.min(zmin, v);
    const beamData: Record<string, unknown>[] = [
      {
        type: "heatmap",
        x: w.x,
        y: w.y,
        z: w.z,
        zmin,
        zmax: 1,
        colorscale: HEAT,
        colorbar: { title: { text: "peak = 1", side: "right" }, thickness: 12, len: 0.9 },
        hovertemplate: "east %{x:.2f} mas, north %{y:.2f} mas<br>beam %{z:.3f}<extra></extra>",
      },
    ];
    if (beam.fwhmMajorMas && beam.fwhmMinorMas && beam.positionAngleDeg !== null) {
      const e = beamEllipse(beam.fwhmMajorMas, beam.fwhmMinorMas, beam.positionAngleDeg);
      beamData.push({
        type: "scatter",
        mode: "lines",
        name: "Fitted FWHM",
        x: e.east,
        y: e.north,
        line: { color: OUTLINE, width: 2 },
        hoverinfo: "skip",
        showlegend: false,
      });
    }
    let dirty: { data: Record<string, unknown>[] } | null = null;
    if (beam.dirtyImage) {
      const d = imageWindow(
        beam.dirtyImage,
        beam.gridSize,
        beam.pixelMas,
        dirtyImageHalfWidthMas(model, beam.fwhmMajorMas),
      );
      let lo = Infinity;
      let hi = -Infinity;
      for (const row of d.z)
        for (const v of row) {
          lo = Math.min(lo, v);
          hi = Math.max(hi, v);
        }
      dirty = {
        data: [
          {
            type: "heatmap",
            x: d.x,
            y: d.y,
            z: d.z,
            zmin: Math.min(0, lo),
            zmax: hi > 0 ? hi : 1,
            colorscale: HEAT,
            colorbar: { title: { text: "relative", side: "right" }, thickness: 12, len: 0.9 },
            hovertemplate: "east %{x:.2f} mas, north %{y:.2f} mas<br>%{z:.3f}<extra></extra>",
          },
        ],
      };
    }
    return { beamData, dirty };
  }, [beam, model]);
  const layout = useMemo(
    () => plotLayout({ ...skyAxes(), margin: { l: 52, r: 8, t: 8, b: 44 }, uirevision: "beam" }),
    [],
  );
  const dirtyLayout = useMemo(
    () => plotLayout({ ...skyAxes(), margin: { l: 52, r: 8, t: 8, b: 44 }, uirevision: "dirty" }),
    [],
  );

  const fmt = (x: number | null, d = 2) => (x === null ? "—" : x.toFixed(d));
  return (
    <Panel
      id="beam"
      title="Dirty beam and dirty image"
      note={
        beam ? (
          <>
            {beam.gridSize}² grid, {beam.weighting} weighting, {beam.pixelMas.toFixed(3)} mas pixels (field{" "}
            {beam.fieldOfViewMas.toFixed(1)} mas), {plural(beam.uvPointCount, "uv point")}. The beam is shown within ±6
            FWHM of its centre; the outline is the fitted half-power ellipse. The dirty image is shown out to three
            times the model's extent and at least eight beam widths.
          </>
        ) : null
      }
    >
      {beam === undefined ? (
        <p className="py-16 text-center text-sm text-night-600">Computing the dirty beam…</p>
      ) : !beam ? (
        <p className="py-16 text-center text-sm text-night-600">
          No beam: no observable uv point with a non-zero length.
        </p>
      ) : (
        <>
          <dl className="mb-2 grid grid-cols-2 gap-x-4 gap-y-1 text-sm sm:grid-cols-4">
            <div>
              <dt className="text-night-600">FWHM major</dt>
              <dd className="num font-semibold">{fmt(beam.fwhmMajorMas, 3)} mas</dd>
            </div>
            <div>
              <dt className="text-night-600">FWHM minor</dt>
              <dd className="num font-semibold">{fmt(beam.fwhmMinorMas, 3)} mas</dd>
            </div>
            <div>
              <dt className="text-night-600">Position angle</dt>
              <dd className="num font-semibold">{fmt(beam.positionAngleDeg, 1)}° E of N</dd>
            </div>
            <div>
              <dt className="text-night-600">Peak sidelobe</dt>
              <dd className="num font-semibold">{(beam.peakSidelobe * 100).toFixed(0)} % of peak</dd>
            </div>
          </dl>
          {figures ? (
            <div className="grid gap-3 md:grid-cols-2">
              <Plot
                label="Dirty beam in milliarcseconds, east to the left, with the fitted half-power ellipse"
                caption="Dirty beam"
                priority="heavy"
                height={310}
                data={figures.beamData}
                layout={layout}
              />
              {figures.dirty ? (
                <Plot
                  label="Dirty image of the model in milliarcseconds, east to the left"
                  caption="Dirty image of the model"
                  priority="heavy"
                  height={310}
                  data={figures.dirty.data}
                  layout={dirtyLayout}
                />
              ) : null}
            </div>
          ) : null}
        </>
      )}
    </Panel>
  );
}
