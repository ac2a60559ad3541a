/**
 * Plotly figures, drawn only in the browser. The server bundle imports every route module and Plotly
 * touches `self` at import time, so Plotly is loaded on first use in the browser; until a figure is
 * drawn its box is held by a placeholder of the same size.
 *
 * A figure is drawn with `Plotly.react` on the same element every time: the first time it builds the
 * plot, afterwards it updates it in place. It is redrawn only when its `data`, `layout` or `config`
 * object changes (callers memoize them), and every draw goes through the page's draw queue
 * (./draw-queue.ts): light figures first, heatmaps (`priority="heavy"`) last.
 *
 * Keyboard: a figure with a toolbar is one Tab stop. Focusing it shows the toolbar (otherwise shown on
 * hover); the arrow keys move between its buttons, Escape goes back to the figure. The toolbar sits in
 * a strip of its own above the plot, beside the figure's caption, so it never covers a title.
 */
import { type CSSProperties, type KeyboardEvent, type ReactNode, useEffect, useRef, useState } from "react";
import { cx } from "~/components/ui";
import { cancelDraw, type DrawPriority, scheduleDraw } from "./draw-queue";

interface PlotlyApi {
  react(el: HTMLElement, data: unknown, layout: unknown, config: unknown): Promise<unknown>;
  purge(el: HTMLElement): void;
  Plots: { resize(el: HTMLElement): Promise<unknown> | undefined };
}

type GraphDiv = HTMLDivElement & {
  on?: (event: string, handler: (e: unknown) => void) => void;
  removeAllListeners?: (event: string) => void;
  data?: unknown[];
  layout?: unknown;
};

let plotly: Promise<PlotlyApi> | null = null;

/** Plotly, loaded once, in the browser only. */
export function loadPlotly(): Promise<PlotlyApi> {
  plotly ??= import("plotly.js-dist-min").then((m) => ((m as { default?: unknown }).default ?? m) as PlotlyApi);
  return plotly;
}

/** The tools a figure's toolbar offers (Plotly's names): zoom, pan, back to the full view, save as PNG. */
export const TOOLBAR_BUTTONS = ["zoom2d", "pan2d", "resetScale2d", "toImage"] as const;

const DEFAULT_CONFIG = {
  displaylogo: false,
  displayModeBar: "hover",
  modeBarButtons: [[...TOOLBAR_BUTTONS]],
  toImageButtonOptions: { format: "png", scale: 2 },
  responsive: false,
};

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

/** The colour scale of every image (dirty beam, model, reconstruction): dark to ember to white, the peak lightest. */
export const HEAT: [number, string][] = [
  [0, "#0d1220"],
  [0.3, "#313a52"],
  [0.55, "#a03611"],
  [0.78, "#f27a3a"],
  [1, "#fff5ee"],
];

