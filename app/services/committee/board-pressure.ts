/**
 * Demand, LST pressure and the suggested allocation of a cycle (pure), from the board's records and
 * the darkness of the cycle at each site:
 *  - each proposal's hours on a configuration are shared equally among its targets (one request per
 *    target × configuration), spread over LST by the engine's `lstPressure` where the target is
 *    observable (elevation, darkness, delay lines), against the configuration's capacity per LST bin
 *    (nights on offer × mean dark hours per bin);
 *  - the engine's `suggestAllocation` walks the board's order above the triage line and grants hours
 *    while the bins have room.
 * Numbers leave here rounded to 4 decimals (0.0001 h): Σ bins then equals the totals within 0.003 h.
 */
import { type DarkTime, type LstPressureInput, lstPressure, suggestAllocation } from "~/engine";
import type { BoardDecisionKind, BoardRecords, HoursByConfiguration } from "./board-records";

export type Suggestion = { decision: BoardDecisionKind; hoursByConfig: HoursByConfiguration; reason: string };

export type PressureConfiguration = {
  configurationId: number;
  name: string;
  nights: number | null;
  /** Mean hours of astronomical darkness per night over the period at the configuration's site. */
  darkHoursPerNight: number;
  /** Hours offered per LST bin, and their sum (nights × dark hours per night). */
  capacity: number[];
  capacityTotalH: number;
  /** Requested hours per LST bin; Σ = requestedTotalH − unplaceableH. */
  requested: number[];
  requestedTotalH: number;
  unplaceableH: number;
  /** requested / capacity; null without capacity. */
  oversubscription: number | null;
  /** Hours the suggested allocation grants per LST bin, and their sum. */
  suggested: number[];
  suggestedTotalH: number;
};

export type BoardPressure = {
  lstBins: number;
  binWidthH: number;
  /** The period's nights, and the date the positions were precessed to. */
  periodNights: number;
  configurations: PressureConfiguration[];
  /** Per proposal id, per configuration id: its requested hours per LST bin (for the allocation chart). */
  shapes: Record<number, Record<number, number[]>>;
  /** Requests that fall in no LST bin, with the engine's reason. */
  unplaceable: { proposalId: number; target: string; configuration: string; hours: number; reason: string }[];
};

const r4 = (x: number) => Math.round(x * 1e4) / 1e4;
const rounded = (a: ArrayLike<number>) => Array.from(a, r4);

