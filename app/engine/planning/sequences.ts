/**
 * The automatic plan: calibrator – science – calibrator sequences laid end to end through the dark
 * interval. At each step the candidates are the targets that still have time owed and for which a
 * whole sequence starting now meets every constraint (the science block on the target, each
 * calibrator block on one of the target's own calibrators, the first usable one in the request's
 * order). Among them the best priority (lowest number) wins, then the one whose current observable
 * window ends soonest ("sets soonest": elevation, darkness, delay lines and Moon together), then the
 * request's order. With no candidate the start moves to the next grid instant.
 */
import type { PlanContext, PlanTarget } from "./context";
import type { ObjectTrack } from "./object-track";

/** A block in seconds, bound to its target and the track of what it points at. */
export interface PlacedBlock {
  kind: "calibrator" | "science";
  target: PlanTarget;
  track: ObjectTrack;
  /** Name of what the telescopes point at. */
  object: string;
  startSec: number;
  endSec: number;
  /** A block passed in as executed (kept as it is). */
  executed: boolean;
}

/** Science time already given to each target by a set of blocks. */
export function scienceUse(blocks: readonly PlacedBlock[]): Map<PlanTarget, { sec: number; count: number }> {
  const used = new Map<PlanTarget, { sec: number; count: number }>();
  for (const b of blocks) {
    if (b.kind !== "science") continue;
    const u = used.get(b.target) ?? { sec: 0, count: 0 };
    u.sec += b.endSec - b.startSec;
    u.count += 1;
    used.set(b.target, u);
  }
  return used;
}

/** Index of the first usable calibrator of a target meeting every constraint over [startSec, endSec], else −1. */
export function pickCalibrator(target: PlanTarget, startSec: number, endSec: number): number {
  for (let i = 0; i < target.calibrators.length; i++) {
    if (target.calibratorUsable[i] && target.calibrators[i].intervalOk(startSec, endSec)) return i;
  }
  return -1;
}

/** The sequence of a target starting at `startSec`, or null when one of its three blocks fails. */
export function sequenceAt(ctx: PlanContext, target: PlanTarget, startSec: number): PlacedBlock[] | null {
  const sciStart = startSec + ctx.calibratorSec;
  const sciEnd = sciStart + ctx.scienceSec;
  const calEnd = sciEnd + ctx.calibratorSec;
  if (!target.science.intervalOk(sciStart, sciEnd)) return null;
  const before = pickCalibrator(target, startSec, sciStart);
  if (before < 0) return null;
  const after = pickCalibrator(target, sciEnd, calEnd);
  if (after < 0) return null;
  const cal = (i: number, s: number, e: number): PlacedBlock => ({
    kind: "calibrator",
    target,
    track: target.calibrators[i],
    object: target.input.calibrators[i].name,
    startSec: s,
    endSec: e,
    executed: false,
  });
  return [
    cal(before, startSec, sciStart),
    {
      kind: "science",
      target,
      track: target.science,
      object: target.input.name,
      startSec: sciStart,
      endSec: sciEnd,
      executed: false,
    },
    cal(after, sciEnd, calEnd),
  ];
}

/** End of the observable window of a target that contains `sec` (a grid-covered observable instant), seconds. */
function windowEndSec(ctx: PlanContext, track: ObjectTrack, sec: number): number {
  const { sky } = ctx;
  const k = Math.min(sky.count - 1, Math.max(0, Math.ceil((sec - sky.originSec) / sky.stepSec)));
  const last = track.runEnd[k] >= 0 ? track.runEnd[k] : k;
  return sky.originSec + last * sky.stepSec;
}

/**
 * Fills the dark interval from `fromSec` on with new sequences around the executed blocks.
 * @param executed blocks kept as they are (their science time counts against hoursOwed)
 * @returns the new blocks in time order
 */
export function placeSequences(ctx: PlanContext, executed: readonly PlacedBlock[], fromSec: number): PlacedBlock[] {
  const { sky } = ctx;
  if (sky.darkStartSec === null || sky.darkEndSec === null || sky.count === 0) return [];
  const step = sky.stepSec;
  const endSec = sky.darkEndSec;
  const alignUp = (t: number) =>
    t <= sky.originSec ? sky.originSec : sky.originSec + Math.ceil((t - sky.originSec) / step) * step;
  const fixed = [...executed].sort((a, b) => a.startSec - b.startSec);
  const used = scienceUse(fixed);
  const placed: PlacedBlock[] = [];
  const Q = ctx.sequenceSec;

  let cursor = alignUp(Math.max(fromSec, sky.darkStartSec));
  while (cursor + Q <= endSec) {
    const clash = fixed.find((b) => b.startSec < cursor + Q && b.endSec > cursor);
    if (clash) {
      cursor = alignUp(Math.max(clash.endSec, cursor + 1));
      continue;
    }
    // The blocks on either side in time order: a new sequence must not sit right after or right
    // before a science block of its own target (its calibrator would then serve two sequences).
    let prev: PlacedBlock | undefined = placed[placed.length - 1];
    for (const b of fixed) if (b.startSec < cursor && (!prev || b.startSec > prev.startSec)) prev = b;
    const next = fixed.find((b) => b.startSec >= cursor + Q);

    let best: { target: PlanTarget; blocks: PlacedBlock[]; setSec: number } | null = null;
    for (const t of ctx.targets) {
      if (t.sunExcluded) continue;
      const u = used.get(t) ?? { sec: 0, count: 0 };
      if (u.count + 1 > t.maxBlocks || u.sec + ctx.scienceSec > t.allowedSec + 1e-6) continue;
      if (prev?.kind === "science" && prev.target === t) continue;
      if (next?.kind === "science" && next.target === t) continue;
      if (best && t.input.priority > best.target.input.priority) continue;
      const blocks = sequenceAt(ctx, t, cursor);
      if (!blocks) continue;
      const setSec = windowEndSec(ctx, t.science, blocks[1].startSec);
      if (
        !best ||
        t.input.priority < best.target.input.priority ||
        (t.input.priority === best.target.input.priority && setSec < best.setSec)
      ) {
        best = { target: t, blocks, setSec };
      }
    }
    if (!best) {
      cursor = alignUp(cursor + 1);
      continue;
    }
    placed.push(...best.blocks);
    const u = used.get(best.target) ?? { sec: 0, count: 0 };
    used.set(best.target, { sec: u.sec + ctx.scienceSec, count: u.count + 1 });
    cursor += Q;
  }
  return placed;
}
