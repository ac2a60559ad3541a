/**
 * Suggested allocation: walk the proposals in order (the ranking, or the chair's final grades) and grant
 * each its hours while the LST bins of the configurations it asks for have room.
 *
 * Rule (our choice, stated on the board):
 *  - A request (target × configuration) consumes capacity bin by bin with its own LST spread: in bin b it
 *    gets g_b = min(s_b, remaining_b) and remaining_b decreases by g_b. The request is granted Σ_b g_b, so
 *    a request may be granted part of its hours (the part whose LST still has room). Hours the LST
 *    pressure found unplaceable are never granted.
 *  - A proposal's requests are served in their input order, all configurations together. If the proposal
 *    then holds at least `minGrantFraction` (default 0.5) of everything it requested, the grants stand
 *    and the suggestion is "accept" (with those hours); otherwise every grant of the proposal is returned
 *    to the bins and the suggestion is "waitlist". minGrantFraction = 1 gives all-or-nothing.
 *  - A proposal that requests no hours is suggested "waitlist" (nothing to schedule).
 * The walk is greedy: a proposal never takes time from one ranked above it.
 */
import type { AllocationInput } from "./inputs";

export const DEFAULT_MIN_GRANT_FRACTION = 0.5;
/** Hours below which a difference counts as rounding. */
const EPS_H = 1e-9;

export type AllocationSuggestion = "accept" | "waitlist";

export interface TargetGrant {
  target: string;
  configuration: string;
  requestedHours: number;
  grantedHours: number;
}

export interface ProposalAllocation {
  proposal: string;
  /** 1-based position in the walk. */
  position: number;
  requestedHours: number;
  /** Hours granted (0 when waitlisted). */
  grantedHours: number;
  /** Hours that would fit at this point of the walk, kept or returned. */
  fittingHours: number;
  /** Per configuration, in the order the proposal first asks for it. */
  configurations: { configuration: string; requestedHours: number; grantedHours: number }[];
  targets: TargetGrant[];
  suggestion: AllocationSuggestion;
  reason: string;
}

export interface ConfigurationAllocation {
  configuration: string;
  capacityHours: Float64Array;
  /** Hours granted per LST bin. */
  grantedHours: Float64Array;
  /** capacity − granted per LST bin (≥ 0). */
  remainingHours: Float64Array;
}

export interface AllocationResult {
  /** In walk order. */
  proposals: ProposalAllocation[];
  /** In the order of `capacity`. */
  configurations: ConfigurationAllocation[];
  /** Proposals that have requests but are not in `order` (not walked), sorted. */
  notWalked: string[];
}

const fmt = (h: number) => h.toFixed(1);

function checkInput(input: AllocationInput, nBins: number, minGrantFraction: number): void {
  if (!(minGrantFraction > 0 && minGrantFraction <= 1)) throw new RangeError("minGrantFraction: must be in (0, 1]");
  const seen = new Set<string>();
  input.order.forEach((p, i) => {
    if (seen.has(p)) throw new RangeError(`order[${i}]: repeats proposal "${p}"`);
    seen.add(p);
  });
  const configs = new Set<string>();
  input.capacity.forEach((c, i) => {
    if (configs.has(c.configuration))
      throw new RangeError(`capacity[${i}]: repeats configuration "${c.configuration}"`);
    configs.add(c.configuration);
    if (c.hoursPerBin.length !== nBins) throw new RangeError(`capacity[${i}].hoursPerBin: must have ${nBins} bins`);
  });
  input.requests.forEach((r, i) => {
    if (r.spreadHours.length !== nBins) throw new RangeError(`requests[${i}].spreadHours: must have ${nBins} bins`);
    if (!(r.hours >= 0)) throw new RangeError(`requests[${i}].hours: must be zero or positive`);
  });
}

