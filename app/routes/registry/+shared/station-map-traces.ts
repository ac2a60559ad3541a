/**
 * What the site plan draws, as Plotly traces: every station (grey), the names that have room, a
 * configuration's baselines and stations in its colour, a ringed station and a position as typed.
 * East and north in metres; pure, so the map component only chooses what to show.
 */
import { LABEL_SPACING_PX } from "~/components/plots/station-spacing";

export { extent, LABEL_SPACING_PX, nearestDistances } from "~/components/plots/station-spacing";

export type MapStation = { name: string; eastM: number; northM: number };
export type MapConfiguration = { name: string; stationNames: string[] };
export type MapPoint = { eastM: number; northM: number };

const STATION_GREY = "#56637f";
const FOCUS_COLOUR = "#a03611";
const PREVIEW_COLOUR = "#0f6f73";
const AT = "east %{x:.2f} m<br>north %{y:.2f} m";
export type Baseline = { a: string; b: string; lengthM: number };

/** Ground baselines (east and north only) of a station list, shortest first. */
export function baselines(members: MapStation[]): Baseline[] {
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

/** The axis ranges that frame `points` with a margin (at least 60 m across), or null for the whole site. */
export function frameRanges(points: MapPoint[] | null) {
  if (!points || points.length === 0) return null;
  const es = points.map((p) => p.eastM);
  const ns = points.map((p) => p.northM);
  const cx = (Math.max(...es) + Math.min(...es)) / 2;
  const cy = (Math.max(...ns) + Math.min(...ns)) / 2;
  const half = Math.max(Math.max(...es) - Math.min(...es), Math.max(...ns) - Math.min(...ns), 60) * 0.65;
  return { x: [cx - half, cx + half], y: [cy - half, cy + half] };
}

/** A scatter trace of stations at their east and north positions, named by `text`. */
const atStations = (list: MapStation[], trace: Record<string, unknown>) => ({
  type: "scatter",
  x: list.map((s) => s.eastM),
  y: list.map((s) => s.northM),
  text: list.map((s) => s.name),
  ...trace,
});

type PointStyle = { colour: string; textSize: number; marker: object; extra: string };

/** One marked and named point: a ringed station, or a position being typed. */
function pointTrace(name: string, point: MapStation, { colour, textSize, marker, extra }: PointStyle) {
  return atStations([point], {
    mode: "markers+text",
    name,
    textposition: "bottom center",
    textfont: { size: textSize, color: colour },
    marker: { color: colour, ...marker },
    hovertemplate: `<b>%{text}</b><br>${AT}<extra>${extra}</extra>`,
  });
}

export type MapScene = {
  stations: MapStation[];
  /** The configuration drawn, or null. */
  shown: MapConfiguration | null;
  colour: string;
  /** The station to ring, by name. */
  focus: string | null;
  preview: { name: string; eastM: number; northM: number } | null;
  /** Ground distance to the nearest station, as `nearestDistances` gives it. */
  nearest: number[];
  /** Metres per screen pixel of the drawn view. */
  scale: number;
};

/** The traces of the site plan, in drawing order. */
export function mapTraces({ stations, shown, colour, focus, preview, nearest, scale }: MapScene) {
  const byName = new Map(stations.map((s) => [s.name, s]));
  const members = (shown?.stationNames ?? []).map((n) => byName.get(n)).filter((s): s is MapStation => !!s);
  const memberNames = new Set(members.map((m) => m.name));
  // Names go in a trace of their own: only the stations with room for a label, redrawn as the view changes.
  const labelled = stations.filter(
    (s, i) => !memberNames.has(s.name) && s.name !== focus && nearest[i] / scale >= LABEL_SPACING_PX,
  );
  const traces: Record<string, unknown>[] = [
    atStations(stations, {
      mode: "markers",
      name: shown ? "Other stations" : "Stations",
      marker: { size: 8, color: shown ? "#a5b0c8" : STATION_GREY, line: { width: 1, color: "#ffffff" } },
      hovertemplate: `<b>%{text}</b><br>${AT}<extra></extra>`,
    }),
    atStations(labelled, {
      mode: "text",
      name: "Station names",
      showlegend: false,
      hoverinfo: "skip",
      textposition: "top center",
      textfont: { size: 11, color: "#414c66" },
    }),
  ];
  if (shown && members.length > 0) {
    const n = members.length;
    traces.push(
      {
        type: "scatter",
        mode: "lines",
        name: `${shown.name}: ${(n * (n - 1)) / 2} baselines`,
        ...baselineSegments(members),
        line: { color: colour, width: 2 },
        opacity: 0.55,
        hoverinfo: "skip",
      },
      atStations(members, {
        mode: "markers+text",
        name: `${shown.name}: ${n} stations`,
        textposition: "top center",
        textfont: { size: 13, color: colour },
        marker: { size: 14, color: colour, line: { width: 2, color: "#ffffff" } },
        hovertemplate: `<b>%{text}</b><br>${AT}<extra>${shown.name}</extra>`,
      }),
    );
  }
  const focused = focus ? byName.get(focus) : undefined;
  if (focused) {
    const marker = { size: 22, symbol: "circle-open", line: { width: 3 } };
    const style = { colour: FOCUS_COLOUR, textSize: 14, marker, extra: "" };
    traces.push(pointTrace(`Station ${focused.name}`, focused, style));
  }
  if (preview && Number.isFinite(preview.eastM) && Number.isFinite(preview.northM)) {
    const marker = { size: 14, symbol: "diamond", line: { width: 2, color: "#ffffff" } };
    const style = { colour: PREVIEW_COLOUR, textSize: 13, marker, extra: "as typed" };
    const name = preview.name ? `${preview.name} (as typed)` : "Position as typed";
    traces.push(pointTrace(name, { ...preview, name: preview.name || "new" }, style));
  }
  return traces;
}
