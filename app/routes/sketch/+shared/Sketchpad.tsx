/**
 * The Sketchpad: inputs on the left (on top on narrow screens), live panels on the right. Inputs live
 * in the URL; the settled inputs (a pick at once, typing once it pauses) are turned into API requests
 * fetched with SWR, a superseded request cancelled: the coverage without the beam (quick: uv tracks,
 * visibilities, closure phases, elevation), the same coverage with the dirty beam and its images (the
 * slow part, drawn last), and the night's ephemeris. The last good answer stays on screen while a new one is being computed or while an input
 * is invalid. The status line tells how long a change took until its plots were drawn.
 */
import { useCallback, useEffect, useMemo, useRef, useState } from "react";
import { href } from "react-router";
import { ImagingPreview } from "~/components/imaging/ImagingPreview";
import { whenDrawn } from "~/components/plots/draw-queue";
import type { UvUnit } from "~/components/plots/UvPlanePanel";
import { Button, ButtonLink, EmptyState, PageHeader, SelectField } from "~/components/ui";
import type { CoverageResponse, EphemerisResponse } from "~/engine";
import { apiErrorText, inputErrors } from "~/services/sketch/api-errors";
import { pickedStations } from "~/services/sketch/registry";
import { buildCoverageRequest, buildEphemerisRequest, type CoverageBody } from "~/services/sketch/request";
import { exampleTarget, readSketchState, trianglesHref, writeSketchState } from "~/services/sketch/state";
import { plural, sketchStatus } from "~/services/sketch/words";
import { useApi } from "./api";
import { BandInput } from "./BandInput";
import { binder, InputError, InputGroup } from "./InputGroup";
import { ModelInputs } from "./ModelInputs";
import { SamplingInputs } from "./SamplingInputs";
import { SketchCalibrators } from "./SketchCalibrators";
import type { SketchPageProps } from "./SketchPage";
import { type Shown, SketchPanels } from "./SketchPanels";
import { StationPicker } from "./StationPicker";
import { CopyLinkButton, ShownTarget, StatusBar } from "./StatusBar";
import { TargetInputs } from "./TargetInputs";
import { useSketchState } from "./useUrlState";

const CODEC = { read: readSketchState, write: writeSketchState };

/**
 * How long the last change took until its plots were drawn: once the answers for the current inputs
 * are at hand (`complete`), waits for the page's draw queue to empty. Null until then.
 */
function useDrawnMs(complete: boolean, changedAt: number): number | null {
  const [drawn, setDrawn] = useState<{ changedAt: number; ms: number } | null>(null);
  useEffect(() => {
    if (!complete) return;
    let live = true;
    void whenDrawn().then(() => {
      if (live) setDrawn({ changedAt, ms: performance.now() - changedAt });
    });
    return () => {
      live = false;
    };
  }, [complete, changedAt]);
  return drawn && drawn.changedAt === changedAt ? drawn.ms : null;
}

