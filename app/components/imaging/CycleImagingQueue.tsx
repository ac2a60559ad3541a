/**
 * The chair's imaging queue of a cycle: queue a preview for every imaging target of the cycle's
 * submitted proposals at once (default settings), and follow the queue — each preview's state,
 * progress, fidelity and verdict — polled while any is under way.
 */
import { useState } from "react";
import { Alert, Badge, Button, Card, type Column, DataTable } from "~/components/ui";
import { formatUtc } from "~/lib/format";
import { type ImagingJob, STATE_LABELS, startImaging, useImagingJobs } from "./api";

const COLUMNS: Column<ImagingJob>[] = [
  { key: "label", header: "Target", value: (j) => j.label },
  {
    key: "state",
    header: "State",
    value: (j) => STATE_LABELS[j.state],
    render: (j) => (
      <Badge tone={j.state === "failed" ? "danger" : j.state === "done" ? "ok" : "info"}>{STATE_LABELS[j.state]}</Badge>
    ),
  },
  { key: "iteration", header: "Iteration", align: "right", value: (j) => j.progress.iteration },
  {
    key: "chi2",
    header: "Reduced χ²",
    align: "right",
    value: (j) => (j.progress.chi2 === null ? null : Number(j.progress.chi2.toFixed(2))),
  },
  { key: "error", header: "Error", value: (j) => j.error },
  { key: "created", header: "Queued", unit: "UTC", value: (j) => formatUtc(new Date(j.createdAt)).replace(" UTC", "") },
];

export function CycleImagingQueue({ cycleId, cycleName }: { cycleId: number; cycleName: string }) {
  const list = useImagingJobs(`/api/imaging/jobs?cycleId=${cycleId}`);
  const [problem, setProblem] = useState<string | null>(null);
  const [queued, setQueued] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const jobs = list.data?.jobs ?? [];
  const counts: Record<string, number> = {};
  for (const j of jobs) counts[j.state] = (counts[j.state] ?? 0) + 1;
  const queueAll = async () => {
    setBusy(true);
    setProblem(null);
    setQueued(null);
    try {
      const answer = await startImaging({ source: { kind: "cycle", cycleId } });
      setQueued(`${answer.jobs.length} previews queued.`);
      await list.mutate();
    } catch (e) {
      setProblem((e as Error).message);
    } finally {
      setBusy(false);
    }
  };
  return (
    <Card id="cycle-imaging" title="Imaging previews" className="space-y-3">
      <p className="text-sm text-night-700">
        One preview (default settings: 64² grid, maximum entropy, automatic weight, 5 % V² and 2° closure-phase errors)
        for every target of {cycleName}'s submitted proposals that asks for an image: a target with structure (not a
        point) on a proposal requesting a configuration of four stations or more. Reviewers see them on each proposal's
        page.
      </p>
      <div className="flex flex-wrap items-center gap-3">
        <Button onClick={queueAll} disabled={busy}>
          {busy ? "Queueing…" : "Queue previews for every imaging target"}
        </Button>
        <p className="text-sm text-night-700" aria-live="polite">
          {queued ? `${queued} ` : ""}
          {jobs.length > 0
            ? `Queue: ${counts.queued ?? 0} waiting, ${counts.running ?? 0} running, ${counts.done ?? 0} done, ${counts.failed ?? 0} failed, ${counts.cancelled ?? 0} cancelled.`
            : ""}
        </p>
      </div>
      {problem ? <Alert>{problem}</Alert> : null}
      {list.error ? <Alert>{list.error.message}</Alert> : null}
      <DataTable
        columns={COLUMNS}
        rows={jobs}
        caption={`Imaging previews queued for ${cycleName}`}
        exportName={`imaging-queue-${cycleName.replace(/[^\w.-]+/g, "_")}`}
        empty="No preview queued for this cycle yet."
      />
    </Card>
  );
}
