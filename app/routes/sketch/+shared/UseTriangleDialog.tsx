/**
 * "Use this triangle": a dialog (the browser's <dialog>: focus kept inside, Escape closes it) that
 * stores the ranked triangle, with what it was ranked for, on a target of one of the viewer's drafts.
 */
import { useEffect, useId, useRef } from "react";
import { Form, useNavigation } from "react-router";
import { triangleText } from "~/components/targets/closure-triangle";
import { Button, SelectField } from "~/components/ui";
import { ALL_STATIONS } from "~/services/sketch/state";
import type { ProposalTargetChoice } from "~/services/sketch/triangle-choice";

/** What a triangle was ranked for: the site, instrument, band and pool of the ranking. */
export type RankedFor = { site: string; instrument: string; band: string; pool: string };

export function UseTriangleDialog({
  stations,
  rankedFor,
  choices,
  onClose,
}: {
  /** The triangle to store; the dialog is open while there is one. */
  stations: readonly string[] | null;
  rankedFor: RankedFor;
  choices: ProposalTargetChoice[];
  onClose: () => void;
}) {
  const ref = useRef<HTMLDialogElement>(null);
  const heading = useId();
  const busy = useNavigation().state === "submitting";
  useEffect(() => {
    const dialog = ref.current;
    if (!dialog) return;
    if (stations && !dialog.open) dialog.showModal();
    if (!stations && dialog.open) dialog.close();
  }, [stations]);
  const pool = rankedFor.pool === ALL_STATIONS ? "every station" : `configuration ${rankedFor.pool}`;
  const text = stations ? triangleText({ stations: stations as [string, string, string] }) : "";
  return (
    <dialog
      ref={ref}
      aria-labelledby={heading}
      onClose={onClose}
      className="m-auto w-[min(32rem,calc(100vw-2rem))] rounded-xl bg-white p-0 shadow-xl ring-1 ring-night-200 backdrop:bg-night-950/40"
    >
      {stations ? (
        <Form method="post" className="grid gap-4 p-5" onSubmit={() => ref.current?.close()}>
          <h2 id={heading} className="text-lg font-semibold text-night-900">
            Use the triangle {text}
          </h2>
          <p className="text-sm text-night-700">
            Ranked for {rankedFor.instrument} {rankedFor.band} on {pool} at {rankedFor.site}. The target's page in the
            proposal shows it; a triangle chosen before for that target is replaced.
          </p>
          <SelectField label="Proposal target" name="target" defaultValue="">
            <option value="" disabled>
              — choose a target of one of your drafts —
            </option>
            {choices.map((p) => (
              <optgroup key={p.id} label={`${p.title} (${p.cycleName})`}>
                {p.targets.map((t) => (
                  <option key={t.id} value={`${p.id}:${t.id}`}>
                    {t.name}
                    {t.closureTriangle ? ` (now ${triangleText(t.closureTriangle)})` : ""}
                  </option>
                ))}
              </optgroup>
            ))}
          </SelectField>
          <input type="hidden" name="intent" value="use-triangle" />
          <input type="hidden" name="stations" value={stations.join(",")} />
          {Object.entries(rankedFor).map(([k, v]) => (
            <input key={k} type="hidden" name={k} value={v} />
          ))}
          <div className="flex flex-wrap justify-end gap-2">
            <Button variant="secondary" onClick={() => ref.current?.close()}>
              Cancel
            </Button>
            <Button type="submit" disabled={busy}>
              Use this triangle
            </Button>
          </div>
        </Form>
      ) : null}
    </dialog>
  );
}
