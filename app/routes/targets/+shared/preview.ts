/** What an import would do, row by row, as the import page shows it (pure). */
import { describeModel } from "~/components/targets/describe-model";
import type { RowError, TargetCsvResult } from "~/services/targets/csv";
import { coordinateText } from "./columns";

export type PreviewRow = {
  row: number;
  name: string;
  ra: string;
  dec: string;
  model: string;
  magnitudes: string;
  change: "new" | "update";
};

/** The checked list, with the text it came from so that the import can post it again. */
export type Preview = {
  csv: string;
  replace: boolean;
  rows: PreviewRow[];
  errors: RowError[];
  warnings: string[];
  /** Rows identical to targets already in the list (nothing to write for them). */
  unchanged: number;
};

/** The preview of a parsed list; `existing` are the lower-case names already in My targets. */
export function previewOf(
  { csv, replace }: { csv: string; replace: boolean },
  result: TargetCsvResult,
  existing: Set<string>,
): Preview {
  const rows = result.targets.map(
    (t): PreviewRow => ({
      row: t.row,
      name: t.name,
      ...coordinateText(t),
      model: describeModel(t.model),
      magnitudes: Object.entries(t.magnitudes)
        .map(([b, m]) => `${b} ${m}`)
        .join(", "),
      change: existing.has(t.name.toLowerCase()) ? "update" : "new",
    }),
  );
  return { csv, replace, rows, errors: result.errors, warnings: result.warnings, unchanged: result.unchanged };
}
