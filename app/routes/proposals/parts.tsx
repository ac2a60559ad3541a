/**
 * Small pieces shared by the proposal pages: status and verdict badges, the feasibility table,
 * and formatting helpers. Pure presentation: data comes from the loaders.
 */
import { Badge, type BadgeTone } from "~/components/ui";

export type StatusKey =
  | "draft"
  | "submitted"
  | "under_review"
  | "accepted"
  | "waitlisted"
  | "declined"
  | "scheduled"
  | "withdrawn";

const STATUS_TONE: Record<StatusKey, BadgeTone> = {
  draft: "neutral",
  submitted: "info",
  under_review: "accent",
  accepted: "ok",
  waitlisted: "caution",
  declined: "danger",
  scheduled: "ok",
  withdrawn: "neutral",
};

export function StatusBadge({ status, label }: { status: StatusKey; label: string }) {
  return <Badge tone={STATUS_TONE[status]}>{label}</Badge>;
}

export type VerdictKey = "pass" | "caution" | "fail";

const VERDICT: Record<VerdictKey, { tone: BadgeTone; label: string; mark: string }> = {
  pass: { tone: "ok", label: "pass", mark: "✓" },
  caution: { tone: "caution", label: "caution", mark: "!" },
  fail: { tone: "danger", label: "fail", mark: "✕" },
};

export function VerdictBadge({ verdict }: { verdict: VerdictKey }) {
  const v = VERDICT[verdict];
  return (
    <Badge tone={v.tone}>
      <span aria-hidden="true" className="mr-1 font-semibold">
        {v.mark}
      </span>
      {v.label}
    </Badge>
  );
}

export const fmtDeg = (x: number, d = 4) => `${x.toFixed(d)}°`;

/** "2027-01-15 12:00 UTC" from an ISO string. */
export const fmtUtc = (iso: string | null | undefined) => (iso ? `${iso.slice(0, 16).replace("T", " ")} UTC` : "—");

export function describeMagnitudes(m: Record<string, number>): string {
  const parts = Object.entries(m).map(([k, v]) => `${k} ${v}`);
  return parts.length ? parts.join(", ") : "—";
}

type ReportShape = {
  verdict: VerdictKey;
  computedAt: string;
  stepMin: number;
  elapsedMs: number;
  band: string | null;
  problems: { label: string; verdict: VerdictKey; reason: string }[];
  cells: {
    target: string;
    configuration: string;
    verdict: VerdictKey;
    nights: { date: string; when: string; darkHours: number; upHours?: number; observableHours: number }[];
    figures: {
      resolutionMas: number | null;
      sizeMas: number | null;
      vis2Min: number | null;
      vis2Max: number | null;
      longestBaselineM: number | null;
    };
    lines: { check: string; label: string; verdict: VerdictKey; reason: string }[];
  }[];
  thresholds: {
    tooResolvedVis2: number;
    unresolvedVis2: number;
    magnitudeMarginMag: number;
    minHoursPerNight: number;
    stepMin: number;
  };
};

const VERDICT_SENTENCE: Record<VerdictKey, string> = {
  pass: "Every line passes.",
  caution: "Feasible, with lines that ask for care.",
  fail: "At least one line fails: read the reasons below.",
};

/** The whole report: overall verdict, proposal-level problems, one card per target × configuration. */
export function FeasibilityView({ report }: { report: ReportShape }) {
  return (
    <div className="grid gap-4">
      <div
        className="flex flex-wrap items-center gap-3 rounded-lg bg-night-100/60 p-4 ring-1 ring-night-200"
        role="status"
        aria-label="Overall verdict"
      >
        <span className="text-sm font-semibold text-night-800">Overall</span>
        <VerdictBadge verdict={report.verdict} />
        <span className="text-night-800">{VERDICT_SENTENCE[report.verdict]}</span>
        <span className="ml-auto text-sm text-night-600">
          {report.band ? `${report.band} · ` : ""}computed {fmtUtc(report.computedAt)} in {report.elapsedMs} ms,{" "}
          {report.stepMin}-min steps
        </span>
      </div>
      {report.problems.length > 0 ? (
        <ul className="grid gap-2">
          {report.problems.map((p) => (
            <li
              key={p.label}
              className="flex items-start gap-3 rounded-lg bg-danger-50 p-3 text-sm ring-1 ring-danger-700/20"
            >
              <VerdictBadge verdict={p.verdict} />
              <span>
                <span className="font-semibold">{p.label}:</span> {p.reason}
              </span>
            </li>
          ))}
        </ul>
      ) : null}
      {report.cells.map((cell) => (
        <section
          key={`${cell.target}-${cell.configuration}`}
          className="rounded-lg bg-white p-4 ring-1 ring-night-200"
          aria-label={`${cell.target} with ${cell.configuration}`}
        >
          <header className="mb-3 flex flex-wrap items-center gap-2">
            <h3 className="font-semibold text-night-900">
              {cell.target} <span className="font-normal text-night-600">with</span> {cell.configuration}
            </h3>
            <VerdictBadge verdict={cell.verdict} />
            {cell.nights.length > 0 ? (
              <span className="num ml-auto text-sm text-night-600">
                {cell.nights
                  .map(
                    (n) =>
                      `${n.date}: ${n.observableHours.toFixed(2)} h observable of ${n.darkHours.toFixed(1)} h dark`,
                  )
                  .join(" · ")}
              </span>
            ) : null}
          </header>
          <table className="w-full text-sm">
            <caption className="sr-only">
              Checks for {cell.target} with {cell.configuration}
            </caption>
            <tbody className="divide-y divide-night-100">
              {cell.lines.map((line, i) => (
                <tr key={`${line.check}-${i}`}>
                  <th scope="row" className="w-44 py-2 pr-3 text-left align-top font-medium text-night-800">
                    {line.label}
                  </th>
                  <td className="w-24 py-2 pr-3 align-top">
                    <VerdictBadge verdict={line.verdict} />
                  </td>
                  <td className="py-2 align-top text-night-800">{line.reason}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </section>
      ))}
      <p className="text-sm text-night-600">
        How to read it: observable hours are counted on the first, middle and last night of the cycle (
        {report.thresholds.stepMin}-minute steps; elevation limit, astronomical darkness and every baseline within the
        delay-line stroke), below {report.thresholds.minHoursPerNight} h on a night is a caution. “Too resolved” means
        V² below {report.thresholds.tooResolvedVis2} on the shortest projected baseline; “barely resolved” means V²
        above {report.thresholds.unresolvedVis2} everywhere. A magnitude within {report.thresholds.magnitudeMarginMag}{" "}
        mag of the band's limit is a caution, fainter than the limit a failure. These thresholds are Fringe Docket's
        choices for a first look, not rules of the committee.
      </p>
    </div>
  );
}

/** Words as a reader counts them: runs of non-space characters (the abstract's limit counts these). */
export function countWords(text: string): number {
  const t = text.trim();
  return t === "" ? 0 : t.split(/\s+/).length;
}
