import { type ReactNode, useMemo, useState } from "react";
import { toCsv } from "~/lib/csv";
import { Button } from "./Button";
import { cx } from "./cx";

export type Column<Row> = {
  key: string;
  header: string;
  /** Unit shown in the header and in the exported column name, e.g. "m" or "mas". */
  unit?: string;
  align?: "left" | "right";
  /** The sortable, exportable value of the cell. */
  value: (row: Row) => string | number | null;
  /** How the cell looks; defaults to the value. */
  render?: (row: Row) => ReactNode;
};

type Sort = { key: string; dir: "asc" | "desc" } | null;

function compare(a: string | number | null, b: string | number | null) {
  if (a === b) return 0;
  if (a === null) return 1;
  if (b === null) return -1;
  if (typeof a === "number" && typeof b === "number") return a - b;
  return String(a).localeCompare(String(b), undefined, { numeric: true });
}

function headerText<Row>(c: Column<Row>) {
  return c.unit ? `${c.header} (${c.unit})` : c.header;
}

/** Rows as CSV text (through `toCsv`), with units in the header names. */
export function tableToCsv<Row>(columns: Column<Row>[], rows: Row[]): string {
  return toCsv(
    columns.map(headerText),
    rows.map((r) => columns.map((c) => c.value(r))),
  );
}

/** The key of a row that has an `id`; rows without one must be given `rowKey`. */
function idOf(row: unknown): string | number {
  return (row as { id: string | number }).id;
}

/** `rowKey` may be left out when every row has an `id`. */
type RowKeyProp<Row> = Row extends { id: string | number }
  ? { rowKey?: (row: Row) => string | number }
  : { rowKey: (row: Row) => string | number };

function download(filename: string, text: string, type = "text/csv") {
  const url = URL.createObjectURL(new Blob([text], { type: `${type};charset=utf-8` }));
  const a = document.createElement("a");
  a.href = url;
  a.download = filename;
  document.body.appendChild(a);
  a.click();
  a.remove();
  URL.revokeObjectURL(url);
}

/**
 * A table that sorts by any column (click or Enter on the header) and exports what it shows as CSV.
 */
export function DataTable<Row>({
  columns,
  rows,
  rowKey = idOf,
  caption,
  exportName,
  empty,
}: {
  columns: Column<Row>[];
  rows: Row[];
  caption: string;
  /** File name (without extension) for the CSV export; no export button when absent. */
  exportName?: string;
  empty?: ReactNode;
} & RowKeyProp<Row>) {
  const [sort, setSort] = useState<Sort>(null);
  const sorted = useMemo(() => {
    if (!sort) return rows;
    const col = columns.find((c) => c.key === sort.key);
    if (!col) return rows;
    const out = [...rows].sort((a, b) => compare(col.value(a), col.value(b)));
    return sort.dir === "asc" ? out : out.reverse();
  }, [rows, columns, sort]);

  function toggle(key: string) {
    setSort((s) => (s?.key === key ? { key, dir: s.dir === "asc" ? "desc" : "asc" } : { key, dir: "asc" }));
  }

  return (
    <div className="space-y-2">
      {exportName ? (
        <div className="flex justify-end">
          <Button
            variant="secondary"
            size="sm"
            onClick={() => download(`${exportName}.csv`, tableToCsv(columns, sorted))}
          >
            Export CSV
          </Button>
        </div>
      ) : null}
      <div className="overflow-x-auto rounded-lg ring-1 ring-night-200">
        <table className="min-w-full divide-y divide-night-200 bg-white text-sm">
          <caption className="sr-only">{caption}</caption>
          <thead className="bg-night-100/70">
            <tr>
              {columns.map((c) => {
                const active = sort?.key === c.key;
                const ariaSort = active ? (sort.dir === "asc" ? "ascending" : "descending") : "none";
                return (
                  <th
                    key={c.key}
                    scope="col"
                    aria-sort={ariaSort}
                    className={cx(
                      "px-3 py-2 font-semibold text-night-800",
                      c.align === "right" ? "text-right" : "text-left",
                    )}
                  >
                    <button
                      type="button"
                      onClick={() => toggle(c.key)}
                      className="inline-flex items-center gap-1 rounded hover:text-ember-800"
                      title={`Sort by ${c.header}`}
                    >
                      {c.header}
                      {c.unit ? <span className="font-normal text-night-500">({c.unit})</span> : null}
                      <span aria-hidden="true" className="w-3 text-night-500">
                        {active ? (sort.dir === "asc" ? "▲" : "▼") : "↕"}
                      </span>
                    </button>
                  </th>
                );
              })}
            </tr>
          </thead>
          <tbody className="divide-y divide-night-100">
            {sorted.length === 0 ? (
              <tr>
                <td colSpan={columns.length} className="px-3 py-6 text-center text-night-600">
                  {empty ?? "Nothing to show."}
                </td>
              </tr>
            ) : (
              sorted.map((row) => (
                <tr key={rowKey(row)} className="hover:bg-night-50">
                  {columns.map((c) => (
                    <td key={c.key} className={cx("px-3 py-2", c.align === "right" ? "num text-right" : "text-left")}>
                      {c.render ? c.render(row) : (c.value(row) ?? "—")}
                    </td>
                  ))}
                </tr>
              ))
            )}
          </tbody>
        </table>
      </div>
    </div>
  );
}
