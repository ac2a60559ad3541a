/**
 * The site plan: stations by east and north (metres), north up and east to the right, one metre
 * the same length on both axes. A configuration can be drawn on top with its stations and all its
 * baselines. Labels of crowded stations appear as the view is zoomed in.
 */
import { useMemo, useState } from "react";
import { baseLayout, Plot, SERIES_COLOURS } from "~/components/plots/Plot";
import { cx } from "~/components/ui";
import { FactList } from "./RegistryBits";
import {
  baselines,
  extent,
  frameRanges,
  type MapConfiguration,
  type MapPoint,
  type MapStation,
  mapTraces,
  nearestDistances,
} from "./station-map-traces";

export type { MapConfiguration, MapStation };

/** Until the plot has been measured, a guess of its width, pixels. */
const GUESSED_WIDTH_PX = 500;

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
    <FactList
      facts={rows}
      label={name ? `Figures of ${name}` : "Figures of the site"}
      className="grid gap-2 text-sm"
      itemClassName="flex justify-between gap-3 border-b border-night-100 pb-1"
      valueClassName="text-right font-medium"
    />
  );
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

  const data = useMemo(
    () => mapTraces({ stations, shown, colour, focus, preview, nearest, scale }),
    [stations, shown, focus, preview, nearest, scale, colour],
  );

  const frameKey = frame ? JSON.stringify(frame) : "";
  const ranges = useMemo(() => frameRanges(frameKey ? (JSON.parse(frameKey) as MapPoint[]) : null), [frameKey]);

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
      // biome-ignore lint/a11y/useSemanticElements: a row of toggle buttons, not a set of form fields
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
