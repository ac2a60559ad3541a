/**
 * LST pressure with the allocation as it is being decided: the chart of one configuration at a time,
 * and (while the cycle is deciding) the chair's table of grades, decisions, hours and messages — every
 * change of hours redraws the allocation against the capacity. Rows without a saved decision start
 * from the suggested allocation. Allocated hours are spread over LST like the proposal's request.
 */

import { useMemo, useState } from "react";
import { Form, useNavigation } from "react-router";
import { Badge, Button, Card, type Column, cx, DataTable, FormErrors, SelectField } from "~/components/ui";
import { ConfirmDialog } from "~/components/ui/ConfirmDialog";
import { plural } from "~/lib/format";
import type { BoardPageData } from "~/services/committee/board-page.server";
import { LstChart } from "./LstChart";

type Row = BoardPageData["rows"][number];
type Entry = { decision: string; grade: string; message: string; hours: Record<number, string> };

const h1 = (x: number) => String(Math.round(x * 10) / 10);

function startOf(r: Row): Entry & { suggested: boolean } {
  if (r.decision.decision || r.releasedAt) {
    const hours: Record<number, string> = {};
    for (const [cid, h] of Object.entries(r.decision.hoursByConfig)) hours[Number(cid)] = h1(h);
    return {
      decision: r.decision.decision ?? "",
      grade: r.finalGrade === null ? "" : String(r.finalGrade),
      message: r.decision.message,
      hours,
      suggested: false,
    };
  }
  const hours: Record<number, string> = {};
  for (const [cid, h] of Object.entries(r.suggestion.hoursByConfig)) hours[Number(cid)] = h1(h);
  return {
    decision: r.suggestion.decision,
    grade: r.finalGrade === null ? "" : String(r.finalGrade),
    message: "",
    hours,
    suggested: true,
  };
}

/** A row the chair can no longer change: outside the deciding state, sent, or not under review. */
const lockedRow = (r: Row, deciding: boolean) => !deciding || r.releasedAt !== null || r.status !== "under_review";

const control = "rounded border border-night-300 px-2 py-1 focus-visible:outline-3 focus-visible:outline-ember-500";

