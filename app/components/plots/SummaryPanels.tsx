import type { ReactNode } from "react";
import type { CoverageResponse } from "~/engine";
import { airmassRange, summariseReasons } from "~/services/sketch/figures";
import { plural } from "~/services/sketch/words";
import { Panel } from "./Panel";

function Figure({ label, value, unit, hint }: { label: string; value: ReactNode; unit?: string; hint?: string }) {
  return (
    <div className="rounded-lg bg-night-50 px-3 py-2 ring-1 ring-night-100">
      <dt className="text-xs text-night-600" title={hint}>
        {label}
      </dt>
      <dd className="num text-lg font-semibold text-night-950">
        {value}
        {unit ? <span className="ml-1 text-sm font-normal text-night-600">{unit}</span> : null}
      </dd>
    </div>
  );
}

const fix = (x: number | null | undefined, d: number) => (x === null || x === undefined ? "—" : x.toFixed(d));

/** The sketch in numbers, each with its unit. */
export function FiguresPanel({ coverage, stations }: { coverage: CoverageResponse; stations: number }) {
  const f = coverage.figures;
  const am = airmassRange(coverage.samples);
  return (
    <Panel
      id="figures"
      title="Figures"
      className="xl:col-span-2"
      note={
        <>
          Resolution λ<sub>min</sub>/(2 B<sub>max</sub>) and largest scale λ<sub>max</sub>/(2 B<sub>min</sub>) over the
          projected baselines. Independent closure phases: (N − 1)(N − 2)/2 for N stations.
        </>
      }
    >
      <dl className="grid grid-cols-2 gap-2 sm:grid-cols-3 lg:grid-cols-5">
        <Figure label="Angular resolution" value={fix(f.resolutionMas, 3)} unit="mas" />
        <Figure label="Longest projected baseline" value={fix(f.longestBaselineM, 1)} unit="m" />
        <Figure label="Shortest projected baseline" value={fix(f.shortestBaselineM, 1)} unit="m" />
        <Figure label="Largest angular scale" value={fix(f.largestAngularScaleMas, 2)} unit="mas" />
        <Figure
          label="Observable time"
          value={fix(f.observableHours, 2)}
          unit="h"
          hint={`${plural(f.observableSamples, "observable sample")}`}
        />
        <Figure
          label="Closure triangles"
          value={coverage.closurePhases.length}
          unit={`(${coverage.independentClosurePhases} independent)`}
        />
        <Figure label="Stations / baselines" value={`${stations} / ${coverage.baselines.length}`} />
        <Figure label="Air mass range" value={am ? `${am.min.toFixed(2)}–${am.max.toFixed(2)}` : "—"} />
        <Figure label="Radial coverage" value={fix(f.radialCoverage * 100, 0)} unit="% of 20 bins" />
        <Figure label="Position-angle coverage" value={fix(f.positionAngleCoverage * 100, 0)} unit="% of 36 bins" />
      </dl>
    </Panel>
  );
}

/** The API's notes, why samples were not observable, and cautions about the Sun and twilight. */
export function NotesPanel({
  coverage,
  cautions,
  moonLine,
  windows = [],
}: {
  coverage: CoverageResponse;
  cautions: string[];
  moonLine: string | null;
  /** The observable windows of the night in UTC, e.g. "2027-03-16 01:20–06:40 UTC (5.3 h)". */
  windows?: string[];
}) {
  const reasons = summariseReasons(coverage.samples);
  const total = coverage.samples.length;
  const observable = coverage.samples.filter((s) => s.observable).length;
  return (
    <Panel id="notes" title="Notes" className="xl:col-span-2">
      <div className="space-y-3 text-sm">
        <p>
          <span className="num font-semibold">{observable}</span> of <span className="num font-semibold">{total}</span>{" "}
          {total === 1 ? "sample is" : "samples are"} observable.
          {reasons.length > 0 ? ` Not observable: ${reasons.join("; ")}.` : ""}
        </p>
        {windows.length > 0 ? (
          <p>
            Observable {windows.length === 1 ? "window" : "windows"}: {windows.join("; ")}.
          </p>
        ) : null}
        {coverage.notes.length > 0 ? (
          <ul className="list-disc space-y-1 pl-5">
            {coverage.notes.map((n) => (
              <li key={n}>{n}</li>
            ))}
          </ul>
        ) : null}
        {moonLine ? <p className="text-night-700">{moonLine}</p> : null}
        {cautions.length > 0 ? (
          <div role="note" className="rounded-lg border border-caution-700/30 bg-caution-50 p-3 text-caution-700">
            <p className="font-semibold">Caution</p>
            <ul className="mt-1 list-disc space-y-1 pl-5">
              {cautions.map((c) => (
                <li key={c}>{c}</li>
              ))}
            </ul>
          </div>
        ) : null}
      </div>
    </Panel>
  );
}
