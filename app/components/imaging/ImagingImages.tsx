/**
 * Model, dirty image and reconstruction of a preview side by side: Plotly heatmaps on the same axes
 * (offsets in mas, east to the left as on the sky, north up) and one colour scale — each image relative
 * to its own peak, so their shapes compare directly.
 */
import { useMemo } from "react";
import { Plot, plotLayout } from "~/components/plots/Plot";

const HEAT = [
  [0, "#0d1220"],
  [0.3, "#313a52"],
  [0.55, "#a03611"],
  [0.78, "#f27a3a"],
  [1, "#fff5ee"],
];

function grid(values: readonly number[], n: number) {
  let peak = 0;
  for (const v of values) peak = Math.max(peak, v);
  const scale = peak > 0 ? 1 / peak : 1;
  const z: number[][] = [];
  for (let r = 0; r < n; r++) z.push(Array.from({ length: n }, (_, c) => values[r * n + c] * scale));
  return z;
}

export function ImagingImages({
  gridSize,
  pixelMas,
  model,
  dirty,
  reconstruction,
}: {
  gridSize: number;
  pixelMas: number;
  model: readonly number[];
  dirty: readonly number[];
  reconstruction: readonly number[];
}) {
  const figures = useMemo(() => {
    const axis = Array.from({ length: gridSize }, (_, i) => (i - Math.floor(gridSize / 2)) * pixelMas);
    const images = [
      { key: "model", caption: "Model", label: "Model image", z: grid(model, gridSize) },
      { key: "dirty", caption: "Dirty image", label: "Dirty image of the simulated data", z: grid(dirty, gridSize) },
      {
        key: "reconstruction",
        caption: "Reconstruction",
        label: "Reconstructed image",
        z: grid(reconstruction, gridSize),
      },
    ];
    let zmin = 0;
    for (const im of images) for (const row of im.z) for (const v of row) zmin = Math.min(zmin, v);
    return images.map((im, i) => ({
      ...im,
      data: [
        {
          type: "heatmap",
          x: axis,
          y: axis,
          z: im.z,
          zmin,
          zmax: 1,
          colorscale: HEAT,
          showscale: i === images.length - 1,
          colorbar: { title: { text: "relative to peak", side: "right" }, thickness: 10, len: 0.9 },
          hovertemplate: "east %{x:.2f} mas, north %{y:.2f} mas<br>%{z:.3f} of peak<extra></extra>",
        },
      ],
    }));
  }, [gridSize, pixelMas, model, dirty, reconstruction]);
  const layout = useMemo(
    () =>
      plotLayout({
        xaxis: { title: { text: "Offset (mas), east ←" }, autorange: "reversed", zeroline: false, constrain: "domain" },
        yaxis: {
          title: { text: "north ↑ (mas)" },
          scaleanchor: "x",
          scaleratio: 1,
          zeroline: false,
          constrain: "domain",
        },
        margin: { l: 48, r: 8, t: 8, b: 44 },
      }),
    [],
  );
  return (
    <div className="grid gap-3 md:grid-cols-3" data-testid="imaging-images">
      {figures.map((f) => (
        <Plot
          key={f.key}
          label={`${f.label}, offsets in milliarcseconds, east to the left, relative to its peak`}
          caption={f.caption}
          priority="heavy"
          height={280}
          data={f.data}
          layout={layout}
        />
      ))}
    </div>
  );
}
