/**
 * Counted nouns and the status line of the Sketchpad and the Triangle finder, in words. Pure.
 */

export { plural } from "~/lib/format";

/** Seconds with two decimals, from milliseconds: 283.4 → "0.28 s". */
export function seconds(ms: number): string {
  return `${(ms / 1000).toFixed(2)} s`;
}

const utc = (ms: number) => new Date(ms).toISOString();

/**
 * A span of time in UTC, 24-hour clock, the zone shown: "2027-03-16 01:20–06:40 UTC (5.3 h)", or with
 * both dates when it crosses midnight UTC: "2027-03-15 23:10 – 2027-03-16 04:40 UTC (5.5 h)".
 */
export function utcSpan(startMs: number, endMs: number): string {
  const a = utc(startMs);
  const b = utc(endMs);
  const hours = `(${((endMs - startMs) / 3.6e6).toFixed(1)} h)`;
  if (a.slice(0, 10) === b.slice(0, 10)) return `${a.slice(0, 10)} ${a.slice(11, 16)}–${b.slice(11, 16)} UTC ${hours}`;
  return `${a.slice(0, 10)} ${a.slice(11, 16)} – ${b.slice(0, 10)} ${b.slice(11, 16)} UTC ${hours}`;
}

/** Where the Sketchpad is between a change and its plots being on screen. */
export interface SketchProgress {
  /** Text typed that has not settled yet. */
  typing: boolean;
  /** The request for the current inputs is being answered. */
  computing: boolean;
  /** The API refused the current inputs. */
  refused: boolean;
  /**
   * The refusal was "busy, try again later" (429/503 with Retry-After): seconds until the page asks
   * again; null for any other refusal.
   */
  busyRetryS?: number | null;
  /** The inputs make a request (no page-side error, a target typed). */
  ready: boolean;
  /** No target typed yet. */
  waitingForTarget: boolean;
  /** The answer for the current inputs is at hand. */
  answered: boolean;
  /** Milliseconds from the change to its plots drawn; null until drawn. */
  drawnMs: number | null;
  /** The inputs are the ones the page opened with (no change yet). */
  opened: boolean;
}

/**
 * The status line: what the page is doing for the last change, and once the plots are on screen how
 * long that took from the change (not the server's round trip). `busy` while work is under way,
 * `problem` when an input stops the update.
 */
export function sketchStatus(p: SketchProgress): { text: string; busy: boolean; problem: boolean } {
  if (p.typing) return { text: "Waiting for you to finish typing…", busy: true, problem: false };
  if (p.computing) return { text: "Computing the sketch…", busy: true, problem: false };
  if (p.ready && p.refused && p.busyRetryS != null) {
    return { text: `The server is busy: asking again in ${p.busyRetryS} s`, busy: true, problem: false };
  }
  if (p.ready && p.refused) return { text: "Not computed: fix the marked input", busy: false, problem: true };
  if (p.ready && p.answered && p.drawnMs === null) return { text: "Drawing the plots…", busy: true, problem: false };
  if (p.ready && p.answered) {
    const text = p.opened ? "Up to date" : `Up to date: drawn ${seconds(p.drawnMs ?? 0)} after your change`;
    return { text, busy: false, problem: false };
  }
  if (p.ready) return { text: "Ready", busy: false, problem: false };
  if (p.waitingForTarget) return { text: "Waiting for a target", busy: false, problem: false };
  return { text: "Fix the marked inputs to update", busy: false, problem: true };
}
