/**
 * The figure of a night plan (pure, safe in the browser): one row per science target, each block a
 * horizontal bar from its start to its end coloured by kind (or by what became of it), a block that
 * breaks a rule outlined in red, twilight shaded from sunset to astronomical dusk and from
 * astronomical dawn to sunrise, and the Moon's altitude on a second axis.
 */
import type { TwilightTimesUtc } from "~/engine";

/** What every view of a night-plan block shows: its kind, what it points at, when, and what became of it. */
export type BlockFields = {
  kind: "calibrator" | "science";
  target: string;
  object: string;
  /** ISO-8601 UTC instants. */
  startUtc: string;
  endUtc: string;
  outcome: "planned" | "executed" | "weather" | "technical";
};

export type TimelineBlock = BlockFields & {
  id: number;
  position: number;
  violations: readonly { reason: string }[];
};

/** The Sun's events of the night (the ephemeris's twilight times), ISO-8601 UTC; null when one does not occur. */
export type TimelineSky = TwilightTimesUtc;

export const KIND_COLOURS = {
  science: "#a03611",
  calibrator: "#1d4f8c",
  executed: "#21603a",
  lost: "#7b849a",
} as const;
const VIOLATION_COLOUR = "#b4234a";
const MOON_COLOUR = "#6b2f8f";

type Group = keyof typeof KIND_COLOURS;
const GROUP_NAMES: Record<Group, string> = {
  science: "Science",
  calibrator: "Calibrator",
  executed: "Executed",
  lost: "Lost (weather or technical)",
};

const groupOf = (b: TimelineBlock): Group =>
  b.outcome === "executed" ? "executed" : b.outcome === "planned" ? b.kind : "lost";

const hhmm = (iso: string) => `${iso.slice(11, 16)} UTC`;

/** Plotly traces and layout of the plan. */
export function timelineFigure(
  blocks: readonly TimelineBlock[],
  sky: TimelineSky,
  moon: { utc: string[]; altitudeDeg: number[] } | null,
) {
  const rows: string[] = [];
  for (const b of blocks) if (!rows.includes(b.target)) rows.push(b.target);
  const traces: Record<string, unknown>[] = [];
  for (const group of Object.keys(KIND_COLOURS) as Group[]) {
    const mine = blocks.filter((b) => groupOf(b) === group);
    if (mine.length === 0) continue;
    traces.push({
      type: "bar",
      orientation: "h",
      name: GROUP_NAMES[group],
      y: mine.map((b) => b.target),
      base: mine.map((b) => b.startUtc),
      x: mine.map((b) => Date.parse(b.endUtc) - Date.parse(b.startUtc)),
      width: mine.map((b) => (b.kind === "science" ? 0.7 : 0.45)),
      marker: {
        color: KIND_COLOURS[group],
        line: {
          color: mine.map((b) => (b.violations.length ? VIOLATION_COLOUR : "#ffffff")),
          width: mine.map((b) => (b.violations.length ? 3 : 1)),
        },
      },
      hovertext: mine.map(
        (b) =>
          `#${b.position} ${b.kind} ${b.object}<br>${hhmm(b.startUtc)} – ${hhmm(b.endUtc)}` +
          (b.violations.length ? `<br>⚠ ${b.violations.map((v) => v.reason).join("<br>⚠ ")}` : ""),
      ),
      hoverinfo: "text",
    });
  }
  if (moon?.utc.length) {
    traces.push({
      type: "scatter",
      mode: "lines",
      name: "Moon altitude (°)",
      x: moon.utc,
      y: moon.altitudeDeg,
      yaxis: "y2",
      line: { color: MOON_COLOUR, dash: "dot", width: 2 },
      hovertemplate: "%{x|%H:%M} UTC: Moon %{y:.0f}°<extra></extra>",
    });
  }
  const shade = (a: string | null, b: string | null, opacity: number) =>
    a && b
      ? [
          {
            type: "rect",
            xref: "x",
            yref: "paper",
            x0: a,
            x1: b,
            y0: 0,
            y1: 1,
            fillcolor: "#313a52",
            opacity,
            line: { width: 0 },
            layer: "below",
          },
        ]
      : [];
  const shapes = [
    ...shade(sky.sunsetUtc, sky.civilDuskUtc, 0.08),
    ...shade(sky.civilDuskUtc, sky.nauticalDuskUtc, 0.14),
    ...shade(sky.nauticalDuskUtc, sky.astronomicalDuskUtc, 0.2),
    ...shade(sky.astronomicalDawnUtc, sky.nauticalDawnUtc, 0.2),
    ...shade(sky.nauticalDawnUtc, sky.civilDawnUtc, 0.14),
    ...shade(sky.civilDawnUtc, sky.sunriseUtc, 0.08),
  ];
  const pad = (iso: string | null, minutes: number) =>
    iso ? new Date(Date.parse(iso) + minutes * 60_000).toISOString() : undefined;
  const range = sky.sunsetUtc && sky.sunriseUtc ? [pad(sky.sunsetUtc, -10), pad(sky.sunriseUtc, 10)] : undefined;
  const annotations = [
    sky.astronomicalDuskUtc ? { x: sky.astronomicalDuskUtc, text: "dusk −18°" } : null,
    sky.astronomicalDawnUtc ? { x: sky.astronomicalDawnUtc, text: "dawn −18°" } : null,
  ]
    .filter((a): a is { x: string; text: string } => a !== null)
    .map((a) => ({
      ...a,
      xref: "x",
      yref: "paper",
      y: 1,
      yanchor: "bottom",
      showarrow: false,
      font: { size: 11, color: "#414c66" },
    }));
  const layout = {
    barmode: "overlay",
    height: Math.max(300, 180 + 44 * rows.length),
    margin: { l: 12, r: 56, t: 28, b: 110 },
    xaxis: { type: "date", title: { text: "Time (UTC)" }, range, tickformat: "%H:%M" },
    yaxis: {
      type: "category",
      title: { text: "Target" },
      categoryorder: "array",
      categoryarray: rows,
      autorange: "reversed",
      automargin: true,
    },
    yaxis2: {
      title: { text: "Moon altitude (°)" },
      overlaying: "y",
      side: "right",
      range: [0, 90],
      showgrid: false,
      zeroline: false,
    },
    shapes,
    annotations,
    // The legend at the foot of the figure, below the axis title, however many lines it wraps to.
    legend: { orientation: "h", yref: "container", y: 0, yanchor: "bottom", x: 0 },
    hovermode: "closest",
  };
  return { data: traces, layout, rows };
}
