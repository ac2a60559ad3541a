/**
 * The Sketchpad: inputs on the left (on top on narrow screens), live panels on the right. Inputs live
 * in the URL; the settled inputs are turned into API requests (coverage with beam images, and the
 * night's ephemeris) fetched with SWR. The last good answer stays on screen while a new one is being
 * computed or while an input is invalid.
 */
import { useMemo, useRef, useState } from "react";
import { Button, cx, EmptyState, PageHeader, SelectField } from "~/components/ui";
import { formatDeclination, formatRightAscension } from "~/lib/coordinates";
import { cautions as cautionLines } from "~/services/sketch/figures";
import {
  angularSeparationDeg,
  observableWindows,
  raTransitingAtMidnight,
  sunSeparationDeg,
} from "~/services/sketch/night";
import {
  apiErrorText,
  buildCoverageRequest,
  buildEphemerisRequest,
  type CoverageBody,
  type FieldErrors,
  inputForApiField,
  pickedStations,
  type SketchRegistry,
} from "~/services/sketch/request";
import {
  readSketchState,
  type SavedTarget,
  type SketchState,
  type StateDefaults,
  writeSketchState,
} from "~/services/sketch/state";
import { type CoverageResponse, type EphemerisResponse, useApi } from "./api";
import { BeamPanel } from "./BeamPanel";
import { ElevationPanel } from "./ElevationPanel";
import { BandInput, InputGroup, ModelInputs, SamplingInputs, TargetInputs } from "./InputFields";
import { StationPicker } from "./StationPicker";
import { FiguresPanel, NotesPanel } from "./SummaryPanels";
import { UvPlanePanel } from "./UvPlanePanel";
import { useUrlState } from "./useUrlState";
import { ClosurePanel, VisibilityPanel } from "./VisibilityPanels";

export function CopyLinkButton() {
  const [status, setStatus] = useState<string>("");
  return (
    <div className="flex items-center gap-2">
      <Button
        variant="secondary"
        onClick={async () => {
          try {
            await navigator.clipboard.writeText(window.location.href);
            setStatus("Link copied.");
          } catch {
            setStatus("Copying was refused: copy the address bar instead.");
          }
        }}
      >
        Copy link
      </Button>
      <span role="status" aria-live="polite" className="text-sm text-night-600">
        {status}
      </span>
    </div>
  );
}

export function Busy({ busy, text, problem = false }: { busy: boolean; text: string; problem?: boolean }) {
  return (
    <span role="status" aria-live="polite" className="inline-flex items-center gap-2 text-sm text-night-700">
      <span
        aria-hidden="true"
        className={cx(
          "inline-block h-3 w-3 rounded-full",
          busy ? "animate-pulse bg-ember-500" : problem ? "bg-danger-700" : "bg-ok-700",
        )}
      />
      {text}
    </span>
  );
}