/** Axes of an image on the sky: offsets in mas, east to the left as on the sky, north up, square pixels. */
export function skyAxes(northTitle = "Offset (mas), north ↑"): Record<string, unknown> {
  return {
    xaxis: { title: { text: "Offset (mas), east ←" }, autorange: "reversed", zeroline: false, constrain: "domain" },
    yaxis: { title: { text: northTitle }, scaleanchor: "x", scaleratio: 1, zeroline: false, constrain: "domain" },
  };
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

/** A figure as Plotly hands it to the callbacks: its data and layout after the draw. */
export type DrawnFigure = { data: unknown[]; layout: unknown };
type FigureCallback = (figure: DrawnFigure, graphDiv: HTMLElement) => void;

export interface PlotProps {
  /** Accessible name of the figure (what it shows, with units). */
  label: string;
  data: readonly object[];
  layout?: object;
  config?: object;
  height?: number;
  style?: CSSProperties;
  /** A title above the plot, in the strip the toolbar shares (never under the toolbar). */
  caption?: ReactNode;
  /** "heavy" for figures that are slow to draw (heatmaps): drawn after the light ones. */
  priority?: DrawPriority;
  /** A click on a point (Plotly's event: the points under the pointer). */
  onClick?(event: { points?: { customdata?: unknown; text?: unknown }[] }): void;
  /** After the first draw. */
  onInitialized?: FigureCallback;
  /** After every later draw, zoom, pan or resize. */
  onUpdate?: FigureCallback;
}

/** Plotly's own controls inside a figure: kept out of the Tab order (the figure is the one stop). */
function untab(gd: HTMLElement) {
  for (const el of gd.querySelectorAll<HTMLElement>("button, a[href], input, select, [tabindex]")) {
    if (el.tabIndex >= 0) el.tabIndex = -1;
  }
}

/** Arrow keys, Home and End move between the toolbar's buttons; Escape goes back to the figure. */
function toolbarKeys(e: KeyboardEvent<HTMLElement>) {
  const figure = e.currentTarget;
  const buttons = [...figure.querySelectorAll<HTMLElement>(".modebar-btn")];
  if (buttons.length === 0) return;
  const at = buttons.indexOf(document.activeElement as HTMLElement);
  let next: number | null = null;
  if (e.key === "ArrowRight" || e.key === "ArrowDown") next = at < 0 ? 0 : (at + 1) % buttons.length;
  else if (e.key === "ArrowLeft" || e.key === "ArrowUp")
    next = at < 0 ? buttons.length - 1 : (at - 1 + buttons.length) % buttons.length;
  else if (e.key === "Home") next = 0;
  else if (e.key === "End") next = buttons.length - 1;
  else if (e.key === "Escape" && at >= 0) {
    e.preventDefault();
    figure.focus();
    return;
  }
  if (next === null) return;
  e.preventDefault();
  buttons[next].focus();
}

export function Plot({
  label,
  data,
  layout,
  config,
  height = 360,
  style,
  caption,
  priority = "light",
  onClick,
  onInitialized,
  onUpdate,
}: PlotProps) {
  const gdRef = useRef<GraphDiv>(null);
  const [drawn, setDrawn] = useState(false);
  const callbacks = useRef({ onClick, onInitialized, onUpdate });
  callbacks.current = { onClick, onInitialized, onUpdate };
  const toolbar = (config as { displayModeBar?: unknown } | undefined)?.displayModeBar !== false;
  const merged = useRef<{ config: object | undefined; value: object }>({ config: undefined, value: DEFAULT_CONFIG });
  if (merged.current.config !== config || merged.current.value === DEFAULT_CONFIG) {
    merged.current = { config, value: { ...DEFAULT_CONFIG, ...config } };
  }
  const fullConfig = merged.current.value;

  // Draw (first time) or update in place, through the page's draw queue.
  useEffect(() => {
    const gd = gdRef.current;
    if (!gd) return;
    const job = async () => {
      const api = await loadPlotly();
      if (!gd.isConnected) return;
      const first = !gd.data;
      await api.react(gd, data, layout ?? {}, fullConfig);
      untab(gd);
      const figure = { data: gd.data ?? [], layout: gd.layout };
      if (first) {
        gd.on?.("plotly_click", (e) => callbacks.current.onClick?.(e as never));
        gd.on?.("plotly_relayout", () => callbacks.current.onUpdate?.({ data: gd.data ?? [], layout: gd.layout }, gd));
        setDrawn(true);
        callbacks.current.onInitialized?.(figure, gd);
      } else callbacks.current.onUpdate?.(figure, gd);
    };
    scheduleDraw(gd, priority, job);
  }, [data, layout, fullConfig, priority]);

  // Follow the width of the page (a window resize, the side panel, a rotated phone).
  useEffect(() => {
    const gd = gdRef.current;
    if (!gd || typeof ResizeObserver === "undefined") return;
    let width = gd.clientWidth;
    const observer = new ResizeObserver(() => {
      if (!gd.data || gd.clientWidth === width) return;
      width = gd.clientWidth;
      const job = async () => {
        const api = await loadPlotly();
        if (!gd.isConnected || !gd.data) return;
        await api.Plots.resize(gd);
        untab(gd);
        callbacks.current.onUpdate?.({ data: gd.data ?? [], layout: gd.layout }, gd);
      };
      scheduleDraw(gd, priority, job);
    });
    observer.observe(gd);
    return () => observer.disconnect();
  }, [priority]);

  // Removed from the page: nothing left waiting, Plotly's listeners and caches released.
  useEffect(() => {
    const gd = gdRef.current;
    return () => {
      if (!gd) return;
      cancelDraw(gd);
      if (gd.data) void loadPlotly().then((api) => api.purge(gd));
    };
  }, []);

  const box: CSSProperties = { width: "100%", height, ...style };
  return (
    <figure
      aria-label={label}
      tabIndex={toolbar ? 0 : undefined}
      onKeyDown={toolbar ? toolbarKeys : undefined}
      className={cx(
        "relative m-0 min-w-0 rounded-lg",
        toolbar &&
          "focus-visible:outline-3 focus-visible:outline-offset-2 focus-visible:outline-ember-500 [&_.modebar-container]:!top-[-1.75rem]",
      )}
    >
      {toolbar || caption ? (
        <figcaption className="flex h-7 items-center pr-28 text-sm font-semibold text-night-900">
          {caption ? <span>{caption}</span> : null}
          {toolbar ? <span className="sr-only">Plot tools: arrow keys once the figure has focus.</span> : null}
        </figcaption>
      ) : null}
      <div ref={gdRef} style={box} />
      {!drawn ? (
        <div
          aria-hidden="true"
          style={{ height }}
          className="absolute inset-x-0 bottom-0 flex items-center justify-center rounded-lg bg-night-50 text-sm text-night-500"
        >
          Drawing the plot…
        </div>
      ) : null}
    </figure>
  );
}

/** A station map's points for a Plotly trace: east and north in metres, each named by its station. */
export function stationPoints(stations: readonly { name: string; eastM: number; northM: number }[]) {
  return { x: stations.map((s) => s.eastM), y: stations.map((s) => s.northM), text: stations.map((s) => s.name) };
}
