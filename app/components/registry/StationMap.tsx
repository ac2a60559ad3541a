/**
 * The site plan: stations by east and north (metres), north up and east to the right, one metre
 * the same length on both axes. A configuration can be drawn on top with its stations and all its
 * baselines. Labels of crowded stations appear as the view is zoomed in.
 */
import { useMemo, useState } from "react";
import { baseLayout, Plot, SERIES_COLOURS } from "~/components/plots/Plot";
import { cx } from "~/components/ui";

export type MapStation = { name: string; eastM: number; northM: number };
export type MapConfiguration = { name: string; stationNames: string[] };

const STATION_GREY = "#56637f";
const FOCUS_COLOUR = "#a03611";
const PREVIEW_COLOUR = "#0f6f73";
/** A station's name is drawn when the nearest other station is at least this far away on screen, pixels. */
const LABEL_SPACING_PX = 24;
/** Until the plot has been measured, a guess of its width, pixels. */
const GUESSED_WIDTH_PX = 500;

function nearestDistances(stations: MapStation[]): number[] {
  return stations.map((s, i) => {
    let best = Infinity;
    stations.forEach((o, j) => {
      if (i !== j) best = Math.min(best, Math.hypot(s.eastM - o.eastM, s.northM - o.northM));
    });
    return best;
  });
}

function extent(stations: MapStation[]): number {
  if (stations.length === 0) return 100;
  const es = stations.map((s) => s.eastM);
  const ns = stations.map((s) => s.northM);
  return Math.max(Math.max(...es) - Math.min(...es), Math.max(...ns) - Math.min(...ns), 20);
}

type Baseline = { a: string; b: string; lengthM: number };

/** Ground baselines (east and north only) of a station list, shortest first. */
function baselines(members: MapStation[]): Baseline[] {
  const out: Baseline[] = [];
  for (let i = 0; i < members.length; i++) {
    for (let j = i + 1; j < members.length; j++) {
      out.push({
        a: members[i].name,
        b: members[j].name,
        lengthM: Math.hypot(members[j].eastM - members[i].eastM, members[j].northM - members[i].northM),
      });
    }
  }
  return out.sort((x, y) => x.lengthM - y.lengthM);
}

const metres = (x: number) => `${x < 100 ? x.toFixed(1) : x.toFixed(0)} m`;

/** Figures of what the map shows: a configuration's baselines, or the extent of the whole site. */
function Figures({
  stations,
  members,
  name,
}: {
  stations: MapStation[];
  members: MapStation[] | null;
  name: string | null;
}) {
  const rows: [string, string][] = [];
  if (members && name) {
    const list = baselines(members);
    rows.push(["Stations", String(members.length)], ["Baselines", String(list.length)]);
    if (list.length > 0) {
      const first = list[0];
      const last = list[list.length - 1];
      rows.push(
        ["Shortest", `${metres(first.lengthM)} (${first.a}–${first.b})`],
        ["Longest", `${metres(last.lengthM)} (${last.a}–${last.b})`],
      );
    }
  } else if (stations.length > 0) {
    const es = stations.map((s) => s.eastM);
    const ns = stations.map((s) => s.northM);
    const list = baselines(stations);
    rows.push(
      ["Stations", String(stations.length)],
      ["East–west extent", metres(Math.max(...es) - Math.min(...es))],
      ["North–south extent", metres(Math.max(...ns) - Math.min(...ns))],
    );
    if (list.length > 0) {
      const last = list[list.length - 1];
      rows.push(
        ["Longest baseline", `${metres(last.lengthM)} (${last.a}–${last.b})`],
        ["Shortest", `${metres(list[0].lengthM)}`],
      );
    }
  }
  return (
    <dl className="grid gap-2 text-sm" aria-label={name ? `Figures of ${name}` : "Figures of the site"}>
      {rows.map(([k, v]) => (
        <div key={k} className="flex justify-between gap-3 border-b border-night-100 pb-1">
          <dt className="text-night-600">{k}</dt>
          <dd className="num text-right font-medium">{v}</dd>
        </div>
      ))}
    </dl>
  );
}

/** Every baseline of a station list as one line trace: segments separated by gaps. */
function baselineSegments(members: MapStation[]) {
  const x: (number | null)[] = [];
  const y: (number | null)[] = [];
  for (let i = 0; i < members.length; i++) {
    for (let j = i + 1; j < members.length; j++) {
      x.push(members[i].eastM, members[j].eastM, null);
      y.push(members[i].northM, members[j].northM, null);
    }
  }
  return { x, y };
}

