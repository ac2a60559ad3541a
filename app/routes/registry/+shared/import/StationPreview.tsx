/** What a station import would do: counts, and one line per station with the changed values side by side. */
import { type Column, DataTable } from "~/components/ui";
import type { StationLine, StationPlan } from "~/services/registry/plan";
import type { StationRecord } from "~/services/registry/schemas";
import { ChangeCounts, changeColumn, lineColumns, num } from "./ChangeParts";

const metres = (field: "eastM" | "northM" | "upM" | "pathOffsetM", header: string) =>
  changeColumn<StationLine, StationRecord, typeof field>(field, header, field, num, { unit: "m", align: "right" });

const stationColumns: Column<StationLine>[] = [
  ...lineColumns<StationLine>("Station"),
  metres("eastM", "East"),
  metres("northM", "North"),
  metres("upM", "Up"),
  metres("pathOffsetM", "Path offset"),
  {
    key: "note",
    header: "Note",
    value: (l) => l.note,
    render: (l) => <span className="text-night-600">{l.note ?? ""}</span>,
  },
];

/** A station of the site that the file does not mention and that nothing happens to. */
const untouched = (l: StationLine) => l.change === "keep" && l.note === "not in the file; left as it is";

/** Unchanged stations are listed inline when few, folded away when many. */
const INLINE_UNCHANGED = 5;

export function StationChanges({ lines }: { lines: StationLine[] }) {
  const unchanged = lines.filter((l) => l.change === "unchanged");
  const foldUnchanged = unchanged.length > INLINE_UNCHANGED;
  const shown = lines.filter((l) => !untouched(l) && !(foldUnchanged && l.change === "unchanged"));
  const quiet = lines.filter(untouched).length;
  const one = quiet === 1;
  return (
    <div className="space-y-2">
      {shown.length > 0 ? (
        <DataTable
          caption="What the import would do to each station"
          columns={stationColumns}
          rows={shown}
          rowKey={(l) => `${l.row ?? "site"}-${l.name}`}
        />
      ) : null}
      {foldUnchanged ? (
        <details className="text-sm">
          <summary className="cursor-pointer font-medium text-night-800">
            {unchanged.length} stations in the file match the registry already
          </summary>
          <div className="mt-2">
            <DataTable
              caption="Stations of the file that are unchanged"
              columns={stationColumns}
              rows={unchanged}
              rowKey={(l) => `${l.row}-${l.name}`}
            />
          </div>
        </details>
      ) : null}
      {quiet > 0 ? (
        <p className="text-sm text-night-600">
          {quiet} station{one ? "" : "s"} of the site {one ? "is" : "are"} not in the file and stay{one ? "s" : ""} as{" "}
          {one ? "it is" : "they are"}.
        </p>
      ) : null}
    </div>
  );
}

/** The counts of a plan's stations above its lines. */
export function StationPreview({ lines, counts }: { lines: StationLine[]; counts: StationPlan["counts"] }) {
  return (
    <div className="space-y-3">
      <p className="text-sm">
        <ChangeCounts counts={counts} noun="Stations" />
      </p>
      <StationChanges lines={lines} />
    </div>
  );
}
