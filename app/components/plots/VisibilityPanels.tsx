import { useMemo } from "react";
import type { CoverageResponse, TargetModel } from "~/engine";
import { modelVis2Curves, spatialFrequencyPoints } from "~/services/sketch/figures";
import { Panel, SeriesLegend } from "./Panel";
import { Plot, plotLayout, SERIES_COLOURS } from "./Plot";
import { baselineColour } from "./UvPlanePanel";

const CURVE_DASH = ["solid", "dash", "dot", "dashdot"];

/** Model V² against spatial frequency: the dense model curve(s) and the sampled points by baseline. */
export function VisibilityPanel({ coverage, model }: { coverage: CoverageResponse; model: TargetModel }) {
  const figure = useMemo(() => {
    const points = coverage.baselines.map((b, k) => ({ b, k, p: spatialFrequencyPoints(b, coverage.wavelengthsM) }));
    let maxF = 0;
    for (const { p } of points) for (const f of p.freqMl) maxF = Math.max(maxF, f);
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
    for (const { b, k, p } of points) {
      if (p.freqMl.length === 0) continue;
      const name = `${b.stations[0]}–${b.stations[1]}`;
      data.push({
        type: "scatter",
        mode: "markers",
        name,
        x: p.freqMl,
        y: p.vis2,
        customdata: p.hourAngleH,
        marker: { size: 5, color: baselineColour(k) },
        showlegend: false,
        hovertemplate: `${name}<br>%{x:.1f} Mλ, V² %{y:.3f}<br>hour angle %{customdata:.2f} h<extra></extra>`,
      });
    }
    const legend = [
      ...curves.map((c, i) => ({
        name: c.positionAngleDeg === null ? "Model (any position angle)" : `Model, PA ${c.positionAngleDeg}°`,
        colour: "#222a3e",
        kind: "line" as const,
        dash: CURVE_DASH[i % CURVE_DASH.length],
      })),
      ...points
        .filter(({ p }) => p.freqMl.length > 0)
        .map(({ b, k }) => ({ name: `${b.stations[0]}–${b.stations[1]}`, colour: baselineColour(k) })),
    ];
    return { data, xMax, legend };
  }, [coverage, model]);
  return (
    <Panel
      id="visibility"
      title="Squared visibility of the model"
      note="Points: the model's V² at each sampled baseline and channel. Lines: the model along baselines of fixed position angle (east of north)."
    >
      <Plot
        label="Model squared visibility against spatial frequency in mega-wavelengths, with the sampled points by baseline"
        height={380}
        data={figure.data}
        layout={plotLayout({
          margin: { l: 56, r: 16, t: 16, b: 48 },
          xaxis: { title: { text: "Spatial frequency (Mλ)" }, range: [0, figure.xMax] },
          yaxis: { title: { text: "V²" }, range: [0, 1.05] },
          showlegend: false,
          uirevision: "vis2",
          hovermode: "closest",
        })}
      />
      <SeriesLegend label="Model curves and baselines" items={figure.legend} />
    </Panel>
  );
}

/** Breaks a phase line at a jump of more than 150° between samples (a wrap across ±180° or a sign flip of the visibility): a gap instead of a vertical stroke. */
function brokenAtWraps(x: number[], y: number[]) {
  const xs: (number | null)[] = [];
  const ys: (number | null)[] = [];
  for (let i = 0; i < x.length; i++) {
    if (i > 0 && Math.abs(y[i] - y[i - 1]) > 150) {
      xs.push(null);
      ys.push(null);
    }
    xs.push(x[i]);
    ys.push(y[i]);
  }
  return { x: xs, y: ys };
}

/** Closure phase against hour angle, one trace per station triangle, at the band's middle channel. */
export function ClosurePanel({ coverage }: { coverage: CoverageResponse }) {
  const mid = Math.floor((coverage.wavelengthsM.length - 1) / 2);
  const lambdaUm = coverage.wavelengthsM[mid] * 1e6;
  const data = useMemo(
    () =>
      coverage.closurePhases.map((t, k) => ({
        type: "scatter",
        mode: "lines+markers",
        name: t.stations.join("–"),
        ...brokenAtWraps(
          t.points.map((p) => p.hourAngleH),
          t.points.map((p) => p.closurePhaseDeg[mid]),
        ),
        line: { color: SERIES_COLOURS[k % SERIES_COLOURS.length], width: 1.5 },
        marker: { size: 4, color: SERIES_COLOURS[k % SERIES_COLOURS.length] },
        showlegend: false,
        hovertemplate: `${t.stations.join("–")}<br>hour angle %{x:.2f} h<br>closure phase %{y:.1f}°<extra></extra>`,
      })),
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
          layout={plotLayout({
            margin: { l: 56, r: 16, t: 16, b: 48 },
            xaxis: { title: { text: "Hour angle (h)" } },
            yaxis: { title: { text: "Closure phase (°)" }, range: [-185, 185], dtick: 45 },
            showlegend: false,
            uirevision: "closure",
            hovermode: "closest",
          })}
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
