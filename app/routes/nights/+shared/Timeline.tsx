import { Plot, plotLayout } from "~/components/plots/Plot";
import { type TimelineBlock, type TimelineSky, timelineFigure } from "~/services/nights/timeline";

/** The plan as a timeline: a row per target, blocks coloured by kind, twilight shaded, the Moon's altitude. */
export function Timeline({
  blocks,
  sky,
  moon,
}: {
  blocks: TimelineBlock[];
  sky: TimelineSky;
  moon: { utc: string[]; altitudeDeg: number[] } | null;
}) {
  const figure = timelineFigure(blocks, sky, moon);
  const violations = blocks.filter((b) => b.violations.length > 0).length;
  return (
    <div>
      <Plot
        label={`Timeline of the plan: ${blocks.length} blocks on ${figure.rows.length} targets against time (UTC), twilight shaded, Moon altitude in degrees${violations ? `; ${violations} blocks break a rule` : ""}`}
        height={figure.layout.height}
        data={figure.data as never}
        layout={plotLayout(figure.layout) as never}
      />
      <p className="mt-1 text-xs text-night-600">
        Shaded: twilight (sunset → civil → nautical → astronomical dusk, and back at dawn). A red outline marks a block
        that breaks a rule.
      </p>
    </div>
  );
}
