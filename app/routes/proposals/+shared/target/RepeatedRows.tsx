/**
 * Rows a person adds and removes in a form (time windows, calibrators): each row keeps its own key so
 * React keeps what was typed in the others, with a Remove button and the row's error under it; an
 * Add button below, up to a limit.
 */
import { type ReactNode, useRef, useState } from "react";
import { Button, cx } from "~/components/ui";

type RepeatedRowsProps<T> = {
  /** The rows shown first (stored, or as posted). */
  initial: T[];
  /** A new row. */
  empty: T;
  max: number;
  /** "window", "calibrator": names the Remove button of each row. */
  what: string;
  addLabel: string;
  /** Shown while there is no row. */
  none: ReactNode;
  /** The inputs of row `i`. */
  fields: (row: T, i: number) => ReactNode;
  /** The row's grid columns, e.g. "sm:grid-cols-[1fr_1fr_auto]". */
  layout: string;
  /** The column span of the error line, e.g. "sm:col-span-3". */
  errorSpan: string;
  errorOf: (i: number) => string | undefined;
};

export function RepeatedRows<T>(props: RepeatedRowsProps<T>) {
  const { fields, what, layout, errorSpan, errorOf } = props;
  const counter = useRef(0);
  const keyed = (list: T[]) => list.map((row) => ({ key: ++counter.current, row }));
  const [rows, setRows] = useState(() => keyed(props.initial));
  return (
    <>
      {rows.length === 0 ? props.none : null}
      {rows.map(({ key, row }, i) => (
        <div key={key} className={cx("grid items-end gap-3 rounded-lg bg-night-50 p-3 ring-1 ring-night-200", layout)}>
          {fields(row, i)}
          <Button
            variant="ghost"
            size="sm"
            onClick={() => setRows((list) => list.filter((x) => x.key !== key))}
            aria-label={`Remove ${what} ${i + 1}`}
          >
            Remove
          </Button>
          {errorOf(i) ? (
            <p role="alert" className={cx("text-sm font-medium text-danger-700", errorSpan)}>
              {errorOf(i)}
            </p>
          ) : null}
        </div>
      ))}
      <div>
        <Button
          variant="secondary"
          size="sm"
          onClick={() => setRows((list) => [...list, ...keyed([props.empty])])}
          disabled={rows.length >= props.max}
        >
          {props.addLabel}
        </Button>
      </div>
    </>
  );
}
