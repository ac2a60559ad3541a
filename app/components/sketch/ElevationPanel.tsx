import { useMemo } from "react";
import { Plot, plotLayout } from "~/components/plots/Plot";
import {
  elevationForAirmass,
  lstTicks,
  moonAltitudeCurve,
  observableWindows,
  type TwilightKind,
  targetAltitudeCurve,
  twilightBands,
} from "~/services/sketch/night";
import type { CoverageResponse, EphemerisResponse } from "./api";
import { type LegendItem, Panel, plotTime, SeriesLegend } from "./Panel";

const BAND_FILL: Record<TwilightKind, string> = {
  day: "#fbf1dc",
  civil: "#e9edf5",
  nautical: "#d6dcea",
  astronomical: "#c3cbe0",
};
const BAND_NAME: Record<TwilightKind, string> = {
  day: "Daylight",
  civil: "Civil twilight",
  nautical: "Nautical twilight",
  astronomical: "Astronomical twilight",
};
const WINDOW_FILL = "rgba(33, 96, 58, 0.16)";
const AIRMASS_TICKS = [1.0, 1.1, 1.2, 1.5, 2, 3, 5];

export function ElevationPanel({
  coverage,
  ephemeris,
  site,
  raDeg,
  decDeg,
  stepMin,
  minElevationDeg,
}: {
  coverage: CoverageResponse;
  ephemeris: EphemerisResponse | undefined;
  site: { latitudeDeg: number; longitudeDeg: number };
  raDeg: number;
  decDeg: number;
  /** Night sampling step; null when the sketch samples a list of hour angles. */
  stepMin: number | null;
  minElevationDeg: number;
}) {
  const airmassAxis = {
    tickvals: AIRMASS_TICKS.map(elevationForAirmass),
    ticktext: AIRMASS_TICKS.map((x) => x.toFixed(1)),
  };

  const figure = useMemo(() => {
    if (stepMin === null || !ephemeris) return null;
    const t = (iso: string | null) => (iso ? Date.parse(iso) : null);
    const sunset = t(ephemeris.sunsetUtc);
    const sunrise = t(ephemeris.sunriseUtc);
    const midnight = Date.parse(ephemeris.localMidnightUtc);
    const start = (sunset ?? midnight - 7 * 3.6e6) - 45 * 60_000;
    const end = (sunrise ?? midnight + 7 * 3.6e6) + 45 * 60_000;
    const curve = targetAltitudeCurve({
      latDeg: site.latitudeDeg,
      lonDeg: site.longitudeDeg,
      raDeg,
      decDeg,
      startMs: start,
      endMs: end,
      stepMin: 5,
    });
    const moon = moonAltitudeCurve({
      latDeg: site.latitudeDeg,
      lonDeg: site.longitudeDeg,
      startMs: start,
      endMs: end,
      stepMin: 10,
    });
    const bands = twilightBands(ephemeris, start, end);
    const windows = observableWindows(coverage.samples, stepMin);
    const ticks = lstTicks(start, end, site.longitudeDeg, end - start > 10 * 3.6e6 ? 2 : 1);

    const shapes: Record<string, unknown>[] = [
      ...bands.map((b) => ({
        type: "rect",
        xref: "x",
        yref: "paper",
        x0: plotTime(b.startMs),
        x1: plotTime(b.endMs),
        y0: 0,
        y1: 1,
        fillcolor: BAND_FILL[b.kind],
        line: { width: 0 },
        layer: "below",
      })),
      ...windows.map((w) => ({
        type: "rect",
        xref: "x",
        yref: "y",
        x0: plotTime(w.startMs),
        x1: plotTime(w.endMs),
        y0: minElevationDeg,
        y1: 90,
        fillcolor: WINDOW_FILL,
        line: { width: 1, color: "rgba(33, 96, 58, 0.55)" },
        layer: "below",
      })),
      {
        type: "line",
        xref: "paper",
        yref: "y",
        x0: 0,
        x1: 1,
        y0: minElevationDeg,
        y1: minElevationDeg,
        line: { color: "#a3261c", width: 1.5, dash: "dash" },
      },
    ];
    const observable = coverage.samples.filter((s) => s.observable && s.utc);
    const blocked = coverage.samples.filter((s) => !s.observable && s.utc && s.elevationDeg > 0);
    const kinds = [...new Set(bands.map((b) => b.kind))];
    const data: Record<string, unknown>[] = [
      {
        type: "scatter",
        mode: "lines",
        name: "Target elevation",
        x: curve.timesMs.map(plotTime),
        y: curve.elevationDeg,
        customdata: curve.airmass.map((a) => (a === null ? "—" : a.toFixed(2))),
        line: { color: "#1d4f8c", width: 2.5 },
        hovertemplate: "%{x|%H:%M} UT<br>elevation %{y:.1f}°<br>air mass %{customdata}<extra></extra>",
      },
      {
        type: "scatter",
        mode: "markers",
        name: "Observable sample",
        x: observable.map((s) => plotTime(Date.parse(s.utc!))),
        y: observable.map((s) => s.elevationDeg),
        customdata: observable.map((s) => [s.hourAngleH, s.lstH ?? null, s.airmass ?? null]),
        marker: { size: 6, color: "#21603a" },
        hovertemplate:
          "%{x|%H:%M} UT, LST %{customdata[1]:.2f} h<br>hour angle %{customdata[0]:.2f} h<br>elevation %{y:.1f}°, air mass %{customdata[2]:.2f}<extra>observable</extra>",
      },
      {
        type: "scatter",
        mode: "markers",
        name: "Not observable",
        x: blocked.map((s) => plotTime(Date.parse(s.utc!))),
        y: blocked.map((s) => s.elevationDeg),
        text: blocked.map((s) => s.reason ?? ""),
        marker: { size: 6, color: "#ffffff", line: { color: "#a3261c", width: 1.5 } },
        hovertemplate: "%{x|%H:%M} UT, elevation %{y:.1f}°<br>%{text}<extra>not observable</extra>",
      },
      {
        type: "scatter",
        mode: "lines",
        name: `Moon (${Math.round(ephemeris.moonIlluminatedFraction * 100)} % lit)`,
        x: moon.timesMs.map(plotTime),
        y: moon.altitudeDeg,
        line: { color: "#56637f", width: 1.5, dash: "dot" },
        hovertemplate: "%{x|%H:%M} UT<br>Moon altitude %{y:.0f}°<extra></extra>",
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
        title: { text: "UT (hours)" },
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
      yaxis: { title: { text: "Elevation (°)" }, range: [0, 90], dtick: 15 },
      yaxis2: {
        overlaying: "y",
        side: "right",
        matches: "y",
        tickmode: "array",
        ...airmassAxis,
        title: { text: "Air mass" },
        showgrid: false,
      },
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
          font: { size: 11, color: "#a3261c" },
        },
      ],
      showlegend: false,
      uirevision: "elevation",
      hovermode: "closest",
    });
    const legend: LegendItem[] = [
      { name: "Target elevation", colour: "#1d4f8c", kind: "line" },
      { name: "Observable sample", colour: "#21603a" },
      { name: "Not observable", colour: "#a3261c", kind: "ring" },
      {
        name: `Moon (${Math.round(ephemeris.moonIlluminatedFraction * 100)} % lit)`,
        colour: "#56637f",
        kind: "line",
        dash: "dot",
      },
      { name: "Minimum elevation", colour: "#a3261c", kind: "line", dash: "dash" },
      ...(windows.length > 0 ? [{ name: "Observable window", colour: WINDOW_FILL, kind: "square" as const }] : []),
      ...kinds.map((k) => ({ name: BAND_NAME[k], colour: BAND_FILL[k], kind: "square" as const })),
    ];
    return { data, layout, legend };
  }, [coverage, ephemeris, site, raDeg, decDeg, stepMin, minElevationDeg]);

  const byHourAngle = useMemo(() => {
    if (stepMin !== null) return null;
    const obs = coverage.samples.filter((s) => s.observable);
    const off = coverage.samples.filter((s) => !s.observable);
    return {
      data: [
        {
          type: "scatter",
          mode: "lines",
          name: "Target elevation",
          x: coverage.samples.map((s) => s.hourAngleH),
          y: coverage.samples.map((s) => s.elevationDeg),
          customdata: coverage.samples.map((s) => (s.airmass === null ? "—" : s.airmass.toFixed(2))),
          line: { color: "#1d4f8c", width: 2.5 },
          hovertemplate: "hour angle %{x:.2f} h<br>elevation %{y:.1f}°<br>air mass %{customdata}<extra></extra>",
        },
        {
          type: "scatter",
          mode: "markers",
          name: "Observable sample",
          x: obs.map((s) => s.hourAngleH),
          y: obs.map((s) => s.elevationDeg),
          marker: { size: 6, color: "#21603a" },
          hoverinfo: "skip",
        },
        {
          type: "scatter",
          mode: "markers",
          name: "Not observable",
          x: off.map((s) => s.hourAngleH),
          y: off.map((s) => s.elevationDeg),
          text: off.map((s) => s.reason ?? ""),
          marker: { size: 6, color: "#ffffff", line: { color: "#a3261c", width: 1.5 } },
          hovertemplate: "hour angle %{x:.2f} h<br>%{text}<extra></extra>",
        },
        { type: "scatter", x: [0], y: [null], yaxis: "y2", showlegend: false, hoverinfo: "skip" },
      ],
      layout: plotLayout({
        margin: { l: 56, r: 56, t: 16, b: 48 },
        xaxis: { title: { text: "Hour angle (h)" } },
        yaxis: { title: { text: "Elevation (°)" }, range: [0, 90], dtick: 15 },
        yaxis2: {
          overlaying: "y",
          side: "right",
          matches: "y",
          tickmode: "array",
          ...airmassAxis,
          title: { text: "Air mass" },
          showgrid: false,
        },
        shapes: [
          {
            type: "line",
            xref: "paper",
            yref: "y",
            x0: 0,
            x1: 1,
            y0: minElevationDeg,
            y1: minElevationDeg,
            line: { color: "#a3261c", width: 1.5, dash: "dash" },
          },
        ],
        showlegend: false,
        uirevision: "elevation-ha",
      }),
    };
  }, [coverage, stepMin, minElevationDeg]);

  return (
    <Panel
      id="elevation"
      title="Elevation through the night"
      note={
        stepMin === null
          ? "Sampled by hour angle: no clock time, so no twilight or sidereal time. Sample a night to see them."
          : "Curves are geometric (no refraction). The Moon's altitude is geocentric. Shaded: daylight and the civil, nautical and astronomical twilights; green: the observable window above the minimum elevation."
      }
    >
      {figure ? (
        <>
          <Plot
            label="Target elevation and air mass against UT and local sidereal time, with twilight and the observable window"
            height={400}
            data={figure.data}
            layout={figure.layout}
          />
          <SeriesLegend label="Elevation plot legend" items={figure.legend} />
        </>
      ) : byHourAngle ? (
        <>
          <Plot
            label="Target elevation and air mass against hour angle"
            height={380}
            data={byHourAngle.data}
            layout={byHourAngle.layout}
          />
          <SeriesLegend
            label="Elevation plot legend"
            items={[
              { name: "Target elevation", colour: "#1d4f8c", kind: "line" },
              { name: "Observable sample", colour: "#21603a" },
              { name: "Not observable", colour: "#a3261c", kind: "ring" },
              { name: "Minimum elevation", colour: "#a3261c", kind: "line", dash: "dash" },
            ]}
          />
        </>
      ) : (
        <p className="py-16 text-center text-sm text-night-600">Waiting for the night's ephemeris…</p>
      )}
    </Panel>
  );
}
