/**
 * How the import preview shows a change: a badge per record (new, updated, unchanged, removed, left
 * as is), counts per kind, and a value that changes drawn as "old → new" with the new one marked.
 */
import { Badge, type BadgeTone, type Column } from "~/components/ui";
import type { Change } from "~/services/registry/plan";

export const CHANGE: Record<Change, { label: string; tone: BadgeTone }> = {
  new: { label: "new", tone: "info" },
  updated: { label: "updated", tone: "caution" },
  unchanged: { label: "unchanged", tone: "neutral" },
  remove: { label: "removed", tone: "danger" },
  keep: { label: "left as is", tone: "neutral" },
};

export function ChangeBadge({ change }: { change: Change }) {
  return <Badge tone={CHANGE[change].tone}>{CHANGE[change].label}</Badge>;
}

export function ChangeCounts({ counts, noun }: { counts: Record<Change, number>; noun: string }) {
  const parts = (Object.keys(CHANGE) as Change[]).filter((c) => counts[c] > 0);
  if (parts.length === 0) return <span className="text-night-600">no {noun}</span>;
  return (
    <span className="inline-flex flex-wrap items-center gap-1.5">
      <span className="font-medium">{noun}:</span>
      {parts.map((c) => (
        <Badge key={c} tone={CHANGE[c].tone}>
          {counts[c]} {CHANGE[c].label}
        </Badge>
      ))}
    </span>
  );
}

/** "12.5" or, when it changes, "12.5 → 13" with the new value marked. */
export function Value<T>({
  before,
  after,
  changed,
  format,
}: {
  before: T | undefined;
  after: T | undefined;
  changed: boolean;
  format: (x: T) => string;
}) {
  if (after === undefined) return <span className="text-night-500">{before === undefined ? "—" : format(before)}</span>;
  if (!changed || before === undefined) return <>{format(after)}</>;
  return (
    <span className="whitespace-nowrap">
      <span className="text-night-500 line-through">{format(before)}</span> →{" "}
      <mark className="rounded bg-caution-50 px-1 font-semibold text-caution-700">{format(after)}</mark>
    </span>
  );
}

export const num = (x: number) => String(x);

/** A line of the preview: a record before and after the import, and the fields that differ. */
type ChangeLine<R> = { before: R | null; after: R | null; changed: readonly string[] };

/**
 * A column of one field of a record, drawn with `Value`; `value` gives what the table sorts and
 * exports (the field, before or after, unless told otherwise).
 */
export function changeColumn<L extends ChangeLine<R>, R, K extends keyof R & string>(
  key: string,
  header: string,
  field: K,
  format: (x: R[K]) => string,
  options: { unit?: string; align?: "right"; value?: (l: L) => string | number | null } = {},
): Column<L> {
  return {
    key,
    header,
    unit: options.unit,
    align: options.align,
    value: options.value ?? ((l) => ((l.after ?? l.before)?.[field] as string | number | undefined) ?? null),
    render: (l) => (
      <Value before={l.before?.[field]} after={l.after?.[field]} changed={l.changed.includes(field)} format={format} />
    ),
  };
}

/** The row, name and change columns every table of the preview starts with. */
export function lineColumns<L extends { row: number | null; name: string; change: Change }>(noun: string): Column<L>[] {
  return [
    { key: "row", header: "Row", align: "right", value: (l) => l.row },
    { key: "name", header: noun, value: (l) => l.name, render: (l) => <span className="font-medium">{l.name}</span> },
    {
      key: "change",
      header: "Change",
      value: (l) => CHANGE[l.change].label,
      render: (l) => <ChangeBadge change={l.change} />,
    },
  ];
}
