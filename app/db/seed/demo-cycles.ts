/**
 * The demo's three cycles, laid out around the day the demo is loaded so the story holds whenever it
 * is started (pure):
 *  - "current": its observing period contains today (from the first of the month two months back to the
 *    end of the month three months ahead); decided long ago, decisions sent (closed);
 *  - "review": the next six months; its deadline passed 12 days ago, the reviewers are at work until
 *    16 days from now, decisions due in 30 days;
 *  - "open": the six months after; taking proposals until 45 days from now.
 * Names follow the start of the period: year and A (starting January–June) or B (July–December), so the
 * three are always distinct.
 */
import type { CycleState } from "../schema/proposals";

export type DemoCycleKey = "current" | "review" | "open";

export type DemoCycle = {
  key: DemoCycleKey;
  name: string;
  description: string;
  observingStart: string;
  observingEnd: string;
  submissionDeadline: Date;
  reviewDeadline: Date;
  decisionDate: string;
  state: CycleState;
  offers: { configurationName: string; nightsAvailable: number | null }[];
};

/** The chair of every demo cycle and the reviewers on each committee (by e-mail). */
export const DEMO_CHAIR = "henrik.solberg@fjellvik.example";
export const DEMO_COMMITTEE = [
  "amara.okafor@harmattan-obs.example",
  "kenji.morrow@tidewater.example",
  "dario.petrescu@baltic-stellar.example",
  "yusuf.karaca@meseta-roja.example",
  "mirela.voinea@carpathian-stellar.example",
];

const DAY_MS = 86_400_000;
const isoDate = (ms: number) => new Date(ms).toISOString().slice(0, 10);
/** Noon UTC of the day `days` after the UTC date of `ms`. */
const noonAfter = (ms: number, days: number) => {
  const d = new Date(ms);
  return new Date(Date.UTC(d.getUTCFullYear(), d.getUTCMonth(), d.getUTCDate() + days, 12));
};
/** First day of the month `offset` months from the month of `today` (UTC). */
const monthStart = (today: Date, offset: number) => Date.UTC(today.getUTCFullYear(), today.getUTCMonth() + offset, 1);

function period(today: Date, fromMonth: number) {
  const start = monthStart(today, fromMonth);
  const end = monthStart(today, fromMonth + 6) - DAY_MS;
  const d = new Date(start);
  const name = `${d.getUTCFullYear()}${d.getUTCMonth() < 6 ? "A" : "B"}`;
  return { start, observingStart: isoDate(start), observingEnd: isoDate(end), name };
}

/** Nights offered per configuration: fewer than the demand, so the board shows oversubscription. */
const OFFERS = [
  { configurationName: "compact-3", nightsAvailable: 4 },
  { configurationName: "medium-4", nightsAvailable: 6 },
  { configurationName: "extended-6", nightsAvailable: 8 },
];

export function demoCycles(today: Date): Record<DemoCycleKey, DemoCycle> {
  const now = today.getTime();
  const current = period(today, -2);
  const review = period(today, 4);
  const open = period(today, 10);
  return {
    current: {
      key: "current",
      name: current.name,
      description: "The cycle being observed: decided, accepted programmes in the night plans.",
      observingStart: current.observingStart,
      observingEnd: current.observingEnd,
      submissionDeadline: noonAfter(current.start, -75),
      reviewDeadline: noonAfter(current.start, -40),
      decisionDate: isoDate(noonAfter(current.start, -25).getTime()),
      state: "closed",
      offers: OFFERS,
    },
    review: {
      key: "review",
      name: review.name,
      description: "Submissions closed; the committee is reviewing.",
      observingStart: review.observingStart,
      observingEnd: review.observingEnd,
      submissionDeadline: noonAfter(now, -12),
      reviewDeadline: noonAfter(now, 16),
      decisionDate: isoDate(noonAfter(now, 30).getTime()),
      state: "reviewing",
      offers: OFFERS,
    },
    open: {
      key: "open",
      name: open.name,
      description: "Open for proposals: all three configurations on offer.",
      observingStart: open.observingStart,
      observingEnd: open.observingEnd,
      submissionDeadline: noonAfter(now, 45),
      reviewDeadline: noonAfter(now, 75),
      decisionDate: isoDate(noonAfter(now, 90).getTime()),
      state: "open",
      offers: OFFERS,
    },
  };
}