/** The decision table's columns; they sort and export by what is entered in them. */
function decisionColumns({
  configs,
  entries,
  errors,
  set,
  locked,
}: {
  configs: BoardPageData["pressure"]["configurations"];
  entries: Record<number, Entry & { suggested: boolean }>;
  errors: Record<string, string>;
  set: (pid: number, change: Partial<Entry>) => void;
  locked: (r: Row) => boolean;
}): Column<Row>[] {
  const invalid = (field: string) => (errors[field] ? true : undefined);
  return [
    { key: "position", header: "#", className: "num", value: (r) => r.position },
    {
      key: "proposal",
      header: "Proposal",
      value: (r) => r.title,
      render: (r) => (
        <>
          <span className="font-medium">{r.title}</span>
          <span className="block text-xs text-night-600">
            {r.suggestion.decision}: {r.suggestion.reason}
          </span>
          {entries[r.proposalId].suggested && !locked(r) ? <Badge tone="info">suggested</Badge> : null}
          {r.releasedAt ? <Badge tone="ok">sent</Badge> : null}
        </>
      ),
    },
    {
      key: "grade",
      header: "Final grade",
      unit: "score",
      value: (r) => entries[r.proposalId].grade,
      render: (r) => (
        <input
          aria-label={`Final grade of ${r.title}`}
          name={`grade-${r.proposalId}`}
          inputMode="decimal"
          value={entries[r.proposalId].grade}
          disabled={locked(r)}
          onChange={(ev) => set(r.proposalId, { grade: ev.target.value })}
          aria-invalid={invalid(`grade-${r.proposalId}`)}
          className={cx("w-16", control)}
        />
      ),
    },
    {
      key: "decision",
      header: "Decision",
      value: (r) => entries[r.proposalId].decision,
      render: (r) => (
        <select
          aria-label={`Decision on ${r.title}`}
          name={`decision-${r.proposalId}`}
          value={entries[r.proposalId].decision}
          disabled={locked(r)}
          onChange={(ev) => set(r.proposalId, { decision: ev.target.value })}
          aria-invalid={invalid(`decision-${r.proposalId}`)}
          className={cx("bg-white", control)}
        >
          <option value="">—</option>
          <option value="accept">accept</option>
          <option value="waitlist">waiting list</option>
          <option value="decline">decline</option>
        </select>
      ),
    },
    {
      key: "hours",
      header: "Hours granted",
      unit: "h",
      value: (r) => Object.values(entries[r.proposalId].hours).reduce((sum, h) => sum + (Number(h) || 0), 0),
      render: (r) => {
        const e = entries[r.proposalId];
        return (
          <div className="flex flex-wrap gap-2">
            {Object.entries(r.hoursByConfig).map(([cid, requested]) => {
              const name = configs.find((c) => c.configurationId === Number(cid))?.name ?? cid;
              return (
                <label key={cid} className="flex items-center gap-1 whitespace-nowrap">
                  <span className="text-xs text-night-600">{name}</span>
                  <input
                    aria-label={`Hours of ${r.title} on ${name}`}
                    name={`hours-${r.proposalId}-${cid}`}
                    inputMode="decimal"
                    value={e.hours[Number(cid)] ?? ""}
                    disabled={locked(r) || e.decision !== "accept"}
                    onChange={(ev) => set(r.proposalId, { hours: { ...e.hours, [Number(cid)]: ev.target.value } })}
                    aria-invalid={invalid(`hours-${r.proposalId}-${cid}`)}
                    className={cx("w-16", control)}
                  />
                  <span className="num text-xs text-night-500">/ {requested}</span>
                </label>
              );
            })}
          </div>
        );
      },
    },
    {
      key: "message",
      header: "Message to the team",
      value: (r) => entries[r.proposalId].message,
      render: (r) => (
        <textarea
          aria-label={`Message to the team of ${r.title}`}
          name={`message-${r.proposalId}`}
          value={entries[r.proposalId].message}
          disabled={locked(r)}
          maxLength={2000}
          rows={1}
          onChange={(ev) => set(r.proposalId, { message: ev.target.value })}
          className={cx("w-56", control)}
        />
      ),
    },
  ];
}

