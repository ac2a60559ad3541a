/**
 * "Use this triangle": a dialog (the browser's <dialog>: focus kept inside, Escape closes it) that
 * stores the ranked triangle, with what it was ranked for, on a target of one of the viewer's drafts.
 */
import { useEffect, useRef } from "react";
import { triangleText } from "~/components/targets/closure-triangle";
import { SelectField } from "~/components/ui";
import { ModalForm } from "~/components/ui/ModalForm";
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
  useEffect(() => {
    const dialog = ref.current;
    if (!dialog) return;
    if (stations && !dialog.open) dialog.showModal();
    if (!stations && dialog.open) dialog.close();
  }, [stations]);
  const pool = rankedFor.pool === ALL_STATIONS ? "every station" : `configuration ${rankedFor.pool}`;
  const text = stations ? triangleText({ stations: stations as [string, string, string] }) : "";
  return (
    <ModalForm
      dialogRef={ref}
      title={`Use the triangle ${text}`}
      intent="use-triangle"
      hidden={{ stations: (stations ?? []).join(","), ...rankedFor }}
      submitLabel="Use this triangle"
      onClose={onClose}
    >
      <p className="text-sm text-night-700">
        Ranked for {rankedFor.instrument} {rankedFor.band} on {pool} at {rankedFor.site}. The target's page in the
        proposal shows it; a triangle chosen before for that target is replaced.
      </p>
      <SelectField key={text} label="Proposal target" name="target" defaultValue="">
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
    </ModalForm>
  );
}
