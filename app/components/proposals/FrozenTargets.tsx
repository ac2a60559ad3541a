/**
 * The targets of a frozen proposal version, as the proposer's version page and the committee's review
 * desk both show them: position (sexagesimal, degrees in the tooltip), model, magnitudes, elevation
 * limit, time windows (UTC), calibrators, the chosen closure triangle, notes, and optional links.
 */
import { Coordinates } from "~/components/targets/Coordinates";
import { Card } from "~/components/ui";
import type { frozenTargetView } from "~/services/proposals/target-summary";
import { shownUtc } from "./utc";

/** `frozenTargetView`'s words, with links (the review desk's Sketchpad links) where the page has them. */
export type FrozenTarget = ReturnType<typeof frozenTargetView> & { links?: { label: string; href: string }[] };

function windowsText(ws: FrozenTarget["timeWindows"]): string {
  return ws.map((w) => `${shownUtc(w.startUtc)} – ${shownUtc(w.endUtc)}`).join("; ");
}

export function FrozenTargets({ targets, className }: { targets: FrozenTarget[]; className?: string }) {
  return (
    <Card title={`Targets (${targets.length})`} className={className}>
      <ol className="grid gap-3 text-sm">
        {targets.map((t, i) => (
          <li key={t.name}>
            <span className="font-semibold">
              {i + 1}. {t.name}
            </span>{" "}
            <span className="num text-night-700">
              <Coordinates raDeg={t.raDeg} decDeg={t.decDeg} /> · {t.model} · {t.magnitudes}
            </span>
            <span className="block text-night-600">
              {t.minElevationDeg === null ? "array elevation limit" : `elevation ≥ ${t.minElevationDeg}°`}
              {t.timeWindows.length ? ` · windows ${windowsText(t.timeWindows)}` : ""}
              {t.calibrators.length ? ` · calibrators ${t.calibrators.join(", ")}` : ""}
              {t.triangle ? ` · ${t.triangle}` : ""}
              {t.notes ? ` · ${t.notes}` : ""}
            </span>
            {t.links?.length ? (
              <span className="mt-1 flex flex-wrap gap-2">
                {t.links.map((l) => (
                  <a key={l.href} href={l.href} className="text-ember-800 underline">
                    {l.label}
                  </a>
                ))}
              </span>
            ) : null}
          </li>
        ))}
      </ol>
    </Card>
  );
}
