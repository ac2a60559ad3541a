/** Reviewer calibration: each reviewer's mean score and spread beside the committee's. */
import { Card, type Column, DataTable, fixedColumn, namedColumn } from "~/components/ui";
import type { BoardPageData } from "~/services/committee/board-page.server";

/** A reviewer's line, or the committee's at the foot (which has no offset from itself). */
type Line = {
  key: string;
  label: string;
  name: string;
  reviews: number;
  meanScore: number | null;
  sdScore: number;
  offset: number | null;
};

const signed = (x: number | null) => (x === null ? "—" : (x >= 0 ? "+" : "") + x.toFixed(2));

const columns: Column<Line>[] = [
  namedColumn({ key: "reviewer", header: "Reviewer", name: (r) => r.label, note: (r) => r.name }),
  { key: "reviews", header: "Reviews", align: "right", value: (r) => r.reviews },
  fixedColumn({ key: "mean", header: "Mean", unit: "score", digits: 2, value: (r) => r.meanScore }),
  fixedColumn({ key: "sd", header: "Spread", unit: "score SD", digits: 2, value: (r) => r.sdScore }),
  {
    key: "offset",
    header: "Mean − committee",
    align: "right",
    value: (r) => r.offset,
    render: (r) => signed(r.offset),
  },
];

export function CalibrationCard({
  calibration,
  scaleText,
}: {
  calibration: BoardPageData["calibration"];
  scaleText: string;
}) {
  const c = calibration.committee;
  const reviewers = calibration.reviewers.map(
    (r): Line => ({ ...r, key: r.label, offset: c.meanScore === null ? null : r.meanScore - c.meanScore }),
  );
  const committee: Line = { ...c, key: "committee", label: "Committee", name: "", offset: null };
  return (
    <Card title="Reviewer calibration">
      <p className="mb-3 text-sm text-night-700">
        A reviewer whose mean sits far from the committee's scores harder or kinder; a small spread uses little of the
        scale ({scaleText}). The normalized score corrects both.
      </p>
      <DataTable
        columns={columns}
        rows={reviewers}
        footer={[committee]}
        caption="Mean and spread of each reviewer's scores"
        exportName="reviewer-calibration"
        density="compact"
      />
    </Card>
  );
}
