/**
 * The Triangle finder: a target, model, night, band and a station pool (a configuration or every
 * station) are ranked by POST /api/triangles; the table lists the best triangles with the reasons,
 * and each row opens the Sketchpad on that triangle with the same target, model, night and band.
 */
import { useMemo, useState } from "react";
import { Link } from "react-router";
import { Button, type Column, DataTable, EmptyState, PageHeader, SelectField } from "~/components/ui";
import { formatDeclination, formatRightAscension } from "~/lib/coordinates";
import { raTransitingAtMidnight } from "~/services/sketch/night";
import {
  apiErrorText,
  buildTrianglesRequest,
  type FieldErrors,
  inputForApiField,
  type SketchRegistry,
  type TrianglesBody,
} from "~/services/sketch/request";
import {
  ALL_STATIONS,
  readTriangleState,
  type SavedTarget,
  type StateDefaults,
  sketchpadHref,
  type TriangleState,
  writeTriangleState,
} from "~/services/sketch/state";
import { type TrianglesResponse, useApi } from "./api";
import { BandInput, InputGroup, ModelInputs, SamplingInputs, TargetInputs } from "./InputFields";
import { Busy, CopyLinkButton } from "./Sketchpad";
import { useUrlState } from "./useUrlState";

type Row = TrianglesResponse["triangles"][number] & { href: string };

function columns(): Column<Row>[] {
  return [
    { key: "rank", header: "Rank", align: "right", value: (r) => r.rank },
    {
      key: "stations",
      header: "Triangle",
      value: (r) => r.stations.join("–"),
      render: (r) => <span className="whitespace-nowrap font-medium">{r.stations.join("–")}</span>,
    },
    {
      key: "open",
      header: "Sketchpad",
      value: (r) => r.href,
      render: (r) => (
        <Link
          to={r.href}
          className="whitespace-nowrap font-medium text-ember-800 underline underline-offset-2 hover:text-ember-900"
          aria-label={`Open ${r.stations.join("–")} in Sketchpad`}
        >
          Open in Sketchpad
        </Link>
      ),
    },
    { key: "score", header: "Score", align: "right", value: (r) => r.score, render: (r) => r.score.toFixed(3) },
    {
      key: "signal",
      header: "Closure-phase signal",
      unit: "° rms",
      align: "right",
      value: (r) => r.closurePhaseSignalDeg,
      render: (r) => r.closurePhaseSignalDeg.toFixed(1),
    },
    {
      key: "amplitude",
      header: "Triple amplitude",
      align: "right",
      value: (r) => r.meanTripleAmplitude,
      render: (r) => r.meanTripleAmplitude.toFixed(3),
    },
    {
      key: "spread",
      header: "uv spread",
      unit: "0–1",
      align: "right",
      value: (r) => r.uvSpread,
      render: (r) => r.uvSpread.toFixed(2),
    },
    {
      key: "hours",
      header: "Observable",
      unit: "h",
      align: "right",
      value: (r) => r.observableHours,
      render: (r) => r.observableHours.toFixed(2),
    },
    {
      key: "reasons",
      header: "Why",
      value: (r) => r.reasons.join("; "),
      render: (r) => (
        <ul className="min-w-72 space-y-0.5 text-xs text-night-700">
          {r.reasons.map((x) => (
            <li key={x}>{x}</li>
          ))}
        </ul>
      ),
    },
  ];
}

