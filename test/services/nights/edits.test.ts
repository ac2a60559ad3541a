import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { type EditBlock, insertBlock, moveBlock, removeBlock, resizeBlock } from "~/services/nights/edits";

const block = (id: number, startSec: number, lengthSec: number, over: Partial<EditBlock> = {}): EditBlock => ({
  id,
  kind: "science",
  target: `T${id}`,
  object: `T${id}`,
  proposalId: 1,
  proposalTargetId: id,
  startSec,
  endSec: startSec + lengthSec,
  locked: false,
  ...over,
});

// A calibrator–science–calibrator sequence, a 10-minute gap, and a second sequence.
const plan = () => [
  block(1, 0, 900),
  block(2, 900, 2400),
  block(3, 3300, 900),
  block(4, 4800, 900),
  block(5, 5700, 2400),
];
const ok = (r: ReturnType<typeof moveBlock>) => {
  if (!r.ok) throw new Error(r.error);
  return r.blocks;
};
const span = (bs: EditBlock[]) => bs.map((b) => [b.id, b.startSec, b.endSec]);

describe("moving a block", () => {
  it("swaps with its neighbour inside their span, keeping the gap between them", () => {
    const out = ok(moveBlock(plan(), 3, 2));
    // Blocks 3 (900 s, ends 4200) and 4 (starts 4800): 600 s apart. After the swap block 4 starts at 3300.
    expect(span(out).slice(2, 4)).toEqual([
      [4, 3300, 4200],
      [3, 4800, 5700],
    ]);
    expect(out[4]).toEqual(plan()[4]);
  });

  it("is undone by the opposite move", () => {
    expect(ok(moveBlock(ok(moveBlock(plan(), 1, 0)), 0, 1))).toEqual(plan());
    expect(ok(moveBlock(ok(moveBlock(plan(), 4, 1)), 1, 4))).toEqual(plan());
  });

  it("refuses to move past the ends or across a marked block", () => {
    expect(moveBlock(plan(), 0, -1).ok).toBe(false);
    expect(moveBlock(plan(), 4, 5).ok).toBe(false);
    const locked = plan().map((b) => (b.id === 2 ? { ...b, locked: true } : b));
    expect(moveBlock(locked, 2, 0)).toMatchObject({ ok: false, error: expect.stringMatching(/already marked/) });
  });
});

describe("lengths, insertion and removal", () => {
  it("pushes touching blocks later when a block grows and brings them back when it shrinks", () => {
    const grown = ok(resizeBlock(plan(), 0, 1200));
    expect(span(grown).slice(0, 3)).toEqual([
      [1, 0, 1200],
      [2, 1200, 3600],
      [3, 3600, 4500],
    ]);
    // The 600 s gap before block 4 absorbed the push (300 s of it remain).
    expect(grown[3]).toEqual(plan()[3]);
    expect(ok(resizeBlock(grown, 0, 900))).toEqual(plan());
  });

  it("refuses lengths outside 1–720 minutes and marked blocks", () => {
    expect(resizeBlock(plan(), 0, 30).ok).toBe(false);
    expect(resizeBlock(plan(), 0, 721 * 60).ok).toBe(false);
    expect(
      resizeBlock(
        plan().map((b) => ({ ...b, locked: true })),
        0,
        600,
      ).ok,
    ).toBe(false);
  });

  it("inserts after a block or at the start of the night, pushing later blocks on", () => {
    const t = { kind: "calibrator" as const, target: "T2", object: "K9", proposalId: 1, proposalTargetId: 2 };
    const after = ok(insertBlock(plan(), 1, t, 600, -3600));
    expect(span(after).slice(1, 4)).toEqual([
      [2, 900, 3300],
      [null, 3300, 3900],
      [3, 3900, 4800],
    ]);
    const first = ok(insertBlock(plan(), -1, t, 600, -3600));
    expect(span(first)[0]).toEqual([null, -3600, -3000]);
    expect(insertBlock(plan(), 7, t, 600, 0).ok).toBe(false);
  });

  it("removes a block and leaves the others where they were", () => {
    const out = ok(removeBlock(plan(), 2));
    expect(out.map((b) => b.id)).toEqual([1, 2, 4, 5]);
    expect(out[2]).toEqual(plan()[3]);
    expect(removeBlock(plan(), 9).ok).toBe(false);
  });
});

// Property (fast-check): whatever sequence of edits is applied, blocks stay in time order without overlap and
// every block keeps a positive whole-second length; moves never change the set of lengths.
describe("edits never break the order of a plan", () => {
  const planArb = fc
    .array(fc.record({ gap: fc.integer({ min: 0, max: 1800 }), len: fc.integer({ min: 60, max: 3600 }) }), {
      minLength: 1,
      maxLength: 12,
    })
    .map((parts) => {
      let t = 0;
      return parts.map((p, i) => {
        t += p.gap;
        const b = block(i + 1, t, p.len);
        t += p.len;
        return b;
      });
    });
  const opArb = fc.oneof(
    fc.record({ op: fc.constant("move" as const), a: fc.nat(20), b: fc.nat(20) }),
    fc.record({ op: fc.constant("resize" as const), a: fc.nat(20), len: fc.integer({ min: 60, max: 7200 }) }),
    fc.record({
      op: fc.constant("insert" as const),
      a: fc.integer({ min: -1, max: 20 }),
      len: fc.integer({ min: 60, max: 3600 }),
    }),
    fc.record({ op: fc.constant("remove" as const), a: fc.nat(20) }),
  );
  it("keeps time order and positive lengths", () => {
    fc.assert(
      fc.property(planArb, fc.array(opArb, { maxLength: 15 }), (start, ops) => {
        let bs = start;
        for (const o of ops) {
          const n = bs.length;
          const r =
            o.op === "move"
              ? moveBlock(bs, o.a % Math.max(n, 1), o.b % Math.max(n, 1))
              : o.op === "resize"
                ? resizeBlock(bs, o.a % Math.max(n, 1), o.len)
                : o.op === "insert"
                  ? insertBlock(
                      bs,
                      Math.min(o.a, n - 1),
                      { kind: "calibrator", target: "X", object: "K", proposalId: null, proposalTargetId: null },
                      o.len,
                      -7200,
                    )
                  : removeBlock(bs, o.a % Math.max(n, 1));
          if (r.ok) {
            const lengths = (x: EditBlock[]) => x.map((b) => b.endSec - b.startSec).sort((p, q) => p - q);
            if (o.op === "move") expect(lengths(r.blocks)).toEqual(lengths(bs));
            bs = r.blocks;
          }
          for (let i = 0; i < bs.length; i++) {
            expect(Number.isInteger(bs[i].startSec) && bs[i].endSec > bs[i].startSec).toBe(true);
            if (i > 0) expect(bs[i].startSec).toBeGreaterThanOrEqual(bs[i - 1].endSec);
          }
        }
      }),
      { numRuns: 300 },
    );
  });
});
