/**
 * The figures of the elevation panel as Plotly data and layout: the whole night against UTC and local
 * sidereal time (twilight bands, observable windows, the Moon), or the samples against hour angle
 * when the sketch has no clock time. Pure: no React.
 */
import type { CoverageResponse, EphemerisResponse } from "~/engine";
import {
  elevationForAirmass,
  lstTicks,
  moonAltitudeCurve,
  observableWindows,
  type TwilightKind,
  targetAltitudeCurve,
  twilightBands,
} from "~/services/sketch/night";
import { BLOCK_KINDS, BLOCK_LABELS, type BlockKind, primaryBlock, reasonLines } from "~/services/sketch/reasons";
import { type LegendItem, plotTime } from "./Panel";
import { plotLayout } from "./Plot";

/** Each kind of twilight band as the legend names it; its colour is the band's shading. */
const BANDS: Record<TwilightKind, LegendItem> = {
  day: { name: "Daylight", colour: "#fbf1dc", kind: "square" },
  civil: { name: "Civil twilight", colour: "#e9edf5", kind: "square" },
  nautical: { name: "Nautical twilight", colour: "#d6dcea", kind: "square" },
  astronomical: { name: "Astronomical twilight", colour: "#c3cbe0", kind: "square" },
};
const WINDOW_FILL = "rgba(33, 96, 58, 0.16)";
const AIRMASS_TICKS = [1.0, 1.1, 1.2, 1.5, 2, 3, 5];
const LIMIT_COLOUR = "#a3261c";
const TARGET_COLOUR = "#1d4f8c";
const OBSERVABLE_COLOUR = "#21603a";
const AIRMASS_TICK_ELEVATIONS = AIRMASS_TICKS.map(elevationForAirmass);

// Plotly writes into the objects it is given (ranges, autorange), so each figure gets fresh ones.
const targetLine = () => ({ color: TARGET_COLOUR, width: 2.5 });
const observableMarker = () => ({ size: 6, color: OBSERVABLE_COLOUR });

/** How a sample that is not observable is marked, by the rule it fails (legend kind alike). */
const BLOCK_STYLE: Record<BlockKind, { symbol: string; colour: string; legend: LegendItem["kind"] }> = {
  elevation: { symbol: "circle-open", colour: LIMIT_COLOUR, legend: "ring" },
  sun: { symbol: "diamond-open", colour: "#8a5a00", legend: "diamond" },
  delayLine: { symbol: "x-thin-open", colour: "#6b2f8f", legend: "cross" },
  other: { symbol: "square-open", colour: "#56637f", legend: "open-square" },
};
const blockedMarker = (kind: BlockKind) => ({
  size: kind === "delayLine" ? 8 : 7,
  symbol: BLOCK_STYLE[kind].symbol,
  color: BLOCK_STYLE[kind].colour,
  line: { color: BLOCK_STYLE[kind].colour, width: 1.6 },
});
const elevationAxis = () => ({ title: { text: "Elevation (°)" }, range: [0, 90], dtick: 15 });

/** The air-mass scale on the right, at the elevations where the air mass takes round values. */
function airmassAxis() {
  return {
    overlaying: "y",
    side: "right",
    matches: "y",
    tickmode: "array",
    tickvals: [...AIRMASS_TICK_ELEVATIONS],
    ticktext: AIRMASS_TICKS.map((x) => x.toFixed(1)),
    title: { text: "Air mass" },
    showgrid: false,
  };
}

/** The dashed line across the plot at the minimum elevation. */
function minimumLine(minElevationDeg: number) {
  return {
    type: "line",
    xref: "paper",
    yref: "y",
    x0: 0,
    x1: 1,
    y0: minElevationDeg,
    y1: minElevationDeg,
    line: { color: LIMIT_COLOUR, width: 1.5, dash: "dash" },
  };
}

const SAMPLE_LEGEND: LegendItem[] = [
  { name: "Target elevation", colour: TARGET_COLOUR, kind: "line" },
  { name: "Observable sample", colour: OBSERVABLE_COLOUR },
];
const MINIMUM_LEGEND: LegendItem = { name: "Minimum elevation", colour: LIMIT_COLOUR, kind: "line", dash: "dash" };

/** The legend entries of the rules that some drawn sample fails. */
function blockLegend(groups: BlockedGroup[]): LegendItem[] {
  return groups.map((g) => ({
    name: `Not observable: ${BLOCK_LABELS[g.kind].toLowerCase()}`,
    colour: BLOCK_STYLE[g.kind].colour,
    kind: BLOCK_STYLE[g.kind].legend,
  }));
}

export interface Figure {
  data: Record<string, unknown>[];
  layout: Record<string, unknown>;
}

type Sample = CoverageResponse["samples"][number];

