import { Card, type Column, DataTable } from "~/components/ui";
import type { CandidateRow } from "~/services/nights/queries.server";
import { utcTime } from "~/services/nights/sky";

const hm = (iso: string) => utcTime(iso).slice(0, 5);
const round2 = (x: number) => Math.round(x * 100) / 100;

/** Hours of a program, to 0.01 h. */
function hoursColumn(key: string, header: string, hours: (c: CandidateRow) => number): Column<CandidateRow> {
  return { key, header, unit: "h", align: "right", value: (c) => round2(hours(c)) };
}

const columns: Column<CandidateRow>[] = [
  { key: "rank", header: "Rank", align: "right", value: (c) => c.rank },
  { key: "target", header: "Target", value: (c) => c.key },
  {
    key: "program",
    header: "Program",
    value: (c) => c.proposalTitle,
    render: (c) => (
      <span>
        {c.proposalTitle}
        <span className="block text-xs text-night-600">PI {c.piName}</span>
      </span>
    ),
  },
  hoursColumn("granted", "Granted", (c) => c.grantedHours),
  hoursColumn("owed", "Owed at dusk", (c) => c.owedHours),
  hoursColumn("tonight", "Executed tonight", (c) => c.executedTonightHours),
  hoursColumn("owedNow", "Still owed", (c) => c.owedNowHours),
  {
    key: "window",
    header: "Window tonight (UTC)",
    value: (c) =>
      c.window?.runs.length ? c.window.runs.map((r) => `${hm(r.startUtc)}–${hm(r.endUtc)}`).join(", ") : null,
    render: (c) =>
      c.window?.runs.length ? (
        <span className="num">
          {c.window.runs.map((r) => `${hm(r.startUtc)}–${hm(r.endUtc)} (${r.hours.toFixed(1)} h)`).join(", ")}
        </span>
      ) : (
        <span className="text-caution-700">{c.window?.reason ?? "—"}</span>
      ),
  },
  { key: "maxEl", header: "Highest", unit: "°", align: "right", value: (c) => c.window?.maxElevationDeg ?? null },
  {
    key: "moon",
    header: "Moon distance",
    unit: "°",
    align: "right",
    value: (c) => c.window?.minMoonSeparationDeg ?? null,
  },
  {
    key: "calibrators",
    header: "Calibrators",
    value: (c) => c.calibrators.map((k) => k.name).join(", ") || null,
    render: (c) =>
      c.calibrators.length ? (
        c.calibrators.map((k) => k.name).join(", ")
      ) : (
        <span className="text-caution-700">none listed</span>
      ),
  },
];

/** Targets of accepted programs for the night's configuration, with what they are owed and when they can be seen. */
export function CandidatesCard({ candidates, date }: { candidates: CandidateRow[]; date: string }) {
  return (
    <Card title="Candidates">
      <p className="mb-3 text-sm text-night-600">
        Targets of accepted programs with hours on this configuration. A target is granted its share of the program's
        hours (the requested hours until the committee's allocation is stored); it is owed at dusk what other nights
        have not executed, and still owed that less what this night executed. Rank is the committee's order (the order
        of submission until the ranking is stored). The window is when the target is above its limit, in darkness,
        within the delay lines and away from the Moon; the Moon distance is the least during darkness. Calibrators are
        the proposal's own.
      </p>
      <DataTable
        columns={columns}
        rows={candidates}
        rowKey={(c) => c.proposalTargetId}
        caption={`Candidate targets of the night of ${date}`}
        exportName={`candidates-${date}`}
        empty="No accepted program has hours on this configuration."
      />
    </Card>
  );
}
