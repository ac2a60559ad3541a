import type { ReactNode } from "react";
import { cx } from "./cx";

/** One term of a `DetailList`: its label (unique in the list), its value, and classes of its own (`col-span-2`). */
export type Detail = { label: string; value: ReactNode; className?: string };

/**
 * Label–value pairs as a description list (`dl`), one `div` per pair. The list's layout comes from
 * `className` (a grid), each pair's from `itemClassName` (`contents` to let the grid place dt and dd).
 */
export function DetailList({
  items,
  className,
  itemClassName,
  termClassName = "text-sm text-night-600",
  valueClassName,
}: {
  items: readonly Detail[];
  className?: string;
  itemClassName?: string;
  termClassName?: string;
  valueClassName?: string;
}) {
  return (
    <dl className={className}>
      {items.map(({ label, value, className: own }) => (
        <div key={label} className={cx(itemClassName, own) || undefined}>
          <dt className={termClassName}>{label}</dt>
          <dd className={valueClassName}>{value}</dd>
        </div>
      ))}
    </dl>
  );
}
