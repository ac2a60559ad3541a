/** Where a cycle stands on a given day (pure, safe in the browser). */

export const CYCLE_PHASES = ["open", "in review", "observing", "finished"] as const;
export type CyclePhase = (typeof CYCLE_PHASES)[number];

/** Open until the deadline, then in review until the first night, observing until the last night. */
export function cyclePhase(
  cycle: { submissionDeadline: Date; observingStart: string; observingEnd: string },
  now = new Date(),
): CyclePhase {
  if (now < cycle.submissionDeadline) return "open";
  const today = now.toISOString().slice(0, 10);
  if (today < cycle.observingStart) return "in review";
  if (today <= cycle.observingEnd) return "observing";
  return "finished";
}
