import { type DragEvent, type ReactNode, useEffect, useRef, useState } from "react";
import { useFetcher } from "react-router";
import { OutcomeBadge, outcomeWords } from "~/components/nights/OutcomeBadge";
import { Badge, Button, type Column, cx, DataTable, fixedColumn } from "~/components/ui";
import { lstText, utcTime } from "~/services/nights/sky";
import type { BlockView } from "~/services/nights/view";
import { FetcherResult } from "./FetcherResult";
import type { NightActionData } from "./intents.server";

const f1 = (x: number | null | undefined, digits = 1) => (x === null || x === undefined ? "—" : x.toFixed(digits));
const minutes = (b: BlockView) => Math.round((Date.parse(b.endUtc) - Date.parse(b.startUtc)) / 60_000);
const describe = (b: BlockView) => `block ${b.position} (${b.kind} ${b.object})`;

/** The label of a control whose column header says what it is: read by screen readers only. */
function HiddenLabel({ htmlFor, children }: { htmlFor: string; children: ReactNode }) {
  return (
    <label className="sr-only" htmlFor={htmlFor}>
      {children}
    </label>
  );
}

function EditControls({
  b,
  last,
  submit,
}: {
  b: BlockView;
  last: boolean;
  submit: (f: Record<string, string>) => void;
}) {
  const [length, setLength] = useState(String(minutes(b)));
  return (
    <div className="flex items-center gap-1 whitespace-nowrap">
      <Button
        id={`move-up-${b.id}`}
        size="sm"
        variant="secondary"
        disabled={b.locked || b.position === 1}
        aria-label={`Move ${describe(b)} earlier`}
        onClick={() => submit({ intent: "move", blockId: String(b.id), to: "up" })}
      >
        ↑
      </Button>
      <Button
        id={`move-down-${b.id}`}
        size="sm"
        variant="secondary"
        disabled={b.locked || last}
        aria-label={`Move ${describe(b)} later`}
        onClick={() => submit({ intent: "move", blockId: String(b.id), to: "down" })}
      >
        ↓
      </Button>
      <HiddenLabel htmlFor={`length-${b.id}`}>Length of {describe(b)} in minutes</HiddenLabel>
      <input
        id={`length-${b.id}`}
        type="number"
        min={1}
        max={720}
        value={length}
        disabled={b.locked}
        onChange={(e) => setLength(e.target.value)}
        className="h-8 w-16 rounded-md border border-night-300 px-1 text-right text-sm"
      />
      <span aria-hidden="true" className="text-xs text-night-600">
        min
      </span>
      <Button
        size="sm"
        variant="ghost"
        disabled={b.locked}
        aria-label={`Set the length of ${describe(b)}`}
        onClick={() => submit({ intent: "resize", blockId: String(b.id), lengthMin: length })}
      >
        Set
      </Button>
      <Button
        size="sm"
        variant="ghost"
        disabled={b.locked}
        aria-label={`Remove ${describe(b)}`}
        onClick={() => submit({ intent: "remove", blockId: String(b.id) })}
      >
        Remove
      </Button>
    </div>
  );
}

function MarkControls({ b }: { b: BlockView }) {
  const fetcher = useFetcher<NightActionData>();
  return (
    <fetcher.Form method="post" className="space-y-1" aria-label={`Mark ${describe(b)}`}>
      <div className="flex items-center gap-1 whitespace-nowrap">
        <input type="hidden" name="intent" value="mark" />
        <input type="hidden" name="blockId" value={b.id} />
        <HiddenLabel htmlFor={`outcome-${b.id}`}>Outcome of {describe(b)}</HiddenLabel>
        <select
          id={`outcome-${b.id}`}
          name="outcome"
          defaultValue={b.outcome === "planned" ? "executed" : b.outcome}
          className="h-8 rounded-md border border-night-300 px-1 text-sm"
        >
          <option value="executed">executed</option>
          <option value="weather">lost to weather</option>
          <option value="technical">technical fault</option>
          <option value="planned">back to planned</option>
        </select>
        <HiddenLabel htmlFor={`note-${b.id}`}>Note on {describe(b)}</HiddenLabel>
        <input
          id={`note-${b.id}`}
          name="note"
          defaultValue={b.note}
          maxLength={500}
          placeholder="note"
          className="h-8 w-28 rounded-md border border-night-300 px-2 text-sm"
        />
        <Button type="submit" size="sm" variant="secondary" disabled={fetcher.state !== "idle"}>
          Mark
        </Button>
      </div>
      {fetcher.data && !fetcher.data.ok ? (
        <FetcherResult data={fetcher.data} className="max-w-xs whitespace-normal" />
      ) : null}
    </fetcher.Form>
  );
}

