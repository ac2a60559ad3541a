/**
 * The actions of one row of My targets: open the target in the Sketchpad, add it to one of the
 * person's drafts, remove it. Adding and removing ask first in a dialog (ConfirmDialog), and the
 * action refuses a post without its confirmation.
 */
import { Link } from "react-router";
import { SelectField } from "~/components/ui";
import { ConfirmDialog } from "~/components/ui/ConfirmDialog";

export type Draft = { id: number; title: string; cycleName: string };

/** A row action's refusal, shown above the table (the dialog has closed by then). */
export type RowRefusal = { rowError: string; targetId: number | null };

export function RowActions({
  target,
  sketchpadHref,
  drafts,
}: {
  target: { id: number; name: string };
  sketchpadHref: string;
  drafts: Draft[];
}) {
  const hidden = { targetId: String(target.id) };
  return (
    <div className="flex flex-wrap items-center gap-2">
      <Link
        to={sketchpadHref}
        className="whitespace-nowrap font-medium text-ember-800 underline underline-offset-2 hover:text-ember-900"
        aria-label={`Open ${target.name} in Sketchpad`}
      >
        Open in Sketchpad
      </Link>
      <ConfirmDialog
        label="Add to a proposal"
        title={`Add ${target.name} to a proposal`}
        intent="add-to-proposal"
        confirmLabel="Add to proposal"
        variant="secondary"
        disabled={drafts.length === 0}
        hidden={hidden}
        fields={
          <SelectField label="Proposal" name="proposalId" defaultValue={String(drafts[0]?.id ?? "")}>
            {drafts.map((d) => (
              <option key={d.id} value={d.id}>
                {d.title} ({d.cycleName})
              </option>
            ))}
          </SelectField>
        }
      >
        The proposal gets its own copy of {target.name}; set its constraints and calibrators there. Only your drafts
        whose deadline is still ahead are listed.
      </ConfirmDialog>
      <ConfirmDialog
        label="Remove"
        title={`Remove ${target.name}?`}
        intent="remove"
        confirmLabel="Remove from My targets"
        variant="danger"
        hidden={hidden}
      >
        {target.name} leaves My targets. Proposals that took a copy of it keep theirs.
      </ConfirmDialog>
    </div>
  );
}
