/**
 * The Sketchpad: inputs on the left (on top on narrow screens), live panels on the right. Inputs live
 * in the URL; the settled inputs are turned into API requests (coverage with beam images, and the
 * night's ephemeris) fetched with SWR. The last good answer stays on screen while a new one is being
 * computed or while an input is invalid.
 */
import { useMemo, useRef } from "react";
import { href } from "react-router";
import { Button, EmptyState, PageHeader, SelectField } from "~/components/ui";
import type { CoverageResponse, EphemerisResponse } from "~/engine";
import { formatDeclination, formatRightAscension } from "~/lib/coordinates";
import { apiErrorText, inputErrors } from "~/services/sketch/api-errors";
import { pickedStations } from "~/services/sketch/registry";
import { buildCoverageRequest, buildEphemerisRequest, type CoverageBody } from "~/services/sketch/request";
import { exampleTarget, readSketchState, writeSketchState } from "~/services/sketch/state";
import { useApi } from "./api";
import { BandInput } from "./BandInput";
import { binder, InputError, InputGroup } from "./InputGroup";
import { ModelInputs } from "./ModelInputs";
import { SamplingInputs } from "./SamplingInputs";
import type { SketchPageProps } from "./SketchPage";
import { SketchPanels } from "./SketchPanels";
import { StationPicker } from "./StationPicker";
import { CopyLinkButton, StatusBar } from "./StatusBar";
import { TargetInputs } from "./TargetInputs";
import { useSketchState } from "./useUrlState";

const CODEC = { read: readSketchState, write: writeSketchState };

export function Sketchpad({ registry, defaults, multiSite, savedTargets = [] }: SketchPageProps) {
  const { state, settled, pending, set } = useSketchState(CODEC, { defaults, multiSite });
  const field = binder(state, set);

  const built = useMemo(() => buildCoverageRequest(settled, registry), [settled, registry]);
  const ephemerisBody = useMemo(
    () => (settled.sampling === "night" ? buildEphemerisRequest(settled, registry) : null),
    [settled, registry],
  );
  const coverage = useApi<CoverageResponse>(href("/api/coverage"), built.ok ? built.body : null);
  const ephemeris = useApi<EphemerisResponse>(href("/api/ephemeris"), ephemerisBody);

  // The last good answer and the request it answers (panels read their inputs from that request).
  const lastGood = useRef<{ result: CoverageResponse; body: CoverageBody; elapsedMs: number } | null>(null);
  if (coverage.data && lastGood.current?.result !== coverage.data.result) {
    lastGood.current = {
      result: coverage.data.result,
      body: JSON.parse(coverage.data.request) as CoverageBody,
      elapsedMs: coverage.data.elapsedMs,
    };
  }
  const shown = lastGood.current;
  const currentKey = built.ok ? JSON.stringify(built.body) : null;
  const upToDate = shown !== null && currentKey !== null && coverage.data?.request === currentKey && !coverage.error;

  const { errors, formError } = inputErrors(
    built,
    [coverage.error, ephemerisBody ? ephemeris.error : undefined],
    settled.sampling,
  );

  const busy = pending || coverage.isValidating || ephemeris.isValidating;
  const waiting = !built.ok && built.waiting;
  const stations = pickedStations(settled, registry);

  function fillExample() {
    set({ name: state.name || "Example field", ...exampleTarget(state.date || defaults.date, registry.site) });
  }

  const statusText = pending
    ? "Waiting for you to finish typing…"
    : coverage.isValidating
      ? "Computing the sketch…"
      : built.ok && coverage.error
        ? coverage.error.retryAfterS !== null
          ? `The server is busy: asking again in ${coverage.error.retryAfterS} s`
          : "Not computed: fix the marked input"
        : built.ok && upToDate
          ? `Up to date (${((coverage.data?.elapsedMs ?? 0) / 1000).toFixed(2)} s round trip)`
          : built.ok
            ? "Ready"
            : waiting
              ? "Waiting for a target"
              : "Fix the marked inputs to update";

  return (
    <>
      <PageHeader
        title="Sketchpad"
        lead={`Try a target on the ${registry.site.name}: uv coverage, elevation through the night, dirty beam, visibilities and closure phases update as you type. The address keeps every input, so a sketch can be shared.`}
        actions={<CopyLinkButton />}
      />
      <div className="grid gap-6 lg:grid-cols-[20rem_minmax(0,1fr)]">
        <form
          aria-label="Sketch inputs"
          onSubmit={(e) => e.preventDefault()}
          className="space-y-4 lg:sticky lg:top-4 lg:max-h-[calc(100vh-2rem)] lg:self-start lg:overflow-y-auto lg:pb-4 lg:pr-1"
        >
          <TargetInputs state={state} set={set} errors={errors} onExample={fillExample} savedTargets={savedTargets} />
          <StationPicker state={state} set={set} errors={errors} registry={registry} />
          <InputGroup title="Instrument">
            <BandInput state={state} set={set} errors={errors} registry={registry} />
            <SelectField
              label="Beam weighting"
              {...field("weighting", "wt")}
              error={errors.weighting}
              hint="Natural: best sensitivity; uniform: sharper beam, higher sidelobes."
            >
              <option value="natural">Natural</option>
              <option value="uniform">Uniform</option>
              <option value="robust">Robust (R = 0)</option>
            </SelectField>
          </InputGroup>
          <ModelInputs state={state} set={set} errors={errors} />
          <SamplingInputs state={state} set={set} errors={errors} site={registry.site} />
        </form>

        <div className="min-w-0 space-y-4" aria-busy={busy}>
          <StatusBar busy={busy} text={statusText} problem={!waiting && (!built.ok || !!coverage.error)}>
            {shown ? (
              <span className="text-sm text-night-600">
                {shown.body.target.name ? `${shown.body.target.name}: ` : ""}
                {formatRightAscension(shown.body.target.raDeg, 1)} {formatDeclination(shown.body.target.decDeg, 0)} ·{" "}
                {shown.body.stations.map((s) => s.name).join(" ")} ·{" "}
                {shown.body.night ? `night of ${shown.body.night.date}` : "hour angles"}
              </span>
            ) : null}
          </StatusBar>
          <InputError message={formError} boxed />
          {shown && !upToDate && !busy && !waiting ? (
            <p
              role="status"
              className="rounded-lg border border-caution-700/30 bg-caution-50 p-3 text-sm text-caution-700"
            >
              These panels show the last sketch that could be computed. Fix the input marked in red to update them.
            </p>
          ) : null}

          {shown && !(waiting && !busy) ? (
            <SketchPanels
              shown={shown}
              ephemeris={ephemeris.data?.result}
              site={registry.site}
              uvUnit={state.uvUnit}
              onUvUnit={(uvUnit) => set({ uvUnit })}
            />
          ) : waiting ? (
            <EmptyState
              title="Type a target to start"
              action={<Button onClick={fillExample}>Try a target that is up tonight</Button>}
            >
              Give the right ascension and declination (J2000) on the left. {stations.length} stations are chosen; the
              panels appear as soon as the coordinates are complete.
            </EmptyState>
          ) : !built.ok || coverage.error ? (
            <EmptyState title="Nothing to draw yet">
              Fix the inputs marked in red on the left
              {coverage.error && !formError
                ? `: ${apiErrorText(coverage.error.field, coverage.error.message, settled.sampling)}`
                : ""}
              .
            </EmptyState>
          ) : (
            <EmptyState title="Computing the first sketch…">This takes about a second.</EmptyState>
          )}
        </div>
      </div>
    </>
  );
}
