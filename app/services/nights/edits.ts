/**
 * Editing a plan by hand (pure): move a block earlier or later, remove it, insert one, change its
 * length. Blocks stay in time order and never overlap; times are whole Unix seconds.
 *
 * - Moving swaps a block with its neighbour inside the span the two occupy: the one moved takes the
 *   earlier start, the gap between them is kept, and the pair still ends where it ended.
 * - Lengthening or inserting pushes the following blocks later, just enough to clear the overlap;
 *   shortening pulls the blocks that touched the block's end (and those touching them) earlier with it,
 *   so that a sequence stays end to end (a change undone restores the plan, unless the push had closed a
 *   gap exactly: the blocks then touching come back too).
 * - Blocks already marked (executed, lost) are locked: an edit that would move one is refused.
 * Whether the result is a good plan is the validator's business (validatePlan), not this module's.
 */

export type EditBlock = {
  /** Row id, null for a block not stored yet. */
  id: number | null;
  kind: "calibrator" | "science";
  target: string;
  object: string;
  proposalId: number | null;
  proposalTargetId: number | null;
  startSec: number;
  endSec: number;
  locked: boolean;
};

export type EditResult = { ok: true; blocks: EditBlock[] } | { ok: false; error: string };

/** Longest block a person may set, minutes. */
export const MAX_BLOCK_MIN = 720;

const lockedError = (b: EditBlock) =>
  `The ${b.kind} block on ${b.object} is already marked and cannot be moved; re-plan around it instead.`;

/** Pushes the blocks after `from` later until none overlaps its predecessor. */
function pushLater(blocks: EditBlock[], from: number): EditResult {
  for (let k = from + 1; k < blocks.length; k++) {
    const overlap = blocks[k - 1].endSec - blocks[k].startSec;
    if (overlap <= 0) break;
    if (blocks[k].locked) return { ok: false, error: lockedError(blocks[k]) };
    blocks[k] = { ...blocks[k], startSec: blocks[k].startSec + overlap, endSec: blocks[k].endSec + overlap };
  }
  return { ok: true, blocks };
}

/** Swaps block i with block i − 1 inside the span they occupy. */
function swapWithPrevious(blocks: EditBlock[], i: number): EditResult {
  const a = blocks[i - 1];
  const b = blocks[i];
  if (a.locked) return { ok: false, error: lockedError(a) };
  if (b.locked) return { ok: false, error: lockedError(b) };
  const gap = b.startSec - a.endSec;
  const movedB = { ...b, startSec: a.startSec, endSec: a.startSec + (b.endSec - b.startSec) };
  const movedA = { ...a, startSec: movedB.endSec + gap, endSec: movedB.endSec + gap + (a.endSec - a.startSec) };
  blocks[i - 1] = movedB;
  blocks[i] = movedA;
  return { ok: true, blocks };
}

/** Moves the block at `from` to position `to` (0-based) by neighbour swaps. */
export function moveBlock(list: readonly EditBlock[], from: number, to: number): EditResult {
  if (!(from >= 0 && from < list.length)) return { ok: false, error: "There is no such block in the plan." };
  if (!(to >= 0 && to < list.length)) return { ok: false, error: "The block cannot move past the ends of the plan." };
  let blocks = [...list];
  for (let i = from; i > to; i--) {
    const r = swapWithPrevious(blocks, i);
    if (!r.ok) return r;
    blocks = r.blocks;
  }
  for (let i = from; i < to; i++) {
    const r = swapWithPrevious(blocks, i + 1);
    if (!r.ok) return r;
    blocks = r.blocks;
  }
  return { ok: true, blocks };
}

/** Removes the block at `index`; the others keep their times. */
export function removeBlock(list: readonly EditBlock[], index: number): EditResult {
  const b = list[index];
  if (!b) return { ok: false, error: "There is no such block in the plan." };
  if (b.locked) return { ok: false, error: lockedError(b) };
  return { ok: true, blocks: list.filter((_, i) => i !== index) };
}

/** Sets the length of the block at `index` (seconds, whole), pushing the later blocks when it grows. */
export function resizeBlock(list: readonly EditBlock[], index: number, lengthSec: number): EditResult {
  const b = list[index];
  if (!b) return { ok: false, error: "There is no such block in the plan." };
  if (b.locked) return { ok: false, error: lockedError(b) };
  if (!(Number.isInteger(lengthSec) && lengthSec >= 60 && lengthSec <= MAX_BLOCK_MIN * 60)) {
    return { ok: false, error: `A block lasts 1 to ${MAX_BLOCK_MIN} minutes.` };
  }
  const blocks = [...list];
  const shift = b.startSec + lengthSec - b.endSec;
  blocks[index] = { ...b, endSec: b.startSec + lengthSec };
  if (shift >= 0) return pushLater(blocks, index);
  for (let k = index + 1; k < blocks.length; k++) {
    if (blocks[k].startSec !== list[k - 1].endSec || blocks[k].locked) break;
    blocks[k] = { ...blocks[k], startSec: blocks[k].startSec + shift, endSec: blocks[k].endSec + shift };
  }
  return { ok: true, blocks };
}

/**
 * Inserts a block after the one at `after` (−1: at the start, beginning at `nightStartSec` or, when the
 * plan's first block starts earlier, right before it), pushing the later blocks when needed.
 */
export function insertBlock(
  list: readonly EditBlock[],
  after: number,
  block: Omit<EditBlock, "startSec" | "endSec" | "id" | "locked">,
  lengthSec: number,
  nightStartSec: number,
): EditResult {
  if (!(after >= -1 && after < list.length)) return { ok: false, error: "There is no such block in the plan." };
  if (!(Number.isInteger(lengthSec) && lengthSec >= 60 && lengthSec <= MAX_BLOCK_MIN * 60)) {
    return { ok: false, error: `A block lasts 1 to ${MAX_BLOCK_MIN} minutes.` };
  }
  let start = after >= 0 ? list[after].endSec : nightStartSec;
  if (after === -1 && list.length > 0 && list[0].startSec < start) start = list[0].startSec - lengthSec;
  const inserted: EditBlock = { ...block, id: null, locked: false, startSec: start, endSec: start + lengthSec };
  const blocks = [...list.slice(0, after + 1), inserted, ...list.slice(after + 1)];
  return pushLater(blocks, after + 1);
}
