import { type DragEvent, useEffect, useRef, useState } from "react";
import { useFetcher } from "react-router";
import { Badge, type BadgeTone, Button, cx } from "~/components/ui";
import type { BlockOutcome } from "~/db/schema/nights";
import { lstText, utcTime } from "~/services/nights/sky";
import type { BlockView } from "~/services/nights/view";
import { FetcherResult } from "./FetcherResult";
import type { NightActionData } from "./intents.server";

const OUTCOME_TONE: Record<BlockOutcome, BadgeTone> = {
  planned: "neutral",
  executed: "ok",
  weather: "caution",
  technical: "danger",
};
const OUTCOME_WORDS: Record<BlockOutcome, string> = {
  planned: "planned",
  executed: "executed",
  weather: "lost to weather",
  technical: "lost to a technical fault",
};

const f1 = (x: number | null | undefined, digits = 1) => (x === null || x === undefined ? "—" : x.toFixed(digits));
const minutes = (b: BlockView) => Math.round((Date.parse(b.endUtc) - Date.parse(b.startUtc)) / 60_000);
const describe = (b: BlockView) => `block ${b.position} (${b.kind} ${b.object})`;

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
      <label className="sr-only" htmlFor={`length-${b.id}`}>
        Length of {describe(b)} in minutes
      </label>
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
        <label className="sr-only" htmlFor={`outcome-${b.id}`}>
          Outcome of {describe(b)}
        </label>
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
        <label className="sr-only" htmlFor={`note-${b.id}`}>
          Note on {describe(b)}
        </label>
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
      <div className="relative overflow-x-auto rounded-lg ring-1 ring-night-200">
        <table className="min-w-full divide-y divide-night-200 bg-white text-sm">
          <caption className="sr-only">Blocks of the plan in time order</caption>
          <thead className="bg-night-100/70 text-left">
            <tr>
              <th scope="col" className="px-2 py-2">
                #
              </th>
              <th scope="col" className="px-2 py-2">
                Block
              </th>
              <th scope="col" className="px-2 py-2 text-right">
                Start – end (UTC)
              </th>
              <th scope="col" className="px-2 py-2 text-right">
                LST start – end
              </th>
              <th scope="col" className="px-2 py-2 text-right">
                Hour angle (h)
              </th>
              <th scope="col" className="px-2 py-2 text-right">
                Elevation (°)
              </th>
              <th scope="col" className="px-2 py-2 text-right">
                Air mass
              </th>
              <th scope="col" className="px-2 py-2 text-right">
                Moon (°)
              </th>
              <th scope="col" className="px-2 py-2">
                Checks and outcome
              </th>
              {mode !== "read" ? (
                <th scope="col" className="px-2 py-2">
                  {mode === "edit" ? "Edit" : "Mark"}
                </th>
              ) : null}
            </tr>
          </thead>
          <tbody className="divide-y divide-night-100">
            {blocks.map((b, i) => {
              const x = b.fields;
              return (
                <tr
                  key={b.id}
                  data-block={b.id}
                  draggable={mode === "edit" && !b.locked}
                  onDragStart={(e) => {
                    e.dataTransfer.setData("text/plain", String(b.id));
                    setDragging(b.id);
                  }}
                  onDragEnd={() => setDragging(null)}
                  onDragOver={(e) => mode === "edit" && e.preventDefault()}
                  onDrop={(e) => onDrop(e, b)}
                  className={cx(
                    b.violations.length ? "bg-danger-50/60" : b.outcome !== "planned" ? "bg-night-50" : undefined,
                    dragging === b.id && "opacity-50",
                  )}
                >
                  <td className="num px-2 py-1.5 align-top">
                    {mode === "edit" && !b.locked ? (
                      <span aria-hidden="true" className="mr-1 cursor-grab text-night-400" title="Drag to move">
                        ⠿
                      </span>
                    ) : null}
                    {b.position}
                  </td>
                  <td className="px-2 py-1.5 align-top">
                    <Badge tone={b.kind === "science" ? "accent" : "info"}>{b.kind}</Badge>{" "}
                    <span className="font-medium">{b.object}</span>
                    {b.kind === "calibrator" ? (
                      <span className="block text-xs text-night-600">for {b.target}</span>
                    ) : null}
                  </td>
                  <td className="num whitespace-nowrap px-2 py-1.5 text-right align-top">
                    {utcTime(b.startUtc).slice(0, 8)} – {utcTime(b.endUtc)}
                  </td>
                  <td className="num whitespace-nowrap px-2 py-1.5 text-right align-top">
                    {x ? `${lstText(x.startLstH)} – ${lstText(b.endLstH)}` : "—"}
                  </td>
                  <td className="num whitespace-nowrap px-2 py-1.5 text-right align-top">
                    {x ? `${f1(x.hourAngleStartH, 2)} → ${f1(x.hourAngleEndH, 2)}` : "—"}
                  </td>
                  <td className="num whitespace-nowrap px-2 py-1.5 text-right align-top">
                    {x ? `${f1(x.elevationStartDeg)} → ${f1(x.elevationEndDeg)}` : "—"}
                  </td>
                  <td className="num whitespace-nowrap px-2 py-1.5 text-right align-top">
                    {x ? `${f1(x.airmassStart, 2)} → ${f1(x.airmassEnd, 2)}` : "—"}
                  </td>
                  <td className="num px-2 py-1.5 text-right align-top">{f1(x?.moonSeparationDeg)}</td>
                  <td className="px-2 py-1.5 align-top">
                    {b.outcome !== "planned" ? (
                      <Badge tone={OUTCOME_TONE[b.outcome]}>{OUTCOME_WORDS[b.outcome]}</Badge>
                    ) : null}
                    {b.note ? <span className="block text-xs text-night-600">{b.note}</span> : null}
                    {b.violations.length ? (
                      <ul
                        className="space-y-0.5 text-xs font-medium text-danger-700"
                        aria-label={`Problems of ${describe(b)}`}
                      >
                        {b.violations.map((v) => (
                          <li key={v.rule + v.reason}>
                            ⚠ {v.rule}: {v.reason}
                          </li>
                        ))}
                      </ul>
                    ) : b.outcome === "planned" ? (
                      <span className="text-xs text-ok-700">✓ within every limit</span>
                    ) : null}
                  </td>
                  {mode === "edit" ? (
                    <td className="px-2 py-1.5 align-top">
                      <EditControls key={`${b.id}-${b.endUtc}`} b={b} last={i === blocks.length - 1} submit={submit} />
                    </td>
                  ) : mode === "mark" ? (
                    <td className="px-2 py-1.5 align-top">
                      <MarkControls key={`${b.id}-${b.outcome}`} b={b} />
                    </td>
                  ) : null}
                </tr>
              );
            })}
          </tbody>
        </table>
      </div>
    </div>
  );
}