export function Sketchpad({
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
  const { state, settled, pending, set } = useUrlState<SketchState>(
    (p) => readSketchState(p, defaults),
    writeSketchState,
    multiSite ? ["site"] : [],
  );

  const built = useMemo(() => buildCoverageRequest(settled, registry), [settled, registry]);
  const ephemerisBody = useMemo(
    () => (settled.sampling === "night" ? buildEphemerisRequest(settled, registry) : null),
    [settled, registry],
  );
  const coverage = useApi<CoverageResponse>("/api/coverage", built.ok ? built.body : null);
  const ephemeris = useApi<EphemerisResponse>("/api/ephemeris", ephemerisBody);

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

  const errors: FieldErrors = built.ok ? {} : { ...built.errors };
  let formError: string | null = null;
  for (const err of [coverage.error, ephemerisBody ? ephemeris.error : undefined]) {
    if (!err) continue;
    const key = inputForApiField(err.field, settled.sampling);
    const text = apiErrorText(err.field, err.message, settled.sampling);
    if (key === "form") formError = text;
    else if (!errors[key]) errors[key] = text;
  }

  const busy = pending || coverage.isValidating || ephemeris.isValidating;
  const waiting = !built.ok && built.waiting;
  const stations = pickedStations(settled, registry);

  const shownEphemeris = ephemeris.data?.result;
  const notes = useMemo(() => {
    if (!shown) return { cautions: [] as string[], moon: null as string | null };
    const body = shown.body;
    const stepMin = body.night?.stepMin ?? null;
    let sunSep: number | null = null;
    let moon: string | null = null;
    let duskMs: number | null = null;
    let dawnMs: number | null = null;
    if (shownEphemeris && body.night && shownEphemeris.date === body.night.date) {
      const midnight = Date.parse(shownEphemeris.localMidnightUtc);
      sunSep = sunSeparationDeg(body.target.raDeg, body.target.decDeg, midnight);
      const moonSep = angularSeparationDeg(
        body.target.raDeg,
        body.target.decDeg,
        shownEphemeris.moonRaDeg,
        shownEphemeris.moonDecDeg,
      );
      moon =
        `Moon at local midnight: ${Math.round(shownEphemeris.moonIlluminatedFraction * 100)} % illuminated, ` +
        `about ${moonSep.toFixed(0)}° from the target, altitude ${shownEphemeris.moonAltitudeDeg.toFixed(0)}°.`;
      duskMs = shownEphemeris.astronomicalDuskUtc ? Date.parse(shownEphemeris.astronomicalDuskUtc) : null;
      dawnMs = shownEphemeris.astronomicalDawnUtc ? Date.parse(shownEphemeris.astronomicalDawnUtc) : null;
    }
    const windows = stepMin === null ? [] : observableWindows(shown.result.samples, stepMin);
    return {
      cautions: cautionLines({
        sunSeparationDeg: sunSep,
        hourAngleSampling: stepMin === null,
        windows,
        duskMs,
        dawnMs,
        stepMin: stepMin ?? 0,
      }),
      moon,
    };
  }, [shown, shownEphemeris]);

  function fillExample() {
    const ra = raTransitingAtMidnight(state.date || defaults.date, registry.site.longitudeDeg);
    set({
      name: state.name || "Example field",
      ra: formatRightAscension(ra, 1),
      dec: formatDeclination(Math.round(registry.site.latitudeDeg) - 5, 0),
    });
  }

  const statusText = pending
    ? "Waiting for you to finish typing…"
    : coverage.isValidating
      ? "Computing the sketch…"
      : built.ok && coverage.error
        ? "Not computed: fix the marked input"
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
              name="wt"
              value={state.weighting}
              error={errors.weighting}
              hint="Natural: best sensitivity; uniform: sharper beam, higher sidelobes."
              onChange={(e) => set({ weighting: e.target.value as SketchState["weighting"] })}
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
          <div className="flex flex-wrap items-center justify-between gap-2 rounded-lg bg-white px-4 py-2 ring-1 ring-night-200">
            <Busy busy={busy} text={statusText} problem={!waiting && (!built.ok || !!coverage.error)} />
            {shown ? (
              <span className="text-sm text-night-600">
                {shown.body.target.name ? `${shown.body.target.name}: ` : ""}
                {formatRightAscension(shown.body.target.raDeg, 1)} {formatDeclination(shown.body.target.decDeg, 0)} ·{" "}
                {shown.body.stations.map((s) => s.name).join(" ")} ·{" "}
                {shown.body.night ? `night of ${shown.body.night.date}` : "hour angles"}
              </span>
            ) : null}
          </div>
          {formError ? (
            <p role="alert" className="rounded-lg border border-danger-700/30 bg-danger-50 p-3 text-sm text-danger-700">
              {formError}
            </p>
          ) : null}
          {shown && !upToDate && !busy && !waiting ? (
            <p
              role="status"
              className="rounded-lg border border-caution-700/30 bg-caution-50 p-3 text-sm text-caution-700"
            >
              These panels show the last sketch that could be computed. Fix the input marked in red to update them.
            </p>
          ) : null}

          {shown && !(waiting && !busy) ? (
            <div className="grid gap-4 xl:grid-cols-2">
              <FiguresPanel coverage={shown.result} stations={shown.body.stations.length} elapsedMs={shown.elapsedMs} />
              <UvPlanePanel coverage={shown.result} unit={state.uvUnit} onUnit={(uvUnit) => set({ uvUnit })} />
              <ElevationPanel
                coverage={shown.result}
                ephemeris={shownEphemeris}
                site={registry.site}
                raDeg={shown.body.target.raDeg}
                decDeg={shown.body.target.decDeg}
                stepMin={shown.body.night?.stepMin ?? null}
                minElevationDeg={shown.body.minElevationDeg}
              />
              <div className="xl:col-span-2">
                <BeamPanel beam={shown.result.beam} />
              </div>
              <VisibilityPanel coverage={shown.result} model={shown.body.target.model} />
              <ClosurePanel coverage={shown.result} />
              <NotesPanel coverage={shown.result} cautions={notes.cautions} moonLine={notes.moon} />
            </div>
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