/** The markers of some samples at their elevation: `x` places each sample on the time axis. */
function sampleMarkers(
  name: string,
  samples: readonly Sample[],
  x: (s: Sample) => number | string,
  marker: Record<string, unknown>,
  hover: Record<string, unknown>,
) {
  return {
    type: "scatter",
    mode: "markers",
    name,
    x: samples.map(x),
    y: samples.map((s) => s.elevationDeg),
    marker,
    ...hover,
  };
}

type BlockedGroup = { kind: BlockKind; samples: Sample[] };

/** The samples that are not observable, grouped by the rule each is marked by (rules in BLOCK_KINDS order). */
function blockedGroups(samples: readonly Sample[]): BlockedGroup[] {
  const by = new Map<BlockKind, Sample[]>();
  for (const s of samples) {
    const kind = primaryBlock(s.reason) ?? "other";
    by.set(kind, [...(by.get(kind) ?? []), s]);
  }
  return BLOCK_KINDS.filter((k) => by.has(k)).map((kind) => ({ kind, samples: by.get(kind)! }));
}

/** One marker trace per rule, the sample's whole reason in its hover. */
function blockedTraces(groups: BlockedGroup[], x: (s: Sample) => number | string, where: string) {
  return groups.map((g) =>
    sampleMarkers(BLOCK_LABELS[g.kind], g.samples, x, blockedMarker(g.kind), {
      text: g.samples.map((s) => reasonLines(s.reason)),
      hovertemplate: `${where}<br>%{text}<extra>not observable</extra>`,
    }),
  );
}

/** A filled rectangle behind the curves, from `startMs` to `endMs`. */
function band(startMs: number, endMs: number, yref: "paper" | "y", y0: number, y1: number, fill: string) {
  return { type: "rect", xref: "x", yref, x0: plotTime(startMs), x1: plotTime(endMs), y0, y1, fillcolor: fill };
}

/**
 * The night of the ephemeris, from 45 minutes before sunset to 45 minutes after sunrise (±7 h around
 * local midnight where the Sun does not set or rise), sampled every `stepMin` minutes by the API.
 */
