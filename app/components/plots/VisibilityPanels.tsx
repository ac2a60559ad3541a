import { useMemo } from "react";
import type { CoverageResponse, TargetModel } from "~/engine";
import { modelVis2Curves } from "~/services/sketch/figures";
import { closureTrack, vis2Track } from "~/services/sketch/tracks";
import { Panel, SeriesLegend } from "./Panel";
import { Plot, plotLayout, SERIES_COLOURS } from "./Plot";
import { trackTraces } from "./track-traces";
import { baselineColour } from "./UvPlanePanel";

const CURVE_DASH = ["solid", "dash", "dot", "dashdot"];

/** Model V² against spatial frequency: the dense model curve(s) and the sampled points by baseline. */
export function VisibilityPanel({ coverage, model }: { coverage: CoverageResponse; model: TargetModel }) {
  const figure = useMemo(() => {
    const points = coverage.baselines.map((b, k) => ({ b, k, t: vis2Track(b.points, coverage.wavelengthsM) }));
    let maxF = 0;
    for (const { t } of points) for (const f of [...t.x, ...t.lone.x]) if (f !== null) maxF = Math.max(maxF, f);
    if (maxF === 0) {
      // Nothing observable: still draw the model out to the longest baseline's frequency.
      const longest = Math.max(0, ...coverage.baselines.map((b) => b.lengthM));
      maxF = longest / Math.min(...coverage.wavelengthsM) / 1e6;
    }
    const xMax = (maxF || 1) * 1.1;
    const curves = modelVis2Curves(model, xMax);
    const data: Record<string, unknown>[] = curves.map((c, i) => ({
      type: "scatter",
      mode: "lines",
      name: c.positionAngleDeg === null ? "Model (any position angle)" : `Model, baseline PA ${c.positionAngleDeg}°`,
      x: c.freqMl,
      y: c.vis2,
      line: { color: "#222a3e", width: 1.6, dash: CURVE_DASH[i % CURVE_DASH.length] },
      showlegend: false,
      hovertemplate: "%{x:.1f} Mλ<br>V² %{y:.3f}<extra>model</extra>",
    }));
    for (const { b, k, t } of points) {
      const name = `${b.stations[0]}–${b.stations[1]}`;
      data.push(
        ...trackTraces(t, {
          name,
          colour: baselineColour(k),
          width: 3,
          hovertemplate: `${name}<br>%{x:.1f} Mλ, V² %{y:.3f}<br>hour angle %{customdata[0]:.2f} h, λ %{customdata[1]:.3f} µm<extra></extra>`,
        }),
      );
    }
    const legend = [
      ...curves.map((c, i) => ({
        name: c.positionAngleDeg === null ? "Model (any position angle)" : `Model, PA ${c.positionAngleDeg}°`,
        colour: "#222a3e",
        kind: "line" as const,
        dash: CURVE_DASH[i % CURVE_DASH.length],
      })),
      ...points
        .filter(({ t }) => t.x.length + t.lone.x.length > 0)
        .map(({ b, k }) => ({ name: `${b.stations[0]}–${b.stations[1]}`, colour: baselineColour(k) })),
    ];
    return { data, xMax, legend };
  }, [coverage, model]);
  const layout = useMemo(
    () =>
      plotLayout({
        margin: { l: 56, r: 16, t: 16, b: 48 },
        xaxis: { title: { text: "Spatial frequency (Mλ)" }, range: [0, figure.xMax] },
        yaxis: { title: { text: "V²" }, range: [0, 1.05] },
        showlegend: false,
        uirevision: "vis2",
        hovermode: "closest",
      }),
    [figure.xMax],
  );
  return (
    <Panel
      id="visibility"
      title="Squared visibility of the model"
      note="Coloured: the model's V² at each sample of each baseline, one short line across the band's channels (a dot for a one-channel band). Dark: the model along baselines of fixed position angle (east of north)."
    >
      <Plot
        label="Model squared visibility against spatial frequency in mega-wavelengths, with the samples by baseline"
        height={380}
        data={figure.data}
        layout={layout}
      />
      <SeriesLegend label="Model curves and baselines" items={figure.legend} />
    </Panel>
  );
}

/** The closure-phase figure's layout (a fresh object per figure: Plotly writes into it). */
const closureLayout = () =>
  plotLayout({
    margin: { l: 56, r: 16, t: 16, b: 48 },
    xaxis: { title: { text: "Hour angle (h)" } },
    yaxis: { title: { text: "Closure phase (°)" }, range: [-185, 185], dtick: 45 },
    showlegend: false,
    uirevision: "closure",
    hovermode: "closest",
  });

/**
 * Closure phase against hour angle, one line per station triangle at the band's middle channel,
 * broken at wraps across ±180° and where samples are missing.
 */
export function ClosurePanel({ coverage }: { coverage: CoverageResponse }) {
  const mid = Math.floor((coverage.wavelengthsM.length - 1) / 2);
  const layout = useMemo(closureLayout, []);
  const lambdaUm = coverage.wavelengthsM[mid] * 1e6;
  const data = useMemo(
    () =>
      coverage.closurePhases.flatMap((t, k) =>
        trackTraces(closureTrack(t.points, mid, coverage.wavelengthsM[mid]), {
          name: t.stations.join("–"),
          colour: SERIES_COLOURS[k % SERIES_COLOURS.length],
          width: 1.8,
          hovertemplate: `${t.stations.join("–")}<br>hour angle %{x:.2f} h<br>closure phase %{y:.1f}°<extra></extra>`,
        }),
      ),
    [coverage, mid],
  );
  return (
    <Panel
      id="closure"
      title="Closure phases"
      note={`At λ = ${lambdaUm.toFixed(3)} µm (the band's middle channel). A centro-symmetric model gives 0° or ±180° only.`}
    >
      {coverage.closurePhases.length === 0 ? (
        <p className="py-16 text-center text-sm text-night-600">Closure phases need at least three stations.</p>
      ) : (
        <Plot
          label="Closure phase in degrees against hour angle, one line per station triangle"
          height={380}
          data={data}
          layout={layout}
        />
      )}
      <SeriesLegend
        label="Triangles"
        items={coverage.closurePhases.map((t, k) => ({
          name: t.stations.join("–"),
          colour: SERIES_COLOURS[k % SERIES_COLOURS.length],
          kind: "line" as const,
        }))}
      />
    </Panel>
  );
}
