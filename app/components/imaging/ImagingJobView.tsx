/**
 * One imaging preview as it goes: state, live progress (iteration, reduced χ²), Cancel for its owner,
 * the error of a failed one; once done, the three images, χ² per observable, the fidelity figure and the
 * verdict in plain words, and the OIFITS 2 download.
 */
import { useState } from "react";
import { Alert, Badge, type BadgeTone, Button, buttonClass } from "~/components/ui";
import { formatUtc } from "~/lib/format";
import { REGULARIZER_LABELS } from "~/services/imaging/schemas";
import { cancelImaging, type ImagingJob, oifitsUrl, STATE_LABELS, useImagingJob } from "./api";
import { ImagingImages } from "./ImagingImages";

const TONES: Record<ImagingJob["state"], BadgeTone> = {
  queued: "info",
  running: "accent",
  done: "ok",
  failed: "danger",
  cancelled: "neutral",
};

type Result = {
  gridSize: number;
  pixelMas: number;
  fieldOfViewMas: number;
  image: number[];
  modelImage?: number[];
  dirtyImage?: number[];
  chi2Vis2: number;
  chi2ClosurePhase: number;
  iterations: number;
  converged: boolean;
  weight: number;
  weightAuto: boolean;
  fidelity?: { ncc: number; verdict: string; recovered: boolean };
  simulation: { vis2Count: number; closurePhaseCount: number; closurePhaseTriangles: "all" | "independent" };
};

const f = (x: number | null | undefined, d = 2) =>
  x === null || x === undefined || !Number.isFinite(x) ? "—" : x.toFixed(d);

function Progress({ job }: { job: ImagingJob }) {
  const { iteration, chi2, iterationBudget } = job.progress;
  const fixed = job.settings.weight !== "auto" && iterationBudget > 0;
  return (
    <div className="space-y-2" aria-live="polite">
      <p className="text-sm text-night-700" data-testid="imaging-progress">
        {job.state === "queued"
          ? "Queued: a worker will take it in a moment."
          : `Iteration ${iteration}${fixed ? ` of at most ${iterationBudget}` : ""}, reduced χ² ${f(chi2)}`}
        {job.attempts > 1 ? ` (attempt ${job.attempts}: the first worker went away, another took it over)` : ""}
      </p>
      {job.state === "running" && fixed ? (
        <progress
          className="h-2 w-full accent-ember-600"
          max={iterationBudget}
          value={Math.min(iteration, iterationBudget)}
          aria-label="Iterations done of the most allowed"
        />
      ) : null}
      {job.state === "running" && !fixed ? (
        <p className="text-xs text-night-600">
          The automatic weight first runs short trials to bring the reduced χ² near 1; the count includes them.
        </p>
      ) : null}
    </div>
  );
}

