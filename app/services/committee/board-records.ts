/**
 * What the Ranking board is computed from: plain records read from the database (board.server.ts) or
 * built by a test or the benchmark. Pure types, safe in the browser.
 */
import type { StationInput } from "~/engine";
import type { Scale } from "./scale";

export type BoardDecisionKind = "accept" | "waitlist" | "decline";

export type HoursByConfiguration = Record<number, number>;

export type BoardRecords = {
  cycle: {
    id: number;
    name: string;
    state: "draft" | "open" | "reviewing" | "deciding" | "closed";
    scale: Scale;
    observingStart: string;
    observingEnd: string;
  };
  settings: { triageAfter: number | null; disagreementSpread: number };
  /** Reviewers in the order of their labels R1, R2, … (committee members, then anyone else with a score). */
  reviewers: { id: number; name: string }[];
  proposals: {
    id: number;
    title: string;
    pi: string;
    category: string;
    status: string;
    /** Requested hours per configuration id. */
    hours: HoursByConfiguration;
    targets: { name: string; raDeg: number; decDeg: number; minElevationDeg: number | null }[];
    /** Active assignments and how many of them have a submitted review. */
    assigned: number;
    submitted: number;
  }[];
  /** Submitted reviews with their scores. */
  reviews: { proposalId: number; reviewerId: number; score: number }[];
  decisions: {
    proposalId: number;
    finalGrade: number | null;
    decision: BoardDecisionKind | null;
    message: string;
    releasedAt: string | null;
    hours: HoursByConfiguration;
  }[];
  /** Configurations on offer, with what the LST pressure needs. */
  configurations: {
    id: number;
    name: string;
    /** Nights on offer; null when the chair has not fixed them (no capacity). */
    nights: number | null;
    siteId: number;
    stations: StationInput[];
    delayLineStrokeM: number | null;
    minElevationDeg: number;
  }[];
};

/** The id a proposal or reviewer has in the `rank` computation: zero-padded, so ties fall back to the number. */
export const rankId = (id: number) => String(id).padStart(10, "0");
