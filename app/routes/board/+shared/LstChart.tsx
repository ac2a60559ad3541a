/** LST pressure of one configuration: requested and allocated hours per LST bin against the hours available. */
import { Plot, plotLayout, SERIES_COLOURS } from "~/components/plots/Plot";

export function LstChart({
  name,
  binWidthH,
  capacity,
  requested,
  allocated,
  allocationLabel,
}: {
  name: string;
  binWidthH: number;
  capacity: number[];
  requested: number[];
  allocated: number[];
  allocationLabel: string;
}) {
  const x = capacity.map((_, b) => (b + 0.5) * binWidthH);
  const edges = [...capacity.map((_, b) => b * binWidthH), capacity.length * binWidthH];
  const hover = (what: string) => `${what}: %{y:.1f} h at LST %{x:.1f} h<extra></extra>`;
  return (
    <Plot
      label={`LST pressure of ${name}: hours requested, ${allocationLabel.toLowerCase()} and available per ${binWidthH} h of local sidereal time`}
      height={340}
      data={[
        {
          type: "bar",
          name: "Requested",
          x,
          y: requested,
          width: binWidthH * 0.9,
          marker: { color: "#a5b0c8" },
          hovertemplate: hover("Requested"),
        },
        {
          type: "bar",
          name: allocationLabel,
          x,
          y: allocated,
          width: binWidthH * 0.55,
          marker: { color: SERIES_COLOURS[0] },
          hovertemplate: hover(allocationLabel),
        },
        {
          type: "scatter",
          mode: "lines",
          name: "Available",
          x: edges,
          y: [...capacity, capacity[capacity.length - 1] ?? 0],
          line: { shape: "hv", color: SERIES_COLOURS[1], width: 2 },
          hovertemplate: "Available: %{y:.1f} h from LST %{x:.1f} h<extra></extra>",
        },
      ]}
      layout={plotLayout({
        barmode: "overlay",
        title: { text: `${name}: hours per ${binWidthH} h of LST`, font: { size: 13 } },
        xaxis: { title: { text: "Local sidereal time (h)" }, range: [0, 24], dtick: 2 },
        yaxis: { title: { text: "Hours over the cycle (h)" }, rangemode: "tozero" },
        legend: { orientation: "h", y: -0.25 },
        margin: { t: 40, b: 70 },
      })}
      config={{ modeBarButtonsToRemove: ["lasso2d", "select2d"] }}
    />
  );
}
