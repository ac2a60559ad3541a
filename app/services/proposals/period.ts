/**
 * A cycle's observing period as instants (UTC): from noon of its first date (before the first night's
 * evening at any site of the array) to 18:00 of the day after its last date (the morning the last night
 * ends). Pure: used by the feasibility report and by the save of a target's time windows.
 */
import { formatUtc } from "~/lib/format";
import { addDays } from "./feasibility/nights";

export type ObservingPeriod = { observingStart: string; observingEnd: string };

/** The period's first and last instants, Unix milliseconds. */
export function observingPeriodMs(cycle: ObservingPeriod): { startMs: number; endMs: number } {
  return {
    startMs: Date.parse(`${cycle.observingStart}T12:00:00Z`),
    endMs: Date.parse(`${addDays(cycle.observingEnd, 1)}T18:00:00Z`),
  };
}

/** "2027-03-01 12:00 UTC to 2027-09-01 18:00 UTC": the period as a person reads it. */
export function observingPeriodText(cycle: ObservingPeriod): string {
  const { startMs, endMs } = observingPeriodMs(cycle);
  return `${formatUtc(new Date(startMs))} to ${formatUtc(new Date(endMs))}`;
}

/** Does the window (ISO instants) lie wholly inside the period? */
export function windowInsidePeriod(window: { startUtc: string; endUtc: string }, cycle: ObservingPeriod): boolean {
  const { startMs, endMs } = observingPeriodMs(cycle);
  return Date.parse(window.startUtc) >= startMs && Date.parse(window.endUtc) <= endMs;
}