export function nightFigure(opts: {
  coverage: CoverageResponse;
  ephemeris: EphemerisResponse;
  site: { latitudeDeg: number; longitudeDeg: number };
  raDeg: number;
  decDeg: number;
  stepMin: number;
  minElevationDeg: number;
}): Figure & { legend: LegendItem[] } {
  const { coverage, ephemeris, site, minElevationDeg } = opts;
  const t = (iso: string | null) => (iso ? Date.parse(iso) : null);
  const sunset = t(ephemeris.sunsetUtc);
  const sunrise = t(ephemeris.sunriseUtc);
  const midnight = Date.parse(ephemeris.localMidnightUtc);
  const start = (sunset ?? midnight - 7 * 3.6e6) - 45 * 60_000;
  const end = (sunrise ?? midnight + 7 * 3.6e6) + 45 * 60_000;
  const where = { latDeg: site.latitudeDeg, lonDeg: site.longitudeDeg, startMs: start, endMs: end };
  const curve = targetAltitudeCurve({ ...where, raDeg: opts.raDeg, decDeg: opts.decDeg, stepMin: 5 });
  const moon = moonAltitudeCurve({ ...where, stepMin: 10 });
  const bands = twilightBands(ephemeris, start, end);
  const windows = observableWindows(coverage.samples, opts.stepMin);
  const ticks = lstTicks(start, end, site.longitudeDeg, end - start > 10 * 3.6e6 ? 2 : 1);
  const moonName = `Moon (${Math.round(ephemeris.moonIlluminatedFraction * 100)} % lit)`;

  const shapes: Record<string, unknown>[] = [
    ...bands.map((b) => ({
      ...band(b.startMs, b.endMs, "paper", 0, 1, BANDS[b.kind].colour),
      line: { width: 0 },
      layer: "below",
    })),
    ...windows.map((w) => ({
      ...band(w.startMs, w.endMs, "y", minElevationDeg, 90, WINDOW_FILL),
      line: { width: 1, color: "rgba(33, 96, 58, 0.55)" },
      layer: "below",
    })),
    minimumLine(minElevationDeg),
  ];
  const observable = coverage.samples.filter((s) => s.observable && s.utc);
  const blocked = blockedGroups(coverage.samples.filter((s) => !s.observable && s.utc && s.elevationDeg > 0));
  const kinds = [...new Set(bands.map((b) => b.kind))];
  const atUtc = (s: Sample) => plotTime(Date.parse(s.utc!));
  const data: Record<string, unknown>[] = [
    {
      type: "scatter",
      mode: "lines",
      name: "Target elevation",
      x: curve.timesMs.map(plotTime),
      y: curve.elevationDeg,
      customdata: curve.airmass.map((a) => (a === null ? "—" : a.toFixed(2))),
      line: targetLine(),
      hovertemplate: "%{x|%H:%M} UTC<br>elevation %{y:.1f}°<br>air mass %{customdata}<extra></extra>",
    },
    sampleMarkers("Observable sample", observable, atUtc, observableMarker(), {
      customdata: observable.map((s) => [s.hourAngleH, s.lstH ?? null, s.airmass ?? null]),
      hovertemplate:
        "%{x|%H:%M} UTC, LST %{customdata[1]:.2f} h<br>hour angle %{customdata[0]:.2f} h<br>elevation %{y:.1f}°, air mass %{customdata[2]:.2f}<extra>observable</extra>",
    }),
    ...blockedTraces(blocked, atUtc, "%{x|%H:%M} UTC, elevation %{y:.1f}°"),
    {
      type: "scatter",
      mode: "lines",
      name: moonName,
      x: moon.timesMs.map(plotTime),
      y: moon.altitudeDeg,
      line: { color: "#56637f", width: 1.5, dash: "dot" },
      hovertemplate: "%{x|%H:%M} UTC<br>Moon altitude %{y:.0f}°<extra></extra>",
    },
    // Carriers of the LST and air-mass axes (no visible data).
    {
      type: "scatter",
      x: [plotTime(start), plotTime(end)],
      y: [null, null],
      xaxis: "x2",
      showlegend: false,
      hoverinfo: "skip",
    },
    { type: "scatter", x: [plotTime(start)], y: [null], yaxis: "y2", showlegend: false, hoverinfo: "skip" },
  ];
  const layout = plotLayout({
    margin: { l: 56, r: 56, t: 48, b: 48 },
    shapes,
    xaxis: {
      type: "date",
      title: { text: "Time (UTC)" },
      range: [plotTime(start), plotTime(end)],
      tickformat: "%H:%M",
      showgrid: false,
    },
    xaxis2: {
      type: "date",
      overlaying: "x",
      side: "top",
      matches: "x",
      tickmode: "array",
      tickvals: ticks.timesMs.map(plotTime),
      ticktext: ticks.labels,
      title: { text: "Local sidereal time", standoff: 2 },
      showgrid: false,
    },
    yaxis: elevationAxis(),
    yaxis2: airmassAxis(),
    annotations: [
      {
        xref: "paper",
        yref: "y",
        x: 0.01,
        y: minElevationDeg,
        yanchor: "bottom",
        xanchor: "left",
        text: `minimum ${minElevationDeg}°`,
        showarrow: false,
        font: { size: 11, color: LIMIT_COLOUR },
      },
    ],
    showlegend: false,
    uirevision: "elevation",
    hovermode: "closest",
  });
  const legend: LegendItem[] = [
    ...SAMPLE_LEGEND,
    ...blockLegend(blocked),
    { name: moonName, colour: "#56637f", kind: "line", dash: "dot" },
    MINIMUM_LEGEND,
    ...(windows.length > 0 ? [{ name: "Observable window", colour: WINDOW_FILL, kind: "square" as const }] : []),
    ...kinds.map((k) => BANDS[k]),
  ];
  return { data, layout, legend };
}

const atHourAngle = (s: Sample) => s.hourAngleH;

/** The samples of an hour-angle sketch against hour angle (no clock time, so no twilight or Moon). */
export function hourAngleFigure(
  coverage: CoverageResponse,
  minElevationDeg: number,
): Figure & { legend: LegendItem[] } {
  const obs = coverage.samples.filter((s) => s.observable);
  const off = blockedGroups(coverage.samples.filter((s) => !s.observable));
  return {
    legend: [...SAMPLE_LEGEND, ...blockLegend(off), MINIMUM_LEGEND],
    data: [
      {
        type: "scatter",
        mode: "lines",
        name: "Target elevation",
        x: coverage.samples.map((s) => s.hourAngleH),
        y: coverage.samples.map((s) => s.elevationDeg),
        customdata: coverage.samples.map((s) => (s.airmass === null ? "—" : s.airmass.toFixed(2))),
        line: targetLine(),
        hovertemplate: "hour angle %{x:.2f} h<br>elevation %{y:.1f}°<br>air mass %{customdata}<extra></extra>",
      },
      sampleMarkers("Observable sample", obs, atHourAngle, observableMarker(), { hoverinfo: "skip" }),
      ...blockedTraces(off, atHourAngle, "hour angle %{x:.2f} h, elevation %{y:.1f}°"),
      { type: "scatter", x: [0], y: [null], yaxis: "y2", showlegend: false, hoverinfo: "skip" },
    ],
    layout: plotLayout({
      margin: { l: 56, r: 56, t: 16, b: 48 },
      xaxis: { title: { text: "Hour angle (h)" } },
      yaxis: elevationAxis(),
      yaxis2: airmassAxis(),
      shapes: [minimumLine(minElevationDeg)],
      showlegend: false,
      uirevision: "elevation-ha",
    }),
  };
}