export function Sketchpad({ registry, defaults, multiSite, savedTargets = [] }: SketchPageProps) {
  const { state, settled, changedAt, pending, set, type } = useSketchState(CODEC, { defaults, multiSite });
  const field = binder(state, set);

  const built = useMemo(() => buildCoverageRequest(settled, registry), [settled, registry]);
  const ephemerisBody = useMemo(
    () => (settled.sampling === "night" ? buildEphemerisRequest(settled, registry) : null),
    [settled, registry],
  );
  const bodies = useMemo(() => (built.ok ? { light: { ...built.body, beam: null }, beam: built.body } : null), [built]);
  const imagingCoverage = useMemo(() => (built.ok ? { ...built.body, beam: null } : null), [built]);
  const coverage = useApi<CoverageResponse>(href("/api/coverage"), bodies?.light ?? null);
  const withBeam = useApi<CoverageResponse>(href("/api/coverage"), bodies?.beam ?? null);
  const ephemeris = useApi<EphemerisResponse>(href("/api/ephemeris"), ephemerisBody);

  // The last good answers and the request they answer (panels read their inputs from that request).
  const lastGood = useRef<Shown | null>(null);
  if (coverage.data && lastGood.current?.result !== coverage.data.result) {
    lastGood.current = { result: coverage.data.result, body: JSON.parse(coverage.data.request) as CoverageBody };
  }
  const shown = lastGood.current;
  const lastBeam = useRef<CoverageResponse["beam"] | undefined>(undefined);
  if (withBeam.data) lastBeam.current = withBeam.data.result.beam;
  const upToDate = shown !== null && built.ok && coverage.current && !coverage.error;
  const complete = upToDate && withBeam.current && !withBeam.error && (ephemerisBody === null || ephemeris.current);
  const drawnMs = useDrawnMs(complete, changedAt);

  const { errors, formError } = inputErrors(
    built,
    [coverage.error, withBeam.error, ephemerisBody ? ephemeris.error : undefined],
    settled.sampling,
  );

  const waiting = !built.ok && built.waiting;
  const refusal = coverage.error ?? withBeam.error;
  const stations = pickedStations(settled, registry);
  const status = sketchStatus({
    typing: pending,
    computing: built.ok && !(coverage.current && withBeam.current),
    refused: !!(coverage.error || withBeam.error),
    busyRetryS: refusal?.retryAfterS ?? null,
    ready: built.ok,
    waitingForTarget: waiting,
    answered: complete,
    drawnMs,
    opened: changedAt === 0,
  });

  const fillExample = () =>
    set({ name: state.name || "Example field", ...exampleTarget(state.date || defaults.date, registry.site) });
  const onUvUnit = useCallback((uvUnit: UvUnit) => set({ uvUnit }), [set]);
  const groups = { state, set, type, errors };

  return (
    <>
      <PageHeader
        title="Sketchpad"
        lead={`Try a target on the ${registry.site.name}: uv coverage, elevation through the night, dirty beam, visibilities and closure phases update as you type. The address keeps every input, so a sketch can be shared.`}
        actions={
          <>
            {built.ok ? (
              <ButtonLink to={trianglesHref(settled)} variant="secondary">
                Rank triangles for this target
              </ButtonLink>
            ) : null}
            <CopyLinkButton />
          </>
        }
      />
      <div className="grid gap-6 lg:grid-cols-[20rem_minmax(0,1fr)]">
        <form
          aria-label="Sketch inputs"
          onSubmit={(e) => e.preventDefault()}
          className="space-y-4 lg:sticky lg:top-4 lg:max-h-[calc(100vh-2rem)] lg:self-start lg:overflow-y-auto lg:pb-4 lg:pr-1"
        >
          <TargetInputs {...groups} onExample={fillExample} savedTargets={savedTargets} />
          <StationPicker state={state} set={set} errors={errors} registry={registry} />
          <InputGroup title="Instrument">
            <BandInput {...groups} registry={registry} />
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
          <ModelInputs {...groups} />
          <SamplingInputs {...groups} site={registry.site} />
        </form>

        <div className="min-w-0 space-y-4" aria-busy={status.busy}>
          <StatusBar busy={status.busy} text={status.text} problem={status.problem}>
            {shown ? <ShownTarget body={shown.body} /> : null}
          </StatusBar>
          <InputError message={formError} boxed />
          {shown && !upToDate && !status.busy && !waiting ? (
            <p
              role="status"
              className="rounded-lg border border-caution-700/30 bg-caution-50 p-3 text-sm text-caution-700"
            >
              These panels show the last sketch that could be computed. Fix the input marked in red to update them.
            </p>
          ) : null}

          {shown && !(waiting && !status.busy) ? (
            <>
              <SketchPanels
                shown={shown}
                beam={lastBeam.current}
                ephemeris={ephemeris.data?.result}
                site={registry.site}
                uvUnit={state.uvUnit}
                onUvUnit={onUvUnit}
              />
              <SketchCalibrators body={shown.body} date={settled.date || defaults.date} />
            </>
          ) : waiting ? (
            <EmptyState
              title="Type a target to start"
              action={<Button onClick={fillExample}>Try a target that is up tonight</Button>}
            >
              Give the right ascension and declination (J2000) on the left.{" "}
              {plural(stations.length, "station is", "stations are")} chosen; the panels appear as soon as the
              coordinates are complete.
            </EmptyState>
          ) : !built.ok || refusal ? (
            <EmptyState title="Nothing to draw yet">
              Fix the inputs marked in red on the left
              {refusal && !formError ? `: ${apiErrorText(refusal.field, refusal.message, settled.sampling)}` : ""}.
            </EmptyState>
          ) : (
            <EmptyState title="Computing the first sketch…">This takes about a second.</EmptyState>
          )}
          <ImagingPreview source={{ kind: "sketch", coverage: imagingCoverage }} />
        </div>
      </div>
    </>
  );
}
