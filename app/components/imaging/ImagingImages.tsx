/**
 * Model, dirty image and reconstruction of a preview side by side: Plotly heatmaps on the same axes
 * (offsets in mas, east to the left as on the sky, north up) and one colour scale — each image relative
 * to its own peak, so their shapes compare directly.
 */
import { useMemo } from "react";
import { HEAT, Plot, plotLayout, skyAxes } from "~/components/plots/Plot";

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
    return images.map((im) => ({
      ...im,
      data: [
        {
          type: "heatmap",
          x: axis,
          y: axis,
          z: im.z,
          zmin: 0,
          zmax: 1,
          colorscale: HEAT,
          showscale: false,
          hovertemplate: "east %{x:.2f} mas, north %{y:.2f} mas<br>%{z:.3f} of peak<extra></extra>",
        },
      ],
    }));
  }, [gridSize, pixelMas, model, dirty, reconstruction]);
  const layout = useMemo(
    () =>
      plotLayout({
        ...skyAxes("north ↑ (mas)"),
        margin: { l: 48, r: 8, t: 8, b: 44 },
      }),
    [],
  );
  const gradient = `linear-gradient(to right, ${HEAT.map(([at, colour]) => `${colour} ${Number(at) * 100}%`).join(", ")})`;
  return (
    <div className="space-y-2">
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
      <p className="flex flex-wrap items-center gap-2 text-xs text-night-600">
        <span>One colour scale, each image relative to its own peak: 0</span>
        <span
          aria-hidden="true"
          className="inline-block h-3 w-32 rounded ring-1 ring-night-200"
          style={{ background: gradient }}
        />
        <span>1 (the dirty image's negative sidelobes are shown as 0).</span>
      </p>
    </div>
  );
}
