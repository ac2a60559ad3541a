import { useMemo } from "react";
import type { CoverageResponse } from "~/engine";
import { uvPoints } from "~/services/sketch/figures";
import { Panel, SeriesLegend, Toggle } from "./Panel";
import { Plot, plotLayout, SERIES_COLOURS } from "./Plot";

export type UvUnit = "mlambda" | "m";

/** Colour of baseline `b` (shared by the uv plane and the V² panel). */
export const baselineColour = (b: number) => SERIES_COLOURS[b % SERIES_COLOURS.length];

/**
 * Earth-rotation synthesis tracks: one trace per baseline (named by its stations) and one hollow trace
 * of its Hermitian points (−u, −v) in the same colour. u grows toward east, plotted to the LEFT as on
 * the sky; equal scales on both axes.
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
      const p = uvPoints(b, unit, coverage.wavelengthsM);
      const colour = baselineColour(k);
      const name = `${b.stations[0]}–${b.stations[1]}`;
      for (let i = 0; i < p.u.length; i++) r = Math.max(r, Math.hypot(p.u[i], p.v[i]));
      const hover =
        unit === "m"
          ? `${name}<br>u %{x:.1f} m, v %{y:.1f} m<br>hour angle %{customdata:.2f} h<extra></extra>`
          : `${name}<br>u %{x:.2f} Mλ, v %{y:.2f} Mλ<br>hour angle %{customdata[0]:.2f} h, λ %{customdata[1]:.3f} µm<extra></extra>`;
      const custom = unit === "m" ? p.hourAngleH : p.hourAngleH.map((h, i) => [h, p.wavelengthM[i] * 1e6]);
      traces.push({
        type: "scatter",
        mode: "markers",
        name,
        legendgroup: name,
        showlegend: false,
        x: p.u,
        y: p.v,
        customdata: custom,
        marker: { size: 5, color: colour },
        hovertemplate: hover,
      });
      traces.push({
        type: "scatter",
        mode: "markers",
        name: `${name} (−u, −v)`,
        legendgroup: name,
        showlegend: false,
        x: p.uTwin,
        y: p.vTwin,
        customdata: custom,
        marker: { size: 5, color: colour, symbol: "circle-open", line: { width: 1.2 } },
        hovertemplate: hover.replace(`${name}<br>`, `${name} (Hermitian)<br>`),
      });
    });
    return { data: traces, radius: r };
  }, [coverage, unit]);

  const u = unit === "m" ? "m" : "Mλ";
  const R = (radius || 1) * 1.08;
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
          Filled: measured (u, v); hollow: the Hermitian points (−u, −v), which every baseline gives as well.
          {unit === "mlambda"
            ? ` One point per sample and channel (${coverage.wavelengthsM.length} channels).`
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
          layout={plotLayout({
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
          })}
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