export function AllocationWorkbench({
  d,
  errors,
  answered,
}: {
  d: BoardPageData;
  errors: Record<string, string>;
  answered: unknown;
}) {
  const configs = d.pressure.configurations;
  const [configId, setConfigId] = useState(configs[0]?.configurationId ?? 0);
  const [entries, setEntries] = useState<Record<number, Entry & { suggested: boolean }>>(() =>
    Object.fromEntries(d.rows.map((r) => [r.proposalId, startOf(r)])),
  );
  const busy = useNavigation().state === "submitting";
  const deciding = d.abilities.decide;
  const set = (pid: number, change: Partial<Entry>) =>
    setEntries((e) => ({ ...e, [pid]: { ...e[pid], ...change, suggested: false } }));

  const config = configs.find((c) => c.configurationId === configId) ?? configs[0];
  const allocated = useMemo(() => {
    if (!config) return { bins: [] as number[], unplaced: 0, total: 0 };
    const bins = new Array(config.capacity.length).fill(0);
    let unplaced = 0;
    let total = 0;
    for (const r of d.rows) {
      const e = entries[r.proposalId];
      if (e.decision !== "accept") continue;
      const h = Number(e.hours[config.configurationId] ?? 0);
      if (!(h > 0)) continue;
      total += h;
      const shape = d.pressure.shapes[r.proposalId]?.[config.configurationId];
      const sum = shape ? shape.reduce((s, x) => s + x, 0) : 0;
      if (!shape || sum <= 0) {
        unplaced += h;
        continue;
      }
      for (let b = 0; b < bins.length; b++) bins[b] += (h * shape[b]) / sum;
    }
    return { bins, unplaced, total };
  }, [entries, config, d.rows, d.pressure.shapes]);

  const inBins = (a: number[]) => a.reduce((s, x) => s + x, 0);
  const label = deciding || d.cycle.state === "closed" ? "Allocated" : "Suggested";
  const allocation = deciding || d.cycle.state === "closed" ? allocated.bins : (config?.suggested ?? []);
  const open = d.rows.filter((r) => !r.releasedAt && r.status === "under_review");

  return (
    <Card title="LST pressure and allocation">
      {configs.length === 0 ? (
        <p className="text-sm text-night-600">The cycle offers no configuration.</p>
      ) : (
        <>
          <div className="mb-2 max-w-xs">
            <SelectField
              label="Configuration"
              value={String(configId)}
              onChange={(e) => setConfigId(Number(e.target.value))}
            >
              {configs.map((c) => (
                <option key={c.configurationId} value={c.configurationId}>
                  {c.name}
                </option>
              ))}
            </SelectField>
          </div>
          <LstChart
            name={config.name}
            binWidthH={d.pressure.binWidthH}
            capacity={config.capacity}
            requested={config.requested}
            allocated={allocation}
            allocationLabel={label}
          />
          <p className="num mt-2 text-sm text-night-700" data-testid="lst-sums">
            {config.name}: requested {inBins(config.requested).toFixed(1)} h in the LST bins +{" "}
            {config.unplaceableH.toFixed(1)} h not placeable = {config.requestedTotalH.toFixed(1)} h requested;
            available {inBins(config.capacity).toFixed(1)} h; {label.toLowerCase()} {inBins(allocation).toFixed(1)} h in
            the bins
            {deciding && allocated.unplaced > 0 ? ` (+ ${allocated.unplaced.toFixed(1)} h not placeable)` : ""}.
          </p>
        </>
      )}
      {deciding || d.cycle.state === "closed" ? (
        <Form method="post" className="mt-6" aria-label="Decisions">
          <input type="hidden" name="intent" value="save-decisions" />
          <FormErrors errors={Object.values(errors)} />
          <h3 className="mb-2 mt-2 text-base font-semibold">Grades, decisions and hours</h3>
          <p className="mb-3 text-sm text-night-700">
            Rows marked “suggested” start from the suggested allocation (the ranking walked while the LST bins have
            room; half of the request at least, else waiting list). Grades use the scale {d.cycle.scaleText}.
          </p>
          <DataTable
            columns={decisionColumns({ configs, entries, errors, set, locked: (r) => lockedRow(r, deciding) })}
            rows={d.rows}
            rowKey={(r) => r.proposalId}
            caption="Grades, decisions and hours per proposal"
            exportName={`decisions-${d.cycle.name}`}
            density="compact"
            rowProps={(r) => ({ className: cx("*:align-top", r.belowTriage && "bg-night-50") })}
          />
          {deciding ? (
            <div className="mt-4 flex flex-wrap gap-2">
              <Button type="submit" disabled={busy || open.length === 0}>
                Save grades and decisions
              </Button>
              <Button
                variant="secondary"
                onClick={() =>
                  setEntries((all) =>
                    Object.fromEntries(
                      d.rows.map((r) => {
                        const s = startOf({ ...r, decision: { ...r.decision, decision: null }, releasedAt: null });
                        return [
                          r.proposalId,
                          { ...s, grade: all[r.proposalId].grade, message: all[r.proposalId].message },
                        ];
                      }),
                    ),
                  )
                }
              >
                Start again from the suggestion
              </Button>
            </div>
          ) : null}
        </Form>
      ) : null}
      {deciding ? (
        <div className="mt-4 flex flex-wrap items-center gap-3">
          <ConfirmDialog
            label="Release the decisions"
            title="Release the decisions?"
            intent="release"
            confirmLabel="Yes, send them"
            disabled={!d.abilities.release}
            closeOn={answered}
          >
            <p>
              Every PI and co-investigator of the {plural(open.length, "proposal")} under review gets the decision, the
              hours granted and the reviewers' comments to the PI (without names). The proposals' statuses change and
              the cycle closes. Saved decisions only: save your changes first.
            </p>
          </ConfirmDialog>
          {d.undecided > 0 ? (
            <span className="text-sm text-night-600">
              {d.undecided} proposal{d.undecided === 1 ? " has" : "s have"} no saved decision yet.
            </span>
          ) : null}
        </div>
      ) : null}
    </Card>
  );
}
