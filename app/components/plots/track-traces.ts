/**
 * Plotly traces of a sampled track (~/services/sketch/tracks): one line trace through its pieces, and
 * a marker trace for the samples that stand alone (only when there are some). Pure.
 */
import type { Track } from "~/services/sketch/tracks";

export function trackTraces(
  track: Track,
  style: { name: string; colour: string; width?: number; dash?: string; opacity?: number; hovertemplate: string },
): Record<string, unknown>[] {
  const common = {
    type: "scatter",
    name: style.name,
    legendgroup: style.name,
    showlegend: false,
    hovertemplate: style.hovertemplate,
    opacity: style.opacity ?? 1,
  };
  const out: Record<string, unknown>[] = [];
  if (track.x.length > 0) {
    out.push({
      ...common,
      mode: "lines",
      x: track.x,
      y: track.y,
      customdata: track.custom,
      line: { color: style.colour, width: style.width ?? 2, dash: style.dash ?? "solid" },
      connectgaps: false,
    });
  }
  if (track.lone.x.length > 0) {
    out.push({
      ...common,
      mode: "markers",
      x: track.lone.x,
      y: track.lone.y,
      customdata: track.lone.custom,
      marker: { size: 5, color: style.colour },
    });
  }
  return out;
}
