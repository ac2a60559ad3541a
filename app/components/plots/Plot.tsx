/**
 * Plotly, loaded only in the browser. The server bundle imports every route module, and Plotly
 * touches `self` at import time, so it must never be imported on the server: this component renders
 * a sized placeholder during server rendering and until the lazy chunk has arrived.
 */
import { type CSSProperties, lazy, Suspense, useEffect, useState } from "react";
import type { PlotParams } from "react-plotly.js/factory";

const LazyPlot = lazy(async () => {
  const [factory, plotly] = await Promise.all([import("react-plotly.js/factory"), import("plotly.js-dist-min")]);
  const createPlotlyComponent = (factory as unknown as { default: (p: unknown) => React.ComponentType<PlotParams> })
    .default;
  return { default: createPlotlyComponent((plotly as { default: unknown }).default ?? plotly) };
});

/** The house look of every plot: IBM Plex Sans, night-blue ink, light grid. */
export const baseLayout = {
  font: { family: '"IBM Plex Sans", ui-sans-serif, sans-serif', size: 12, color: "#222a3e" },
  paper_bgcolor: "#ffffff",
  plot_bgcolor: "#ffffff",
  margin: { l: 60, r: 16, t: 36, b: 52 },
  xaxis: { gridcolor: "#e6eaf2", zerolinecolor: "#a5b0c8", linecolor: "#a5b0c8" },
  yaxis: { gridcolor: "#e6eaf2", zerolinecolor: "#a5b0c8", linecolor: "#a5b0c8" },
  legend: { orientation: "h" as const, y: -0.2 },
  hoverlabel: { font: { family: '"IBM Plex Sans", sans-serif' } },
};

type LayoutObject = Record<string, unknown>;

/**
 * baseLayout merged with a plot's own layout: every axis it names (xaxis, xaxis2, yaxis2, …) gets the
 * house axis style under its own settings, and margin and legend are merged key by key.
 */
export function plotLayout(own: LayoutObject): LayoutObject {
  const out: LayoutObject = { ...baseLayout, ...own };
  for (const [key, value] of Object.entries(own)) {
    if (/^[xy]axis\d*$/.test(key) && value && typeof value === "object")
      out[key] = { ...baseLayout.xaxis, ...(value as LayoutObject) };
  }
  if (own.margin) out.margin = { ...baseLayout.margin, ...(own.margin as LayoutObject) };
  if (own.legend) out.legend = { ...baseLayout.legend, ...(own.legend as LayoutObject) };
  return out;
}

/** One colour per series, chosen for contrast on white and told apart by people with common colour-vision deficiencies. */
export const SERIES_COLOURS = [
  "#a03611",
  "#1d4f8c",
  "#21603a",
  "#7a4d00",
  "#6b2f8f",
  "#0f6f73",
  "#b4234a",
  "#4d5a14",
  "#c34512",
  "#3567b0",
  "#2f8a53",
  "#9c6a00",
  "#8a4bb3",
  "#178f94",
  "#d1456d",
  "#6b7a1f",
];

export function Plot({
  label,
  height = 360,
  style,
  ...params
}: PlotParams & {
  /** Accessible name of the figure (what it shows, with units). */
  label: string;
  height?: number;
}) {
  const [mounted, setMounted] = useState(false);
  useEffect(() => setMounted(true), []);
  const box: CSSProperties = { width: "100%", height, ...style };
  const placeholder = (
    <div
      style={box}
      className="flex items-center justify-center rounded-lg bg-night-50 text-sm text-night-500"
      aria-hidden="true"
    >
      Drawing the plot…
    </div>
  );
  return (
    <figure aria-label={label} className="m-0">
      {mounted ? (
        <Suspense fallback={placeholder}>
          <LazyPlot
            useResizeHandler
            style={box}
            {...params}
            config={{
              displaylogo: false,
              responsive: true,
              toImageButtonOptions: { format: "png", scale: 2 },
              ...(params.config as Record<string, unknown> | undefined),
            }}
          />
        </Suspense>
      ) : (
        placeholder
      )}
    </figure>
  );
}

/** A station map's points for a Plotly trace: east and north in metres, each named by its station. */
export function stationPoints(stations: readonly { name: string; eastM: number; northM: number }[]) {
  return { x: stations.map((s) => s.eastM), y: stations.map((s) => s.northM), text: stations.map((s) => s.name) };
}
