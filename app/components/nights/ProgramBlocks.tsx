/**
 * A program's nights, for its proposal page: the hours granted, planned, executed and still owed per
 * configuration, and every block of a published night plan that serves it. Feed it what
 * `programNights(db, { proposalId })` (app/services/nights/program.server.ts) returns, after the page's
 * own check that the viewer may see the proposal.
 */
import { Card, type Column, DataTable } from "~/components/ui";
import type { ProgramBlock, ProgramHours } from "~/services/nights/program.server";
import { OutcomeBadge } from "./OutcomeBadge";

const time = (iso: string) => `${iso.slice(11, 16)}`;

const hourColumns: Column<ProgramHours>[] = [
  { key: "configuration", header: "Configuration", value: (r) => r.configuration },
  { key: "granted", header: "Granted", unit: "h", align: "right", value: (r) => r.grantedHours },
  { key: "planned", header: "Planned", unit: "h", align: "right", value: (r) => r.plannedHours },
  { key: "executed", header: "Executed", unit: "h", align: "right", value: (r) => r.executedHours },
  { key: "owed", header: "Still owed", unit: "h", align: "right", value: (r) => r.owedHours },
];

const blockColumns: Column<ProgramBlock>[] = [
  { key: "night", header: "Night", value: (b) => b.night },
  {
    key: "start",
    header: "Start (UTC)",
    value: (b) => b.startUtc,
    render: (b) => <span className="num">{time(b.startUtc)} UTC</span>,
  },
  {
    key: "end",
    header: "End (UTC)",
    value: (b) => b.endUtc,
    render: (b) => <span className="num">{time(b.endUtc)} UTC</span>,
  },
  {
    key: "block",
    header: "Block",
    value: (b) => (b.kind === "science" ? `Science: ${b.target}` : `Calibrator ${b.object} for ${b.target}`),
  },
  { key: "configuration", header: "Configuration", value: (b) => b.configuration },
  {
    key: "outcome",
    header: "Outcome",
    value: (b) => b.outcome,
    render: (b) => (
      <span>
        <OutcomeBadge outcome={b.outcome} />
        {b.note ? <span className="block text-xs text-night-600">{b.note}</span> : null}
      </span>
    ),
  },
];

/** Planned and executed blocks of a program, with its hours per configuration. */
export function ProgramBlocks({ blocks, hours }: { blocks: ProgramBlock[]; hours: ProgramHours[] }) {
  return (
    <Card title="Nights: planned and executed blocks">
      <p className="mb-3 text-sm text-night-600">
        Science hours per configuration: granted to the program, in published night plans not yet observed, executed,
        and still owed (granted less executed). Times are UTC.
      </p>
      <DataTable
        columns={hourColumns}
        rows={hours}
        rowKey={(r) => r.configuration}
        caption="Hours of the program per configuration"
      />
      <div className="mt-4">
        <DataTable
          columns={blockColumns}
          rows={blocks}
          caption="Blocks of the program in published night plans"
          exportName="program-blocks"
          empty="No published night plan holds a block of this program yet."
        />
      </div>
    </Card>
  );
}
