/**
 * "Use this triangle" in the Triangle finder: the choices offered (the viewer's drafts with their
 * targets) and the post's field rules. Pure; the write is in triangle-choice.server.ts.
 */
import * as v from "valibot";
import type { ClosureTriangleJson } from "~/db/schema/proposals";

/** A draft the viewer may change, with its targets, for the picker. */
export type ProposalTargetChoice = {
  id: number;
  title: string;
  cycleName: string;
  targets: { id: number; name: string; closureTriangle: ClosureTriangleJson | null }[];
};

const name = (label: string) =>
  v.pipe(
    v.string(`${label}: missing.`),
    v.trim(),
    v.minLength(1, `${label}: missing.`),
    v.maxLength(100, `${label}: at most 100 characters.`),
  );

/** "A1,B3,C2": three different station names. */
const stationsField = v.pipe(
  v.string("Stations: missing."),
  v.transform((s) => s.split(",").map((x) => x.trim())),
  v.check((list) => list.length === 3 && list.every((x) => x.length > 0 && x.length <= 100), "Stations: give three."),
  v.check((list) => new Set(list).size === 3, "Stations: the three must differ."),
  v.transform((list) => list as [string, string, string]),
);

/** The post of "Use this triangle". `target` is "<proposal id>:<target id>"; `pool` "all" for every station. */
export const UseTriangleSchema = v.object({
  target: v.pipe(
    v.string("Proposal target: choose one."),
    v.regex(/^\d{1,9}:\d{1,9}$/, "Proposal target: choose one."),
    v.transform((s) => {
      const [proposalId, targetId] = s.split(":").map(Number);
      return { proposalId, targetId };
    }),
  ),
  stations: stationsField,
  site: name("Site"),
  instrument: name("Instrument"),
  band: name("Band"),
  pool: name("Pool"),
});

export type UseTriangleInput = v.InferOutput<typeof UseTriangleSchema>;
