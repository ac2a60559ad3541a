/**
 * LST pressure with the allocation as it is being decided: the chart of one configuration at a time,
 * and (while the cycle is deciding) the chair's table of grades, decisions, hours and messages — every
 * change of hours redraws the allocation against the capacity. Rows without a saved decision start
 * from the suggested allocation. Allocated hours are spread over LST like the proposal's request.
 */

import { useMemo, useState } from "react";
import { Form, useNavigation } from "react-router";
import { Badge, Button, Card, FormErrors, SelectField } from "~/components/ui";
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
          <div className="overflow-x-auto rounded-lg ring-1 ring-night-200">
            <table className="min-w-full text-sm">
              <caption className="sr-only">Grades, decisions and hours per proposal</caption>
              <thead className="bg-night-100/70 text-left">
                <tr>
                  <th scope="col" className="px-2 py-1 font-semibold">
                    #
                  </th>
                  <th scope="col" className="px-2 py-1 font-semibold">
                    Proposal
                  </th>
                  <th scope="col" className="px-2 py-1 font-semibold">
                    Final grade (score)
                  </th>
                  <th scope="col" className="px-2 py-1 font-semibold">
                    Decision
                  </th>
                  <th scope="col" className="px-2 py-1 font-semibold">
                    Hours granted (h)
                  </th>
                  <th scope="col" className="px-2 py-1 font-semibold">
                    Message to the team
                  </th>
                </tr>
              </thead>
              <tbody className="divide-y divide-night-100">
                {d.rows.map((r) => {
                  const e = entries[r.proposalId];
                  const locked = !deciding || r.releasedAt !== null || r.status !== "under_review";
                  return (
                    <tr key={r.proposalId} className={r.belowTriage ? "bg-night-50" : undefined}>
                      <td className="num px-2 py-1 align-top">{r.position}</td>
                      <td className="px-2 py-1 align-top">
                        <span className="font-medium">{r.title}</span>
                        <span className="block text-xs text-night-600">
                          {r.suggestion.decision}: {r.suggestion.reason}
                        </span>
                        {e.suggested && !locked ? <Badge tone="info">suggested</Badge> : null}
                        {r.releasedAt ? <Badge tone="ok">sent</Badge> : null}
                      </td>
                      <td className="px-2 py-1 align-top">
                        <input
                          aria-label={`Final grade of ${r.title}`}
                          name={`grade-${r.proposalId}`}
                          inputMode="decimal"
                          value={e.grade}
                          disabled={locked}
                          onChange={(ev) => set(r.proposalId, { grade: ev.target.value })}
                          aria-invalid={errors[`grade-${r.proposalId}`] ? true : undefined}
                          className="w-16 rounded border border-night-300 px-2 py-1 focus-visible:outline-3 focus-visible:outline-ember-500"
                        />
                      </td>
                      <td className="px-2 py-1 align-top">
                        <select
                          aria-label={`Decision on ${r.title}`}
                          name={`decision-${r.proposalId}`}
                          value={e.decision}
                          disabled={locked}
                          onChange={(ev) => set(r.proposalId, { decision: ev.target.value })}
                          aria-invalid={errors[`decision-${r.proposalId}`] ? true : undefined}
                          className="rounded border border-night-300 bg-white px-2 py-1 focus-visible:outline-3 focus-visible:outline-ember-500"
                        >
                          <option value="">—</option>
                          <option value="accept">accept</option>
                          <option value="waitlist">waiting list</option>
                          <option value="decline">decline</option>
                        </select>
                      </td>
                      <td className="px-2 py-1 align-top">
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
                                  disabled={locked || e.decision !== "accept"}
                                  onChange={(ev) =>
                                    set(r.proposalId, { hours: { ...e.hours, [Number(cid)]: ev.target.value } })
                                  }
                                  aria-invalid={errors[`hours-${r.proposalId}-${cid}`] ? true : undefined}
                                  className="w-16 rounded border border-night-300 px-2 py-1 focus-visible:outline-3 focus-visible:outline-ember-500"
                                />
                                <span className="num text-xs text-night-500">/ {requested}</span>
                              </label>
                            );
                          })}
                        </div>
                      </td>
                      <td className="px-2 py-1 align-top">
                        <textarea
                          aria-label={`Message to the team of ${r.title}`}
                          name={`message-${r.proposalId}`}
                          value={e.message}
                          disabled={locked}
                          maxLength={2000}
                          rows={1}
                          onChange={(ev) => set(r.proposalId, { message: ev.target.value })}
                          className="w-56 rounded border border-night-300 px-2 py-1 focus-visible:outline-3 focus-visible:outline-ember-500"
                        />
                      </td>
                    </tr>
                  );
                })}
              </tbody>
            </table>
          </div>
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