export function TriangleFinder({
  registry,
  defaults,
  multiSite,
  savedTargets = [],
}: {
  registry: SketchRegistry;
  defaults: StateDefaults;
  multiSite: boolean;
  savedTargets?: SavedTarget[];
}) {
  const { state, settled, pending, set } = useUrlState<TriangleState>(
    (p) => readTriangleState(p, defaults),
    writeTriangleState,
    multiSite ? ["site"] : [],
  );
  const built = useMemo(() => buildTrianglesRequest(settled, registry), [settled, registry]);
  const [asked, setAsked] = useState<{ body: TrianglesBody; state: TriangleState } | null>(null);
  const ranking = useApi<TrianglesResponse>("/api/triangles", asked?.body ?? null);

  const stale = asked !== null && (!built.ok || JSON.stringify(built.body) !== JSON.stringify(asked.body));
  const errors: FieldErrors = built.ok ? {} : { ...built.errors };
  let formError: string | null = null;
  // The API's refusal belongs to the inputs that were ranked; once they change it no longer applies.
  if (ranking.error && !stale) {
    const key = inputForApiField(ranking.error.field, settled.sampling);
    const text = apiErrorText(ranking.error.field, ranking.error.message, settled.sampling);
    if (key === "form") formError = text;
    else if (!errors[key]) errors[key] = text;
  }

  const result = ranking.data?.result;
  const rows: Row[] = useMemo(
    () =>
      result && asked ? result.triangles.map((t) => ({ ...t, href: sketchpadHref(asked.state, t.stations) })) : [],
    [result, asked],
  );
  const cols = useMemo(columns, []);
  const poolSize =
    state.pool === ALL_STATIONS
      ? registry.stations.length
      : (registry.configurations.find((c) => c.name === state.pool)?.stationNames.length ?? 0);
  const triples = (poolSize * (poolSize - 1) * (poolSize - 2)) / 6;

  function rank() {
    if (built.ok) setAsked({ body: built.body, state: settled });
  }

  return (
    <>
      <PageHeader
        title="Triangle finder"
        lead="Which three stations give the most useful closure phases for your target? Every triple of the pool is scored by the model's closure-phase signal, how well its baselines spread over the uv plane, and how long it can observe."
        actions={<CopyLinkButton />}
      />
      <div className="space-y-6">
        <form
          aria-label="Ranking inputs"
          className="grid items-start gap-4 md:grid-cols-2 xl:grid-cols-4"
          onSubmit={(e) => {
            e.preventDefault();
            rank();
          }}
        >
          <TargetInputs
            state={state}
            set={set}
            errors={errors}
            savedTargets={savedTargets}
            onExample={() =>
              set({
                ra: formatRightAscension(
                  raTransitingAtMidnight(state.date || defaults.date, registry.site.longitudeDeg),
                  1,
                ),
                dec: formatDeclination(Math.round(registry.site.latitudeDeg) - 5, 0),
              })
            }
          />
          <InputGroup title="Station pool">
            <SelectField
              label="Pool"
              name="pool"
              value={state.pool}
              error={errors.stations}
              hint={`${poolSize} stations: ${triples} triangles to rank.`}
              onChange={(e) => set({ pool: e.target.value })}
            >
              {registry.configurations.map((c) => (
                <option key={c.name} value={c.name}>
                  {c.name} ({c.stationNames.join(", ")})
                </option>
              ))}
              <option value={ALL_STATIONS}>All {registry.stations.length} stations</option>
            </SelectField>
            <BandInput state={state} set={set} errors={errors} registry={registry} />
          </InputGroup>
          <ModelInputs state={state} set={set} errors={errors} />
          <SamplingInputs
            state={state}
            set={set}
            errors={errors}
            site={registry.site}
            stepHint={
              state.pool === ALL_STATIONS
                ? "Every station: fewer samples rank faster; 10–20 min is plenty for hours and uv spread."
                : undefined
            }
          />
          <div className="flex flex-wrap items-center gap-3 md:col-span-2 xl:col-span-4">
            <Button type="submit" disabled={!built.ok || pending}>
              Rank triangles
            </Button>
            <span className="text-sm text-night-600">
              {poolSize} stations, {triples} triangles; each is scored over the samples of the night.
            </span>
          </div>
        </form>

        <div className="min-w-0 space-y-4" aria-busy={ranking.isValidating}>
          <div className="flex flex-wrap items-center justify-between gap-2 rounded-lg bg-white px-4 py-2 ring-1 ring-night-200">
            <Busy
              busy={ranking.isValidating}
              problem={!!ranking.error}
              text={
                ranking.isValidating
                  ? `Ranking ${asked?.body.stations.length ?? 0} stations…`
                  : ranking.error
                    ? "Not ranked: fix the marked input"
                    : ranking.data
                      ? `Ranked in a ${(ranking.data.elapsedMs / 1000).toFixed(2)} s round trip`
                      : "Not ranked yet"
              }
            />
            {stale && result ? (
              <span className="text-sm text-caution-700">The inputs changed since this ranking: rank again.</span>
            ) : null}
          </div>
          {formError ? (
            <p role="alert" className="rounded-lg border border-danger-700/30 bg-danger-50 p-3 text-sm text-danger-700">
              {formError}
            </p>
          ) : null}
          {result ? (
            <section
              aria-labelledby="ranking-title"
              className="space-y-3 rounded-[var(--radius-card)] bg-white p-4 shadow-[var(--shadow-card)] ring-1 ring-night-200"
            >
              <h2 id="ranking-title" className="text-lg font-semibold">
                Ranked triangles
              </h2>
              <p className="text-sm text-night-700">
                {result.triangleCount} triangles of {result.stationCount} stations over {result.sampleCount} samples of{" "}
                {(result.sampleDurationH * 60).toFixed(0)} min
                {result.triangles.length < result.triangleCount
                  ? `; the best ${result.triangles.length} are listed`
                  : ""}
                . The pool has {result.independentClosurePhases} independent closure phases. {result.scoring}.
              </p>
              <DataTable
                caption="Station triangles ranked for the target"
                columns={cols}
                rows={rows}
                rowKey={(r) => r.stations.join("-")}
                exportName="triangles"
              />
            </section>
          ) : ranking.isValidating ? (
            <EmptyState title="Ranking…">Every triple of the pool is scored on the server.</EmptyState>
          ) : (
            <EmptyState title="No ranking yet">
              {built.ok
                ? "Press “Rank triangles”."
                : !built.ok && built.waiting
                  ? "Type the target's coordinates, then rank."
                  : "Fix the inputs marked in red, then rank."}
            </EmptyState>
          )}
        </div>
      </div>
    </>
  );
}
