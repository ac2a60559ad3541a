/** Reviewer calibration: each reviewer's mean score and spread beside the committee's. */
import { Card } from "~/components/ui";
import type { BoardPageData } from "~/services/committee/board-page.server";

export function CalibrationCard({
  calibration,
  scaleText,
}: {
  calibration: BoardPageData["calibration"];
  scaleText: string;
}) {
  const c = calibration.committee;
  return (
    <Card title="Reviewer calibration">
      <p className="mb-3 text-sm text-night-700">
        A reviewer whose mean sits far from the committee's scores harder or kinder; a small spread uses little of the
        scale ({scaleText}). The normalized score corrects both.
      </p>
      <div className="overflow-x-auto">
        <table className="min-w-full text-sm">
          <caption className="sr-only">Mean and spread of each reviewer's scores</caption>
          <thead>
            <tr className="text-left text-night-700">
              <th scope="col" className="py-1 pr-3 font-semibold">
                Reviewer
              </th>
              <th scope="col" className="py-1 pr-3 text-right font-semibold">
                Reviews
              </th>
              <th scope="col" className="py-1 pr-3 text-right font-semibold">
                Mean (score)
              </th>
              <th scope="col" className="py-1 pr-3 text-right font-semibold">
                Spread (score SD)
              </th>
              <th scope="col" className="py-1 text-right font-semibold">
                Mean − committee
              </th>
            </tr>
          </thead>
          <tbody className="divide-y divide-night-100">
            {calibration.reviewers.map((r) => (
              <tr key={r.label}>
                <th scope="row" className="py-1 pr-3 text-left font-medium">
                  {r.label} <span className="font-normal text-night-600">{r.name}</span>
                </th>
                <td className="num py-1 pr-3 text-right">{r.reviews}</td>
                <td className="num py-1 pr-3 text-right">{r.meanScore.toFixed(2)}</td>
                <td className="num py-1 pr-3 text-right">{r.sdScore.toFixed(2)}</td>
                <td className="num py-1 text-right">
                  {c.meanScore === null
                    ? "—"
                    : (r.meanScore - c.meanScore >= 0 ? "+" : "") + (r.meanScore - c.meanScore).toFixed(2)}
                </td>
              </tr>
            ))}
            <tr className="font-semibold">
              <th scope="row" className="py-1 pr-3 text-left">
                Committee
              </th>
              <td className="num py-1 pr-3 text-right">{c.reviews}</td>
              <td className="num py-1 pr-3 text-right">{c.meanScore === null ? "—" : c.meanScore.toFixed(2)}</td>
              <td className="num py-1 pr-3 text-right">{c.sdScore.toFixed(2)}</td>
              <td className="py-1 text-right">—</td>
            </tr>
          </tbody>
        </table>
      </div>
    </Card>
  );
}
