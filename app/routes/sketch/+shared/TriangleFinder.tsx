/**
 * The Triangle finder: a target, model, night, band and a station pool (a configuration or every
 * station) are ranked by POST /api/triangles; the table lists the best triangles with the reasons,
 * and each row opens the Sketchpad on that triangle with the same target, model, night and band.
 * A link that carries a target (shared, or from the Sketchpad) is ranked as soon as it opens; after
 * that a change of the inputs is ranked on "Rank triangles" (ranking every station takes a while).
 * "Use this triangle" stores a ranked triangle on a target of one of the viewer's drafts.
 */
import { useEffect, useMemo, useRef, useState } from "react";
import { href } from "react-router";
import { Alert, Button, EmptyState, PageHeader, SelectField } from "~/components/ui";
import { type TrianglesResponse, triangleCount } from "~/engine";
import { inputErrors } from "~/services/sketch/api-errors";
import { poolStations } from "~/services/sketch/registry";
import { buildTrianglesRequest, type TrianglesBody } from "~/services/sketch/request";
import {
  ALL_STATIONS,
  exampleTarget,
  readTriangleState,
  sketchpadHref,
  type TriangleState,
  writeTriangleState,
} from "~/services/sketch/state";
import { plural, seconds } from "~/services/sketch/words";
import { useApi } from "./api";
import { BandInput } from "./BandInput";
import { binder, InputError, InputGroup } from "./InputGroup";
import { ModelInputs } from "./ModelInputs";
import { RankingTable } from "./RankingTable";
import { SamplingInputs } from "./SamplingInputs";
import type { SketchPageProps } from "./SketchPage";
import { CopyLinkButton, StatusBar } from "./StatusBar";
import { TargetInputs } from "./TargetInputs";
import type { TriangleRow } from "./triangle-columns";
import { UseTriangleDialog } from "./UseTriangleDialog";
import { useSketchState } from "./useUrlState";

const CODEC = { read: readTriangleState, write: writeTriangleState };

/** Milliseconds from asking for a ranking to its table on screen (null while none is shown). */
function useRankedMs(shownFor: { at: number } | null): number | null {
  const [ms, setMs] = useState<{ at: number; ms: number } | null>(null);
  useEffect(() => {
    if (shownFor) setMs({ at: shownFor.at, ms: performance.now() - shownFor.at });
  }, [shownFor]);
  return ms && shownFor && ms.at === shownFor.at ? ms.ms : null;
}

export function TriangleFinder({
  registry,
  defaults,
  multiSite,
  savedTargets = [],
  proposalTargets = [],
  refusal = null,
}: SketchPageProps) {
  const { state, settled, pending, set, type } = useSketchState(CODEC, { defaults, multiSite });
  const field = binder(state, set);
  const built = useMemo(() => buildTrianglesRequest(settled, registry), [settled, registry]);
  const [asked, setAsked] = useState<{ body: TrianglesBody; state: TriangleState; at: number } | null>(null);
  const ranking = useApi<TrianglesResponse>(href("/api/triangles"), asked?.body ?? null);
  const rankedMs = useRankedMs(ranking.current && !ranking.error ? asked : null);

  // A link with a target ranks as it opens (once; later changes wait for the button).
  const openedWith = useRef(built.ok ? built : null);
  useEffect(() => {
    const first = openedWith.current;
    openedWith.current = null;
    if (first?.ok) setAsked({ body: first.body, state: settled, at: performance.now() });
  }, [settled]);

  const stale = asked !== null && (!built.ok || JSON.stringify(built.body) !== JSON.stringify(asked.body));
  // The API's refusal belongs to the inputs that were ranked; once they change it no longer applies.
  const { errors, formError } = inputErrors(built, [stale ? null : ranking.error], settled.sampling);

  const result = ranking.data?.result;
  const rows: TriangleRow[] = useMemo(
    () =>
      result && asked ? result.triangles.map((t) => ({ ...t, href: sketchpadHref(asked.state, t.stations) })) : [],
    [result, asked],
  );
  const [using, setUsing] = useState<readonly string[] | null>(null);
  const canUse = proposalTargets.some((p) => p.targets.length > 0);
  const onUse = useMemo(() => (canUse ? (r: TriangleRow) => setUsing(r.stations) : undefined), [canUse]);
  const poolSize = poolStations(state.pool, registry)?.length ?? 0;
  const triples = triangleCount(poolSize);

  function rank() {
    if (built.ok) setAsked({ body: built.body, state: settled, at: performance.now() });
  }
  const groups = { state, set, type, errors };

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
            {...groups}
            savedTargets={savedTargets}
            onExample={() => set(exampleTarget(state.date || defaults.date, registry.site))}
          />
          <InputGroup title="Station pool">
            <SelectField
              label="Pool"
              {...field("pool")}
              error={errors.stations}
              hint={`${plural(poolSize, "station")}: ${plural(triples, "triangle")} to rank.`}
            >
              {registry.configurations.map((c) => (
                <option key={c.name} value={c.name}>
                  {c.name} ({c.stationNames.join(", ")})
                </option>
              ))}
              <option value={ALL_STATIONS}>All {plural(registry.stations.length, "station")}</option>
            </SelectField>
            <BandInput {...groups} registry={registry} />
          </InputGroup>
          <ModelInputs {...groups} />
          <SamplingInputs
            {...groups}
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
              {plural(poolSize, "station")}, {plural(triples, "triangle")}; each is scored over the samples of the
              night.
            </span>
          </div>
        </form>

        <div className="min-w-0 space-y-4" aria-busy={ranking.isValidating}>
          <StatusBar
            busy={ranking.isValidating}
            problem={!!ranking.error}
            text={
              ranking.isValidating
                ? `Ranking the triangles of ${plural(asked?.body.stations.length ?? 0, "station")}…`
                : ranking.error
                  ? ranking.error.retryAfterS !== null
                    ? `The server is busy: asking again in ${ranking.error.retryAfterS} s`
                    : "Not ranked: fix the marked input"
                  : ranking.data
                    ? rankedMs !== null
                      ? `Ranked in ${seconds(rankedMs)}`
                      : "Ranked"
                    : "Not ranked yet"
            }
          >
            {stale && result ? (
              <span className="text-sm text-caution-700">The inputs changed since this ranking: rank again.</span>
            ) : null}
          </StatusBar>
          <InputError message={formError} boxed />
          {refusal ? <Alert>Not stored: {refusal}</Alert> : null}
          {result ? (
            <RankingTable result={result} rows={rows} onUse={onUse} />
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
      {asked ? (
        <UseTriangleDialog
          stations={using}
          rankedFor={{
            site: registry.site.name,
            instrument: asked.state.instrument,
            band: asked.state.band,
            pool: asked.state.pool,
          }}
          choices={proposalTargets.filter((p) => p.targets.length > 0)}
          onClose={() => setUsing(null)}
        />
      ) : null}
    </>
  );
}
