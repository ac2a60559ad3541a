/**
 * The columns of the Triangle finder's ranking table; each row opens its triangle in the Sketchpad
 * and, given `onUse`, offers to store it on a proposal's target.
 */
import { Link } from "react-router";
import { Button, type Column } from "~/components/ui";
import type { TrianglesResponse } from "~/engine";

export type TriangleRow = TrianglesResponse["triangles"][number] & { href: string };

type NumberField = "score" | "closurePhaseSignalDeg" | "meanTripleAmplitude" | "uvSpread" | "observableHours";

/** A right-aligned number column shown with `digits` decimals. */
function fixed(key: string, header: string, field: NumberField, digits: number, unit?: string): Column<TriangleRow> {
  return {
    key,
    header,
    unit,
    align: "right",
    value: (r) => r[field],
    render: (r) => r[field].toFixed(digits),
  };
}

/** The "Use this triangle" column. */
function chooseColumn(onUse: (row: TriangleRow) => void): Column<TriangleRow> {
  return {
    key: "use",
    header: "Proposal",
    value: () => "",
    render: (r) => (
      <Button
        variant="secondary"
        size="sm"
        className="whitespace-nowrap"
        aria-label={`Use ${r.stations.join("–")} for a proposal target`}
        onClick={() => onUse(r)}
      >
        Use this triangle
      </Button>
    ),
  };
}

export function triangleColumns(onUse?: (row: TriangleRow) => void): Column<TriangleRow>[] {
  return [
    { key: "rank", header: "Rank", align: "right", value: (r) => r.rank },
    {
      key: "stations",
      header: "Triangle",
      value: (r) => r.stations.join("–"),
      render: (r) => <span className="whitespace-nowrap font-medium">{r.stations.join("–")}</span>,
    },
    {
      key: "open",
      header: "Sketchpad",
      value: (r) => r.href,
      render: (r) => (
        <Link
          to={r.href}
          className="whitespace-nowrap font-medium text-ember-800 underline underline-offset-2 hover:text-ember-900"
          aria-label={`Open ${r.stations.join("–")} in Sketchpad`}
        >
          Open in Sketchpad
        </Link>
      ),
    },
    ...(onUse ? [chooseColumn(onUse)] : []),
    fixed("score", "Score", "score", 3),
    fixed("signal", "Closure-phase signal", "closurePhaseSignalDeg", 1, "° rms"),
    fixed("amplitude", "Triple amplitude", "meanTripleAmplitude", 3),
    fixed("spread", "uv spread", "uvSpread", 2, "0–1"),
    fixed("hours", "Observable", "observableHours", 2, "h"),
    {
      key: "reasons",
      header: "Why",
      value: (r) => r.reasons.join("; "),
      render: (r) => (
        <ul className="min-w-72 space-y-0.5 text-xs text-night-700">
          {r.reasons.map((x) => (
            <li key={x}>{x}</li>
          ))}
        </ul>
      ),
    },
  ];
}
