/** The feasibility report as the proposal pages show it: overall verdict, problems, one card per cell. */
import type { FeasibilityReport, Verdict } from "~/services/proposals/feasibility";
import { VerdictBadge } from "./Badges";
import { shownUtc } from "./utc";

const VERDICT_SENTENCE: Record<Verdict, string> = {
  pass: "Every line passes.",
  caution: "Feasible, with lines that ask for care.",
  fail: "At least one line fails: read the reasons below.",
};

/** The whole report: overall verdict, proposal-level problems, one card per target × configuration. */
export function FeasibilityView({ report }: { report: FeasibilityReport }) {
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
          {report.band ? `${report.band} · ` : ""}computed {shownUtc(report.computedAt)} in {report.elapsedMs} ms,{" "}
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