function Checks({ b }: { b: BlockView }) {
  return (
    <>
      {b.outcome !== "planned" ? <OutcomeBadge outcome={b.outcome} /> : null}
      {b.note ? <span className="block text-xs text-night-600">{b.note}</span> : null}
      {b.violations.length ? (
        <ul className="space-y-0.5 text-xs font-medium text-danger-700" aria-label={`Problems of ${describe(b)}`}>
          {b.violations.map((v) => (
            <li key={v.rule + v.reason}>
              ⚠ {v.rule}: {v.reason}
            </li>
          ))}
        </ul>
      ) : b.outcome === "planned" ? (
        <span className="text-xs text-ok-700">✓ within every limit</span>
      ) : null}
    </>
  );
}

type Figure =
  | "hourAngleStartH"
  | "hourAngleEndH"
  | "elevationStartDeg"
  | "elevationEndDeg"
  | "airmassStart"
  | "airmassEnd";

/**
 * A figure the planner gives at both ends of a block, shown "start → end" and sorted by the start;
 * "—" for a block without figures.
 */
function figureColumn(
  column: Pick<Column<BlockView>, "key" | "header" | "unit">,
  [start, end]: [Figure, Figure],
  digits: number,
): Column<BlockView> {
  return {
    ...column,
    align: "right",
    className: "whitespace-nowrap",
    value: (b) => b.fields?.[start] ?? null,
    render: (b) => (b.fields ? `${f1(b.fields[start], digits)} → ${f1(b.fields[end], digits)}` : "—"),
  };
}

function Position({ b, handle }: { b: BlockView; handle: boolean }) {
  return (
    <>
      {handle && !b.locked ? (
        <span aria-hidden="true" className="mr-1 cursor-grab text-night-400" title="Drag to move">
          ⠿
        </span>
      ) : null}
      {b.position}
    </>
  );
}