export function StationMap({
  stations,
  configurations = [],
  initialConfiguration = null,
  draft = null,
  focus = null,
  preview = null,
  onPickStation,
  height = 480,
  layout: arrangement = "stacked",
  frame = null,
  label = "Station map: stations by east and north position in metres",
}: {
  stations: MapStation[];
  /** Configurations the viewer can choose to draw. */
  configurations?: MapConfiguration[];
  initialConfiguration?: string | null;
  /** A station list being edited, drawn like a chosen configuration (no chooser then). */
  draft?: MapConfiguration | null;
  /** A station to ring (its own page). */
  focus?: string | null;
  /** A position being typed (station form), drawn as a diamond. */
  preview?: { name: string; eastM: number; northM: number } | null;
  /** Called with a station's name when it is clicked on the map. */
  onPickStation?: (name: string) => void;
  height?: number;
  /** "side": the configuration chooser and the figures beside the map; "stacked": the chooser above it. */
  layout?: "side" | "stacked";
  /** Points the first view frames (with a margin); the whole site when absent. Double-click shows the whole site. */
  frame?: { eastM: number; northM: number }[] | null;
  label?: string;
}) {
  const [chosen, setChosen] = useState<string | null>(initialConfiguration);
  const [metresPerPixel, setMetresPerPixel] = useState<number | null>(null);
  const shown = draft ?? configurations.find((c) => c.name === chosen) ?? null;
  const shownIndex = draft
    ? 0
    : Math.max(
        0,
        configurations.findIndex((c) => c.name === chosen),
      );
  const colour = SERIES_COLOURS[shownIndex % SERIES_COLOURS.length];

  const nearest = useMemo(() => nearestDistances(stations), [stations]);
  const scale = metresPerPixel ?? extent(stations) / GUESSED_WIDTH_PX;

  const data = useMemo(() => {
    const byName = new Map(stations.map((s) => [s.name, s]));
    const members = (shown?.stationNames ?? []).map((n) => byName.get(n)).filter((s): s is MapStation => !!s);
    const memberNames = new Set(members.map((m) => m.name));
    // Names go in a trace of their own: only the stations with room for a label, redrawn as the view changes.
    const labelled = stations.filter(
      (s, i) => !memberNames.has(s.name) && s.name !== focus && nearest[i] / scale >= LABEL_SPACING_PX,
    );
    const traces: Record<string, unknown>[] = [
      {
        type: "scatter",
        mode: "markers",
        name: shown ? "Other stations" : "Stations",
        x: stations.map((s) => s.eastM),
        y: stations.map((s) => s.northM),
        text: stations.map((s) => s.name),
        marker: { size: 8, color: shown ? "#a5b0c8" : STATION_GREY, line: { width: 1, color: "#ffffff" } },
        hovertemplate: "<b>%{text}</b><br>east %{x:.2f} m<br>north %{y:.2f} m<extra></extra>",
      },
      {
        type: "scatter",
        mode: "text",
        name: "Station names",
        showlegend: false,
        hoverinfo: "skip",
        x: labelled.map((s) => s.eastM),
        y: labelled.map((s) => s.northM),
        text: labelled.map((s) => s.name),
        textposition: "top center",
        textfont: { size: 11, color: "#414c66" },
      },
    ];
    if (shown && members.length > 0) {
      const seg = baselineSegments(members);
      const n = members.length;
      traces.push({
        type: "scatter",
        mode: "lines",
        name: `${shown.name}: ${(n * (n - 1)) / 2} baselines`,
        x: seg.x,
        y: seg.y,
        line: { color: colour, width: 2 },
        opacity: 0.55,
        hoverinfo: "skip",
      });
      traces.push({
        type: "scatter",
        mode: "markers+text",
        name: `${shown.name}: ${n} stations`,
        x: members.map((m) => m.eastM),
        y: members.map((m) => m.northM),
        text: members.map((m) => m.name),
        textposition: "top center",
        textfont: { size: 13, color: colour },
        marker: { size: 14, color: colour, line: { width: 2, color: "#ffffff" } },
        hovertemplate: `<b>%{text}</b><br>east %{x:.2f} m<br>north %{y:.2f} m<extra>${shown.name}</extra>`,
      });
    }
    const focused = focus ? byName.get(focus) : undefined;
    if (focused) {
      traces.push({
        type: "scatter",
        mode: "markers+text",
        name: `Station ${focused.name}`,
        x: [focused.eastM],
        y: [focused.northM],
        text: [focused.name],
        textposition: "bottom center",
        textfont: { size: 14, color: FOCUS_COLOUR },
        marker: { size: 22, symbol: "circle-open", color: FOCUS_COLOUR, line: { width: 3 } },
        hovertemplate: "<b>%{text}</b><br>east %{x:.2f} m<br>north %{y:.2f} m<extra></extra>",
      });
    }
    if (preview && Number.isFinite(preview.eastM) && Number.isFinite(preview.northM)) {
      traces.push({
        type: "scatter",
        mode: "markers+text",
        name: preview.name ? `${preview.name} (as typed)` : "Position as typed",
        x: [preview.eastM],
        y: [preview.northM],
        text: [preview.name || "new"],
        textposition: "bottom center",
        textfont: { size: 13, color: PREVIEW_COLOUR },
        marker: { size: 14, symbol: "diamond", color: PREVIEW_COLOUR, line: { width: 2, color: "#ffffff" } },
        hovertemplate: "<b>%{text}</b><br>east %{x:.2f} m<br>north %{y:.2f} m<extra>as typed</extra>",
      });
    }
    return traces;
  }, [stations, shown, focus, preview, nearest, scale, colour]);

  const frameKey = frame ? JSON.stringify(frame) : "";
  const ranges = useMemo(() => {
    if (!frameKey) return null;
    const points = JSON.parse(frameKey) as { eastM: number; northM: number }[];
    if (points.length === 0) return null;
    const es = points.map((p) => p.eastM);
    const ns = points.map((p) => p.northM);
    const cx = (Math.max(...es) + Math.min(...es)) / 2;
    const cy = (Math.max(...ns) + Math.min(...ns)) / 2;
    const half = Math.max(Math.max(...es) - Math.min(...es), Math.max(...ns) - Math.min(...ns), 60) * 0.65;
    return { x: [cx - half, cx + half], y: [cy - half, cy + half] };
  }, [frameKey]);

  const layout = useMemo(
    () => ({
      ...baseLayout,
      autosize: true,
      height,
      // The legend sits above the plot, clear of the east axis title at every height.
      margin: { l: 64, r: 16, t: 40, b: 52 },
      showlegend: true,
      legend: { ...baseLayout.legend, x: 0, y: 1.01, yanchor: "bottom" },
      // Keep the viewer's zoom when the drawn configuration changes.
      uirevision: "site-plan",
      hovermode: "closest",
      xaxis: {
        ...baseLayout.xaxis,
        title: { text: "East (m)" },
        zeroline: true,
        ...(ranges ? { range: ranges.x } : {}),
      },
      yaxis: {
        ...baseLayout.yaxis,
        title: { text: "North (m)" },
        zeroline: true,
        scaleanchor: "x",
        scaleratio: 1,
        ...(ranges ? { range: ranges.y } : {}),
      },
    }),
    [height, ranges],
  );

  /** Reads the drawn scale (after the first draw, a zoom or a resize) so labels fit the view. */
  function measure(_figure: unknown, graphDiv: HTMLElement) {
    const axis = (graphDiv as HTMLElement & { _fullLayout?: { xaxis?: { range?: number[]; _length?: number } } })
      ._fullLayout?.xaxis;
    if (!axis?.range || !axis._length) return;
    const next = Number((Math.abs(axis.range[1] - axis.range[0]) / axis._length).toPrecision(2));
    if (Number.isFinite(next) && next > 0) setMetresPerPixel((prev) => (prev === next ? prev : next));
  }

  const byName = new Map(stations.map((s) => [s.name, s]));
  const shownMembers = shown ? shown.stationNames.map((n) => byName.get(n)).filter((s): s is MapStation => !!s) : null;

  const chooser =
    !draft && configurations.length > 0 ? (
      <div
        role="group"
        aria-label="Configuration drawn on the map"
        className={cx(
          "flex flex-wrap items-center gap-2 text-sm",
          arrangement === "side" && "lg:flex-col lg:items-stretch",
        )}
      >
        <span className="text-night-600">Draw a configuration:</span>
        {[
          { name: null as string | null, label: "None" },
          ...configurations.map((c) => ({ name: c.name as string | null, label: c.name })),
        ].map((option, i) => {
          const pressed = chosen === option.name;
          const swatch = option.name === null ? null : SERIES_COLOURS[(i - 1) % SERIES_COLOURS.length];
          return (
            <button
              key={option.label}
              type="button"
              aria-pressed={pressed}
              onClick={() => setChosen(option.name)}
              className={cx(
                "inline-flex items-center gap-1.5 rounded-full px-3 py-1 font-medium ring-1 ring-inset",
                pressed
                  ? "bg-night-800 text-white ring-night-800"
                  : "bg-white text-night-800 ring-night-300 hover:bg-night-100",
              )}
            >
              {swatch ? (
                <span
                  aria-hidden="true"
                  className="inline-block h-2.5 w-2.5 rounded-full"
                  style={{ background: swatch }}
                />
              ) : null}
              {option.label}
            </button>
          );
        })}
      </div>
    ) : null;

  const plot = (
    <div className="min-w-0 space-y-2">
      <Plot
        label={shown ? `${label}; ${shown.name} drawn with its baselines` : label}
        height={height}
        data={data}
        layout={layout}
        onInitialized={measure}
        onUpdate={measure}
        onClick={
          onPickStation
            ? (event: { points?: { text?: string }[] }) => {
                const name = event.points?.[0]?.text;
                if (typeof name === "string" && stations.some((s) => s.name === name)) onPickStation(name);
              }
            : undefined
        }
      />
      <p className="text-xs text-night-600">
        North is up and east to the right, with equal scales. Drag to zoom in (names of close stations appear),
        double-click to see the whole site.
      </p>
    </div>
  );

  if (arrangement === "side") {
    return (
      <div className="grid grid-cols-1 gap-5 lg:grid-cols-[minmax(0,1fr)_16rem]">
        {plot}
        <div className="space-y-5">
          {chooser}
          <Figures stations={stations} members={shownMembers} name={shown?.name ?? null} />
        </div>
      </div>
    );
  }
  return (
    <div className="space-y-3">
      {chooser}
      {plot}
      {draft ? <Figures stations={stations} members={shownMembers} name={draft.name} /> : null}
    </div>
  );
}
