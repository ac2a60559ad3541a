/** The Triangle finder's answer: what was ranked, and the ranked triangles as a sortable table. */
import { useMemo } from "react";
import { Card, DataTable } from "~/components/ui";
import type { TrianglesResponse } from "~/engine";
import { plural } from "~/services/sketch/words";
import { type TriangleRow, triangleColumns } from "./triangle-columns";

export function RankingTable({
  result,
  rows,
  onUse,
}: {
  result: TrianglesResponse;
  rows: TriangleRow[];
  /** "Use this triangle" on each row, when the viewer has proposal targets to store it on. */
  onUse?: (row: TriangleRow) => void;
}) {
  const cols = useMemo(() => triangleColumns(onUse), [onUse]);
  return (
    <Card id="ranking" title="Ranked triangles" className="space-y-3">
      <p className="text-sm text-night-700">
        {plural(result.triangleCount, "triangle")} of {plural(result.stationCount, "station")} over{" "}
        {plural(result.sampleCount, "sample")} of {(result.sampleDurationH * 60).toFixed(0)} min
        {result.triangles.length < result.triangleCount ? `; the best ${result.triangles.length} are listed` : ""}. The
        pool has {plural(result.independentClosurePhases, "independent closure phase")}. {result.scoring}.
      </p>
      <DataTable
        caption="Station triangles ranked for the target"
        columns={cols}
        rows={rows}
        rowKey={(r) => r.stations.join("-")}
        exportName="triangles"
      />
    </Card>
  );
}