/** Demand, pressure and allocation; `walkOrder` is the board's order above the triage line. */
export function boardPressure(
  records: BoardRecords,
  darkBySite: ReadonlyMap<number, DarkTime>,
  walkOrder: readonly number[],
): BoardPressure & { suggestions: Map<number, Suggestion> } {
  const sites = [...new Set(records.configurations.map((c) => c.siteId))];
  const first = sites.length ? darkBySite.get(sites[0]) : undefined;
  const lstBins = first?.lstBins ?? 24;
  const configs = new Map<number, PressureConfiguration>();
  const shapes: BoardPressure["shapes"] = {};
  const unplaceable: BoardPressure["unplaceable"] = [];
  const allocationRequests: Parameters<typeof suggestAllocation>[0]["requests"] = [];
  const capacity: Parameters<typeof suggestAllocation>[0]["capacity"] = [];
  const configName = new Map(records.configurations.map((c) => [c.id, c.name]));

  for (const siteId of sites) {
    const dark = darkBySite.get(siteId);
    if (!dark) throw new Error(`no darkness computed for site ${siteId}`);
    const here = records.configurations.filter((c) => c.siteId === siteId);
    const input: LstPressureInput = {
      configurations: here.map((c) => ({
        id: String(c.id),
        nights: c.nights ?? 0,
        stations: c.stations,
        delayLineStrokeM: c.delayLineStrokeM,
        minElevationDeg: c.minElevationDeg,
      })),
      requests: [],
    };
    const offered = new Set(here.map((c) => c.id));
    for (const p of records.proposals) {
      for (const [cid, hours] of Object.entries(p.hours)) {
        if (!offered.has(Number(cid))) continue;
        if (p.targets.length === 0) {
          unplaceable.push({
            proposalId: p.id,
            target: "—",
            configuration: configName.get(Number(cid)) ?? cid,
            hours,
            reason: "the proposal names no target",
          });
          continue;
        }
        p.targets.forEach((t, i) => {
          input.requests.push({
            proposal: String(p.id),
            target: `${p.id}:${i}`,
            raDeg: t.raDeg,
            decDeg: t.decDeg,
            configuration: cid,
            hours: hours / p.targets.length,
            minElevationDeg: t.minElevationDeg,
          });
        });
      }
    }
    const pressure = lstPressure(dark, input);
    for (const c of pressure.configurations) {
      const id = Number(c.configuration);
      configs.set(id, {
        configurationId: id,
        name: configName.get(id) ?? c.configuration,
        nights: here.find((h) => h.id === id)!.nights,
        darkHoursPerNight: r4(dark.meanDarkHoursPerNight),
        capacity: rounded(c.capacityHours),
        capacityTotalH: r4(c.capacityTotalH),
        requested: rounded(c.requestedHours),
        requestedTotalH: r4(c.requestedTotalH),
        unplaceableH: r4(c.unplaceableH),
        oversubscription: c.oversubscription,
        suggested: new Array(lstBins).fill(0),
        suggestedTotalH: 0,
      });
      capacity.push({ configuration: c.configuration, hoursPerBin: c.capacityHours });
    }
    input.requests.forEach((req, i) => {
      const out = pressure.requests[i];
      const pid = Number(req.proposal);
      const cid = Number(req.configuration);
      shapes[pid] ??= {};
      shapes[pid][cid] ??= new Array(lstBins).fill(0);
      const shape = shapes[pid][cid];
      for (let b = 0; b < lstBins; b++) shape[b] += out.spreadHours[b];
      if (out.unplaceableHours > 0) {
        const p = records.proposals.find((x) => x.id === pid)!;
        unplaceable.push({
          proposalId: pid,
          target: p.targets[Number(req.target.split(":")[1])].name,
          configuration: configName.get(cid) ?? req.configuration,
          hours: r4(out.unplaceableHours),
          reason: out.unplaceableReason ?? "not observable",
        });
      }
      allocationRequests.push({
        proposal: req.proposal,
        target: req.target,
        configuration: req.configuration,
        hours: req.hours,
        spreadHours: out.spreadHours,
      });
    });
  }
  for (const byConfig of Object.values(shapes))
    for (const k of Object.keys(byConfig)) byConfig[Number(k)] = rounded(byConfig[Number(k)]);

  const walked = new Set(walkOrder.map(String));
  const allocation = suggestAllocation({
    order: walkOrder.map(String),
    capacity,
    requests: allocationRequests.filter((r) => walked.has(r.proposal)),
  });
  for (const c of allocation.configurations) {
    const pc = configs.get(Number(c.configuration))!;
    pc.suggested = rounded(c.grantedHours);
    pc.suggestedTotalH = r4(c.grantedHours.reduce((s, x) => s + x, 0));
  }
  const suggestions = new Map<number, Suggestion>();
  for (const a of allocation.proposals) {
    const hoursByConfig: HoursByConfiguration = {};
    if (a.suggestion === "accept")
      for (const c of a.configurations)
        if (c.grantedHours > 0) hoursByConfig[Number(c.configuration)] = r4(c.grantedHours);
    suggestions.set(Number(a.proposal), { decision: a.suggestion, hoursByConfig, reason: a.reason });
  }
  return {
    lstBins,
    binWidthH: 24 / lstBins,
    periodNights: first?.periodNights ?? 0,
    configurations: records.configurations.map((c) => configs.get(c.id)!).filter(Boolean),
    shapes,
    unplaceable,
    suggestions,
  };
}
