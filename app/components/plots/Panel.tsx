import type { ReactNode } from "react";
import { cx } from "~/components/ui";

/** A titled card holding one figure of the Sketchpad, with optional controls and a footnote. */
export function Panel({
  title,
  actions,
  children,
  note,
  className,
  id,
}: {
  title: string;
  actions?: ReactNode;
  children: ReactNode;
  note?: ReactNode;
  className?: string;
  id?: string;
}) {
  return (
    <section
      id={id}
      aria-labelledby={id ? `${id}-title` : undefined}
      className={cx(
        "min-w-0 rounded-[var(--radius-card)] bg-white p-4 shadow-[var(--shadow-card)] ring-1 ring-night-200",
        className,
      )}
    >
      <header className="mb-2 flex flex-wrap items-center justify-between gap-2">
        <h2 id={id ? `${id}-title` : undefined} className="text-base font-semibold">
          {title}
        </h2>
        {actions ? <div className="flex flex-wrap items-center gap-2">{actions}</div> : null}
      </header>
      {children}
      {note ? <div className="mt-2 text-xs text-night-600">{note}</div> : null}
    </section>
  );
}

/** Plotly reads "YYYY-MM-DD HH:MM:SS" as a wall-clock time; the Sketchpad's times are UTC. */
export function plotTime(ms: number): string {
  return new Date(ms).toISOString().slice(0, 19).replace("T", " ");
}

/** Two-way toggle drawn as a pair of radio buttons (keyboard: arrows). */
export function Toggle<T extends string>({
  label,
  value,
  options,
  onChange,
}: {
  label: string;
  value: T;
  options: readonly (readonly [T, string])[];
  onChange: (v: T) => void;
}) {
  return (
    <div role="radiogroup" aria-label={label} className="inline-flex rounded-lg bg-night-100 p-0.5 text-sm">
      {options.map(([v, text]) => (
        <label
          key={v}
          className={cx(
            "cursor-pointer rounded-md px-2.5 py-1 font-medium focus-within:outline-3 focus-within:outline-ember-500",
            v === value ? "bg-white text-night-900 shadow-sm" : "text-night-700 hover:text-night-900",
          )}
        >
          <input
            type="radio"
            className="sr-only"
            name={label}
            value={v}
            checked={v === value}
            onChange={() => onChange(v)}
          />
          {text}
        </label>
      ))}
    </div>
  );
}

export type LegendItem = {
  name: string;
  colour: string;
  kind?: "dot" | "ring" | "square" | "open-square" | "diamond" | "cross" | "line";
  dash?: string;
};

const DASH_ARRAY: Record<string, string> = { solid: "", dash: "6 3", dot: "1.5 3", dashdot: "6 3 1.5 3" };

/**
 * A legend in HTML under a figure, for series too many for Plotly's own legend to lay out well
 * (it wraps with the page and reads as text).
 */
export function SeriesLegend({ items, label }: { items: LegendItem[]; label: string }) {
  if (items.length === 0) return null;
  return (
    <ul aria-label={label} className="mt-1 flex flex-wrap gap-x-3 gap-y-1 text-xs text-night-800">
      {items.map((it) => (
        <li key={it.name} className="inline-flex items-center gap-1.5">
          <svg
            aria-hidden="true"
            width={it.kind === "line" ? 22 : 10}
            height="10"
            viewBox={it.kind === "line" ? "0 0 22 10" : "0 0 10 10"}
          >
            {it.kind === "line" ? (
              <line
                x1="1"
                y1="5"
                x2="21"
                y2="5"
                stroke={it.colour}
                strokeWidth="2"
                strokeDasharray={DASH_ARRAY[it.dash ?? "solid"]}
              />
            ) : it.kind === "square" ? (
              <rect x="0.5" y="0.5" width="9" height="9" fill={it.colour} stroke="#a5b0c8" strokeWidth="0.5" />
            ) : it.kind === "open-square" ? (
              <rect x="1.5" y="1.5" width="7" height="7" fill="#ffffff" stroke={it.colour} strokeWidth="1.5" />
            ) : it.kind === "diamond" ? (
              <path d="M5 0.8 L9.2 5 L5 9.2 L0.8 5 Z" fill="#ffffff" stroke={it.colour} strokeWidth="1.5" />
            ) : it.kind === "cross" ? (
              <path d="M1.5 1.5 L8.5 8.5 M8.5 1.5 L1.5 8.5" stroke={it.colour} strokeWidth="1.8" />
            ) : it.kind === "ring" ? (
              <circle cx="5" cy="5" r="3.6" fill="#ffffff" stroke={it.colour} strokeWidth="1.5" />
            ) : (
              <circle cx="5" cy="5" r="4" fill={it.colour} />
            )}
          </svg>
          <span className="num">{it.name}</span>
        </li>
      ))}
    </ul>
  );
}