/** The suggested allocation of `input` (see the rule above). */
export function suggestAllocation(input: AllocationInput): AllocationResult {
  const nBins = input.capacity[0]?.hoursPerBin.length ?? input.requests[0]?.spreadHours.length ?? 0;
  const minGrantFraction = input.minGrantFraction ?? DEFAULT_MIN_GRANT_FRACTION;
  checkInput(input, nBins, minGrantFraction);

  const configurations: ConfigurationAllocation[] = input.capacity.map((c) => {
    const capacityHours = Float64Array.from(c.hoursPerBin, (x) => Math.max(0, x));
    return {
      configuration: c.configuration,
      capacityHours,
      grantedHours: new Float64Array(nBins),
      remainingHours: Float64Array.from(capacityHours),
    };
  });
  const byConfig = new Map(configurations.map((c) => [c.configuration, c]));

  const requestsOf = new Map<string, AllocationInput["requests"]>();
  for (const r of input.requests) {
    const list = requestsOf.get(r.proposal);
    if (list) list.push(r);
    else requestsOf.set(r.proposal, [r]);
  }

  const proposals = input.order.map((proposal, i): ProposalAllocation => {
    const reqs = requestsOf.get(proposal) ?? [];
    // Snapshot of the bins this proposal may touch, restored exactly if it is waitlisted.
    const snapshot = new Map<ConfigurationAllocation, [Float64Array, Float64Array]>();
    for (const r of reqs) {
      const c = byConfig.get(r.configuration);
      if (c && !snapshot.has(c))
        snapshot.set(c, [Float64Array.from(c.remainingHours), Float64Array.from(c.grantedHours)]);
    }
    const targets: TargetGrant[] = [];
    let requestedHours = 0;
    let fittingHours = 0;
    for (const r of reqs) {
      requestedHours += r.hours;
      const config = byConfig.get(r.configuration);
      let granted = 0;
      if (config) {
        for (let b = 0; b < nBins; b++) {
          const g = Math.min(Math.max(0, r.spreadHours[b]), config.remainingHours[b]);
          if (!(g > 0)) continue;
          config.remainingHours[b] -= g;
          config.grantedHours[b] += g;
          granted += g;
        }
      }
      fittingHours += granted;
      targets.push({
        target: r.target,
        configuration: r.configuration,
        requestedHours: r.hours,
        grantedHours: granted,
      });
    }

    let suggestion: AllocationSuggestion;
    let reason: string;
    const pct = requestedHours > 0 ? Math.round((100 * fittingHours) / requestedHours) : 0;
    if (!(requestedHours > EPS_H)) {
      suggestion = "waitlist";
      reason = "no hours requested";
    } else if (fittingHours > EPS_H && fittingHours + EPS_H >= minGrantFraction * requestedHours) {
      suggestion = "accept";
      reason =
        fittingHours + EPS_H >= requestedHours
          ? `all ${fmt(requestedHours)} h fit`
          : `${fmt(fittingHours)} of ${fmt(requestedHours)} h fit (${pct}%)`;
    } else {
      suggestion = "waitlist";
      reason = `only ${fmt(fittingHours)} of ${fmt(requestedHours)} h fit (${pct}%, below ${Math.round(100 * minGrantFraction)}%)`;
    }
    if (suggestion === "waitlist") {
      for (const [c, [remaining, granted]] of snapshot) {
        c.remainingHours.set(remaining);
        c.grantedHours.set(granted);
      }
      for (const t of targets) t.grantedHours = 0;
    }

    const perConfig = new Map<string, { configuration: string; requestedHours: number; grantedHours: number }>();
    for (const t of targets) {
      let c = perConfig.get(t.configuration);
      if (!c) {
        c = { configuration: t.configuration, requestedHours: 0, grantedHours: 0 };
        perConfig.set(t.configuration, c);
      }
      c.requestedHours += t.requestedHours;
      c.grantedHours += t.grantedHours;
    }
    return {
      proposal,
      position: i + 1,
      requestedHours,
      grantedHours: suggestion === "accept" ? fittingHours : 0,
      fittingHours,
      configurations: [...perConfig.values()],
      targets,
      suggestion,
      reason,
    };
  });

  const walked = new Set(input.order);
  const notWalked = [...requestsOf.keys()].filter((p) => !walked.has(p)).sort((a, b) => (a < b ? -1 : a > b ? 1 : 0));
  return { proposals, configurations, notWalked };
}
