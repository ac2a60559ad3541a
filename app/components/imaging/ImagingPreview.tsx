/**
 * The "Imaging preview" panel: would this coverage deliver an image? Settings, Start, then the job's
 * live progress and results (./ImagingJobView.tsx). Used on the Sketchpad (the sketch as it stands), on
 * a proposal's target, and read-only on the Review desk and for the proposal's team (`readOnly`): there
 * it shows the previews made for the proposal's targets.
 */
import { type ReactNode, useState } from "react";
import { Alert, Button } from "~/components/ui";
import { formatUtc } from "~/lib/format";
import { ImagingApiError, type ImagingJob, STATE_LABELS, startImaging, useImagingJobs } from "./api";
import { ImagingJobView } from "./ImagingJobView";
import { DEFAULT_DRAFT, ImagingSettingsForm, type SettingsDraft, settingsBody } from "./ImagingSettingsForm";

export type ImagingSource =
  | { kind: "sketch"; coverage: Record<string, unknown> | null }
  | { kind: "proposalTarget"; proposalId: number; targetId: number }
  | { kind: "proposal"; proposalId: number };

function listUrl(source: ImagingSource) {
  return source.kind === "sketch"
    ? "/api/imaging/jobs?source=sketch"
    : `/api/imaging/jobs?proposalId=${source.proposalId}`;
}

function jobChoiceText(j: ImagingJob) {
  return `${j.label} — ${STATE_LABELS[j.state].toLowerCase()}, ${formatUtc(new Date(j.createdAt))}`;
}

export function ImagingPreview({
  source,
  readOnly = false,
  intro,
}: {
  source: ImagingSource;
  readOnly?: boolean;
  intro?: ReactNode;
}) {
  const list = useImagingJobs(listUrl(source));
  const jobs = (list.data?.jobs ?? []).filter(
    (j) => source.kind !== "proposalTarget" || j.proposalTargetId === source.targetId,
  );
  const [chosen, setChosen] = useState<number | null>(null);
  const [draft, setDraft] = useState<SettingsDraft>(DEFAULT_DRAFT);
  const [problem, setProblem] = useState<ImagingApiError | null>(null);
  const [starting, setStarting] = useState(false);
  const shownId = chosen ?? (readOnly ? (jobs.find((j) => j.state === "done") ?? jobs[0]) : jobs[0])?.id ?? null;

  const canStart = !readOnly && source.kind !== "proposal" && (source.kind !== "sketch" || source.coverage !== null);
  const start = async () => {
    if (source.kind === "proposal") return;
    setStarting(true);
    setProblem(null);
    try {
      const body =
        source.kind === "sketch"
          ? { source: { kind: "sketch", coverage: source.coverage }, settings: settingsBody(draft) }
          : { source, settings: settingsBody(draft) };
      const answer = await startImaging(body);
      setChosen(answer.jobs[0].id);
      await list.mutate();
    } catch (e) {
      setProblem(e instanceof ImagingApiError ? e : new ImagingApiError(0, String(e), null));
    } finally {
      setStarting(false);
    }
  };
  const errors: Record<string, string> = problem?.field?.startsWith("settings.")
    ? { [problem.field]: problem.message }
    : {};

  return (
    <section
      aria-labelledby="imaging-preview-title"
      className="min-w-0 space-y-4 rounded-[var(--radius-card)] bg-white p-4 shadow-[var(--shadow-card)] ring-1 ring-night-200"
      data-testid="imaging-preview"
    >
      <header className="space-y-1">
        <h2 id="imaging-preview-title" className="text-base font-semibold">
          Imaging preview
        </h2>
        <p className="text-sm text-night-700">
          {intro ??
            "Simulates the squared visibilities and closure phases this coverage would measure, with noise, then reconstructs an image from them: does the coverage support imaging?"}
        </p>
      </header>
      {canStart ? (
        <div className="space-y-3">
          <ImagingSettingsForm
            draft={draft}
            onChange={(d) => {
              setDraft(d);
              setProblem(null);
            }}
            errors={errors}
            disabled={starting}
          />
          {problem && !errors[problem.field ?? ""] ? <Alert>{problem.message}</Alert> : null}
          <Button onClick={start} disabled={starting}>
            {starting ? "Starting…" : "Start the preview"}
          </Button>
        </div>
      ) : !readOnly && source.kind === "sketch" ? (
        <p className="text-sm text-night-600">Complete the sketch (target, stations, band) to start a preview.</p>
      ) : null}
      {list.error ? <Alert>{list.error.message}</Alert> : null}
      {jobs.length > 1 ? (
        <label className="block max-w-xl space-y-1 text-sm">
          <span className="font-medium text-night-800">Preview shown</span>
          <select
            className="block w-full rounded-lg border border-night-300 bg-white px-3 py-2"
            value={shownId ?? ""}
            onChange={(e) => setChosen(Number(e.target.value))}
          >
            {jobs.map((j) => (
              <option key={j.id} value={j.id}>
                {jobChoiceText(j)}
              </option>
            ))}
          </select>
        </label>
      ) : null}
      {shownId !== null ? (
        <ImagingJobView key={shownId} jobId={shownId} />
      ) : list.data ? (
        <p className="text-sm text-night-600">
          {readOnly
            ? "No imaging preview has been made for this proposal yet."
            : "No preview yet: choose the settings and start one."}
        </p>
      ) : null}
    </section>
  );
}
