import { type HTMLAttributes, type ReactNode, useMemo, useState } from "react";
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
  /** The cell names its row (`<th scope="row">`), as the first column of a summary table does. */
  rowHeader?: boolean;
  /** A column of form controls: its header does not sort and the CSV export leaves it out. */
  controls?: boolean;
  /** Extra classes of the column's cells, e.g. "align-top" or "whitespace-nowrap". */
  className?: string;
};

/**
 * A right-aligned numeric column shown with a fixed number of decimals; sorted and exported as the number.
 * A missing value shows as `missing` (default "—") and sorts last.
 */
export function fixedColumn<Row>({
  digits,
  missing = "—",
  ...column
}: Omit<Column<Row>, "align" | "render" | "value"> & {
  value: (row: Row) => number | null;
  digits: number;
  missing?: string;
}): Column<Row> {
  return {
    ...column,
    align: "right",
    render: (row) => {
      const x = column.value(row);
      return x === null ? missing : x.toFixed(digits);
    },
  };
}

/** The row-naming first column: a name with a muted note after it (an institute, a reviewer's name). */
export function namedColumn<Row>({
  name,
  note,
  ...column
}: Pick<Column<Row>, "key" | "header"> & { name: (row: Row) => string; note: (row: Row) => string }): Column<Row> {
  return {
    ...column,
    rowHeader: true,
    value: name,
    render: (row) => (
      <>
        {name(row)} <span className="font-normal text-night-600">{note(row)}</span>
      </>
    ),
  };
}

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

/** Rows as CSV text (through `toCsv`), with units in the header names; columns of controls are left out. */
export function tableToCsv<Row>(columns: Column<Row>[], rows: Row[]): string {
  const exported = columns.filter((c) => !c.controls);
  return toCsv(
    exported.map(headerText),
    rows.map((r) => exported.map((c) => c.value(r))),
  );
}

const DENSITY = {
  /** Pages whose table is the content. */
  regular: { head: "px-3 py-2", cell: "px-3 py-2" },
  /** Small tables inside a card beside other figures. */
  compact: { head: "px-2 py-1.5", cell: "px-2 py-1" },
} as const;

function SortHeader<Row>({
  column: c,
  dir,
  onSort,
}: {
  column: Column<Row>;
  dir?: "asc" | "desc";
  onSort: () => void;
}) {
  if (c.controls) return <>{c.header}</>;
  return (
    <button
      type="button"
      onClick={onSort}
      className="inline-flex items-center gap-1 rounded hover:text-ember-800"
      title={`Sort by ${c.header}`}
    >
      {c.header}
      {c.unit ? <span className="font-normal text-night-500">({c.unit})</span> : null}
      <span aria-hidden="true" className="w-3 text-night-500">
        {dir ? (dir === "asc" ? "▲" : "▼") : "↕"}
      </span>
    </button>
  );
}

/** One row's cells; `summary` for a footer row, whose header cell keeps the row's weight. */
function Cells<Row>({
  columns,
  row,
  pad,
  summary,
}: {
  columns: Column<Row>[];
  row: Row;
  pad: string;
  summary?: boolean;
}) {
  return columns.map((c) => {
    const className = cx(pad, c.align === "right" ? "num text-right" : "text-left", c.className);
    const content = c.render ? c.render(row) : (c.value(row) ?? "—");
    return c.rowHeader ? (
      <th key={c.key} scope="row" className={cx(className, !summary && "font-medium")}>
        {content}
      </th>
    ) : (
      <td key={c.key} className={className}>
        {content}
      </td>
    );
  });
}

/** The key of a row that has an `id` (else a `key`); rows with neither must be given `rowKey`. */
function idOf(row: unknown): string | number {
  const r = row as { id?: string | number; key?: string | number };
  return r.id ?? (r.key as string | number);
}

/** `rowKey` may be left out when every row has an `id` or a `key`. */
type RowKeyProp<Row> = Row extends { id: string | number } | { key: string | number }
  ? { rowKey?: (row: Row) => string | number }
  : { rowKey: (row: Row) => string | number };

/** Hands text to the browser as a file download (CSV unless `type` says otherwise). */
export function download(filename: string, text: string, type = "text/csv") {
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
  footer = [],
  density = "regular",
  rowProps,
  className,
}: {
  columns: Column<Row>[];
  rows: Row[];
  caption: string;
  /** File name (without extension) for the CSV export; no export button when absent. */
  exportName?: string;
  empty?: ReactNode;
  /** Summary rows (totals, the committee's figures) below the others: never sorted, exported last. */
  footer?: Row[];
  density?: keyof typeof DENSITY;
  /** Attributes of a body row (its highlight, drag and drop, data attributes). */
  rowProps?: (row: Row) => HTMLAttributes<HTMLTableRowElement> & { [data: `data-${string}`]: string | number };
  /** Extra classes of the scrolling frame, e.g. a maximum height. */
  className?: string;
} & RowKeyProp<Row>) {
  const pad = DENSITY[density];
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
            onClick={() => download(`${exportName}.csv`, tableToCsv(columns, [...sorted, ...footer]))}
          >
            Export CSV
          </Button>
        </div>
      ) : null}
      <div className={cx("overflow-x-auto rounded-lg ring-1 ring-night-200", className)}>
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
                    aria-sort={c.controls ? undefined : ariaSort}
                    className={cx(
                      pad.head,
                      "font-semibold text-night-800",
                      c.align === "right" ? "text-right" : "text-left",
                    )}
                  >
                    <SortHeader column={c} dir={active ? sort.dir : undefined} onSort={() => toggle(c.key)} />
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
              sorted.map((row) => {
                const props = rowProps?.(row);
                return (
                  <tr key={rowKey(row)} {...props} className={cx("hover:bg-night-50", props?.className)}>
                    <Cells columns={columns} row={row} pad={pad.cell} />
                  </tr>
                );
              })
            )}
          </tbody>
          {footer.length ? (
            <tfoot className="border-t border-night-200 font-semibold">
              {footer.map((row) => (
                <tr key={rowKey(row)}>
                  <Cells columns={columns} row={row} pad={pad.cell} summary />
                </tr>
              ))}
            </tfoot>
          ) : null}
        </table>
      </div>
    </div>
  );
}