function Results({ job, result }: { job: ImagingJob; result: Result }) {
  const s = job.settings;
  return (
    <div className="space-y-4">
      {result.fidelity ? (
        <div
          className={`rounded-lg border p-3 ${result.fidelity.recovered ? "border-ok-700/30 bg-ok-50 text-ok-700" : "border-caution-700/30 bg-caution-50 text-caution-700"}`}
        >
          <p className="font-semibold" data-testid="imaging-verdict">
            {result.fidelity.verdict.charAt(0).toUpperCase() + result.fidelity.verdict.slice(1)}
          </p>
          <p className="text-sm">
            Fidelity {f(result.fidelity.ncc, 3)} (normalized cross-correlation of the reconstruction with the model,
            both seen through the clean beam; 1 is a perfect match).
          </p>
        </div>
      ) : null}
      {result.modelImage && result.dirtyImage ? (
        <ImagingImages
          gridSize={result.gridSize}
          pixelMas={result.pixelMas}
          model={result.modelImage}
          dirty={result.dirtyImage}
          reconstruction={result.image}
        />
      ) : null}
      <dl className="grid grid-cols-2 gap-x-4 gap-y-2 text-sm sm:grid-cols-4" data-testid="imaging-figures">
        <div>
          <dt className="text-night-600">Reduced χ², V²</dt>
          <dd className="num font-semibold">{f(result.chi2Vis2)}</dd>
        </div>
        <div>
          <dt className="text-night-600">Reduced χ², closure phases</dt>
          <dd className="num font-semibold">{f(result.chi2ClosurePhase)}</dd>
        </div>
        <div>
          <dt className="text-night-600">Data</dt>
          <dd className="num">
            {result.simulation.vis2Count} V², {result.simulation.closurePhaseCount} closure phases (
            {result.simulation.closurePhaseTriangles === "all" ? "every triangle" : "independent triangles"})
          </dd>
        </div>
        <div>
          <dt className="text-night-600">Image</dt>
          <dd className="num">
            {result.gridSize}² × {f(result.pixelMas, 3)} mas (field {f(result.fieldOfViewMas, 1)} mas)
          </dd>
        </div>
        <div>
          <dt className="text-night-600">Regularizer</dt>
          <dd>
            {REGULARIZER_LABELS[s.regularizer]}, weight {f(result.weight, 4)}
            {result.weightAuto ? " (automatic)" : ""}
          </dd>
        </div>
        <div>
          <dt className="text-night-600">Iterations</dt>
          <dd className="num">
            {result.iterations} {result.converged ? "(converged)" : "(stopped at the limit)"}
          </dd>
        </div>
        <div>
          <dt className="text-night-600">Errors simulated</dt>
          <dd className="num">
            {f(s.vis2Relative * 100, 1)} % on V², {f(s.closurePhaseDeg, 1)}° on closure phases, seed {s.seed}
          </dd>
        </div>
        <div>
          <dt className="text-night-600">Finished</dt>
          <dd className="num">{job.finishedAt ? formatUtc(new Date(job.finishedAt)) : "—"}</dd>
        </div>
      </dl>
    </div>
  );
}

export function ImagingJobView({ jobId }: { jobId: number }) {
  const { data: job, error, mutate } = useImagingJob(jobId);
  const [cancelError, setCancelError] = useState<string | null>(null);
  const [cancelling, setCancelling] = useState(false);
  if (error) return <Alert>{error.message}</Alert>;
  if (!job) return <p className="text-sm text-night-600">Loading the preview…</p>;
  const active = job.state === "queued" || job.state === "running";
  const cancel = async () => {
    setCancelling(true);
    setCancelError(null);
    try {
      await mutate(await cancelImaging(job.id), { revalidate: false });
    } catch (e) {
      setCancelError((e as Error).message);
    } finally {
      setCancelling(false);
    }
  };
  return (
    <div className="space-y-3" data-testid="imaging-job" data-state={job.state}>
      <div className="flex flex-wrap items-center justify-between gap-2">
        <p className="flex flex-wrap items-center gap-2 text-sm">
          <Badge tone={TONES[job.state]}>{STATE_LABELS[job.state]}</Badge>
          <span className="font-medium">{job.label}</span>
          <span className="text-night-600">started {formatUtc(new Date(job.createdAt))}</span>
        </p>
        <div className="flex flex-wrap gap-2">
          {active && !job.readOnly ? (
            <Button variant="secondary" size="sm" onClick={cancel} disabled={cancelling}>
              Cancel
            </Button>
          ) : null}
          {job.hasOifits ? (
            <a className={buttonClass("secondary", "sm")} href={oifitsUrl(job.id)} download>
              Download OIFITS
            </a>
          ) : null}
        </div>
      </div>
      {cancelError ? <Alert>{cancelError}</Alert> : null}
      {active ? <Progress job={job} /> : null}
      {job.state === "failed" ? <Alert>{job.error ?? "The preview failed."}</Alert> : null}
      {job.state === "cancelled" ? <p className="text-sm text-night-600">This preview was cancelled.</p> : null}
      {job.state === "done" && job.result ? <Results job={job} result={job.result as unknown as Result} /> : null}
    </div>
  );
}