function planColumns(
  mode: "edit" | "mark" | "read",
  blocks: BlockView[],
  submit: (f: Record<string, string>) => void,
): Column<BlockView>[] {
  const columns: Column<BlockView>[] = [
    {
      key: "position",
      header: "#",
      className: "num",
      value: (b) => b.position,
      render: (b) => <Position b={b} handle={mode === "edit"} />,
    },
    {
      key: "block",
      header: "Block",
      value: (b) => `${b.kind} ${b.object}`,
      render: (b) => (
        <>
          <Badge tone={b.kind === "science" ? "accent" : "info"}>{b.kind}</Badge>{" "}
          <span className="font-medium">{b.object}</span>
          {b.kind === "calibrator" ? <span className="block text-xs text-night-600">for {b.target}</span> : null}
        </>
      ),
    },
    {
      key: "utc",
      header: "Start – end",
      unit: "UTC",
      align: "right",
      className: "whitespace-nowrap",
      value: (b) => b.startUtc,
      render: (b) => `${utcTime(b.startUtc).slice(0, 8)} – ${utcTime(b.endUtc)}`,
    },
    {
      key: "lst",
      header: "LST start – end",
      align: "right",
      className: "whitespace-nowrap",
      value: (b) => b.fields?.startLstH ?? null,
      render: (b) => (b.fields ? `${lstText(b.fields.startLstH)} – ${lstText(b.endLstH)}` : "—"),
    },
    figureColumn({ key: "ha", header: "Hour angle", unit: "h" }, ["hourAngleStartH", "hourAngleEndH"], 2),
    figureColumn({ key: "elevation", header: "Elevation", unit: "°" }, ["elevationStartDeg", "elevationEndDeg"], 1),
    figureColumn({ key: "airmass", header: "Air mass" }, ["airmassStart", "airmassEnd"], 2),
    fixedColumn({
      key: "moon",
      header: "Moon",
      unit: "°",
      digits: 1,
      value: (b) => b.fields?.moonSeparationDeg ?? null,
    }),
    {
      key: "checks",
      header: "Checks and outcome",
      value: (b) => b.violations.map((v) => v.rule).join(", ") || outcomeWords(b.outcome),
      render: (b) => <Checks b={b} />,
    },
  ];
  const last = blocks.at(-1)?.id;
  if (mode !== "read")
    columns.push({
      key: mode,
      header: mode === "edit" ? "Edit" : "Mark",
      controls: true,
      value: () => null,
      render: (b) =>
        mode === "edit" ? (
          <EditControls key={`${b.id}-${b.endUtc}`} b={b} last={b.id === last} submit={submit} />
        ) : (
          <MarkControls key={`${b.id}-${b.outcome}`} b={b} />
        ),
    });
  return columns;
}

/** The plan's blocks in time order, each with its figures, its violations and the controls the plan's state allows. */
export function PlanTable({ blocks, mode }: { blocks: BlockView[]; mode: "edit" | "mark" | "read" }) {
  const fetcher = useFetcher<NightActionData>();
  const focusAfter = useRef<string | null>(null);
  const [dragging, setDragging] = useState<number | null>(null);
  const submit = (fields: Record<string, string>) => {
    if (fields.intent === "move") focusAfter.current = `move-${fields.to}-${fields.blockId}`;
    fetcher.submit(fields, { method: "post" });
  };
  useEffect(() => {
    if (fetcher.state === "idle" && focusAfter.current) {
      const el = document.getElementById(focusAfter.current) as HTMLButtonElement | null;
      const target =
        el && !el.disabled
          ? el
          : document.getElementById(
              focusAfter.current.replace(/-(up|down)-/, (m) => (m === "-up-" ? "-down-" : "-up-")),
            );
      target?.focus();
      focusAfter.current = null;
    }
  }, [fetcher.state]);
  const onDrop = (e: DragEvent, to: BlockView) => {
    e.preventDefault();
    const id = Number(e.dataTransfer.getData("text/plain"));
    setDragging(null);
    if (id && id !== to.id) submit({ intent: "move", blockId: String(id), to: String(to.position) });
  };
  return (
    <div className="space-y-2">
      {mode === "edit" ? (
        <p className="text-sm text-night-600">
          Reorder with the ↑ ↓ buttons (or drag a row by its handle), change a block's length, remove it, or insert one
          below. Every change is checked at once against the night's limits.
        </p>
      ) : null}
      <FetcherResult data={fetcher.data} />
      <DataTable
        columns={planColumns(mode, blocks, submit)}
        rows={blocks}
        caption="Blocks of the plan in time order"
        density="compact"
        className="relative"
        rowProps={(b) => ({
          "data-block": b.id,
          draggable: mode === "edit" && !b.locked,
          onDragStart: (e) => {
            e.dataTransfer.setData("text/plain", String(b.id));
            setDragging(b.id);
          },
          onDragEnd: () => setDragging(null),
          onDragOver: (e) => mode === "edit" && e.preventDefault(),
          onDrop: (e) => onDrop(e, b),
          className: cx(
            "*:align-top",
            b.violations.length ? "bg-danger-50/60" : b.outcome !== "planned" ? "bg-night-50" : undefined,
            dragging === b.id && "opacity-50",
          ),
        })}
      />
    </div>
  );
}
