import { useMemo } from "react";
import type { CoverageResponse } from "~/engine";
import { mirrored, uvTrack } from "~/services/sketch/tracks";
import { plural } from "~/services/sketch/words";
import { Panel, SeriesLegend, Toggle } from "./Panel";
import { Plot, plotLayout, SERIES_COLOURS } from "./Plot";
import { trackTraces } from "./track-traces";

export type UvUnit = "mlambda" | "m";

/** Colour of baseline `b` (shared by the uv plane and the V² panel). */
export const baselineColour = (b: number) => SERIES_COLOURS[b % SERIES_COLOURS.length];

/**
 * Earth-rotation synthesis tracks: one line per baseline and channel through its samples in time order
 * (named by its stations), and a dotted one through its Hermitian points (−u, −v) in the same colour;
 * samples without a neighbour are drawn as dots. u grows toward east, plotted to the LEFT as on the
 * sky; equal scales on both axes.
 */
export function UvPlanePanel({
  coverage,
  unit,
  onUnit,
}: {
  coverage: CoverageResponse;
  unit: UvUnit;
  onUnit: (u: UvUnit) => void;
}) {
  const { data, radius } = useMemo(() => {
    const traces: Record<string, unknown>[] = [];
    let r = 0;
    coverage.baselines.forEach((b, k) => {
      const track = uvTrack(b.points, unit, coverage.wavelengthsM);
      const colour = baselineColour(k);
      const name = `${b.stations[0]}–${b.stations[1]}`;
      for (const [i, x] of track.x.entries()) if (x !== null) r = Math.max(r, Math.hypot(x, track.y[i] as number));
      for (const [i, x] of track.lone.x.entries()) r = Math.max(r, Math.hypot(x, track.lone.y[i]));
      const hover = (what: string) =>
        unit === "m"
          ? `${what}<br>u %{x:.1f} m, v %{y:.1f} m<br>hour angle %{customdata[0]:.2f} h<extra></extra>`
          : `${what}<br>u %{x:.2f} Mλ, v %{y:.2f} Mλ<br>hour angle %{customdata[0]:.2f} h, λ %{customdata[1]:.3f} µm<extra></extra>`;
      traces.push(...trackTraces(track, { name, colour, width: 2.5, hovertemplate: hover(name) }));
      traces.push(
        ...trackTraces(mirrored(track), {
          name: `${name} (−u, −v)`,
          colour,
          width: 1.5,
          dash: "dot",
          hovertemplate: hover(`${name} (Hermitian)`),
        }),
      );
    });
    return { data: traces, radius: r };
  }, [coverage, unit]);

  const u = unit === "m" ? "m" : "Mλ";
  const layout = useMemo(() => {
    const R = (radius || 1) * 1.08;
    return plotLayout({
      margin: { l: 60, r: 16, t: 16, b: 48 },
      xaxis: { title: { text: `u (${u}), east ←` }, range: [R, -R], zeroline: true },
      yaxis: {
        title: { text: `v (${u}), north ↑` },
        range: [-R, R],
        scaleanchor: "x",
        scaleratio: 1,
        zeroline: true,
      },
      showlegend: false,
      uirevision: `uv-${unit}`,
      hovermode: "closest",
    });
  }, [radius, u, unit]);
  return (
    <Panel
      id="uv-plane"
      title="uv coverage"
      actions={
        <Toggle
          label="uv units"
          value={unit}
          options={[
            ["mlambda", "Mλ"],
            ["m", "metres"],
          ]}
          onChange={onUnit}
        />
      }
      note={
        <>
          Solid: the measured (u, v) of each sample, joined in time order; dotted: the Hermitian points (−u, −v), which
          every baseline gives as well.
          {unit === "mlambda"
            ? ` One track per channel (${plural(coverage.wavelengthsM.length, "channel")}).`
            : " Metres do not depend on the wavelength."}
        </>
      }
    >
      {coverage.baselines.every((b) => b.points.length === 0) ? (
        <p className="py-16 text-center text-sm text-night-600">No observable sample: no uv points to draw.</p>
      ) : (
        <Plot
          label={`uv plane: projected baselines in ${u}, u toward east plotted to the left, v toward north`}
          height={440}
          data={data}
          layout={layout}
        />
      )}
      <SeriesLegend
        label="Baselines"
        items={coverage.baselines.map((b, k) => ({
          name: `${b.stations[0]}–${b.stations[1]}`,
          colour: baselineColour(k),
        }))}
      />
    </Panel>
  );
}
