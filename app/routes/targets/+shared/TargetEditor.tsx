import { TargetForm, type TargetFormValues } from "~/components/targets/TargetForm";
import { Alert, Card } from "~/components/ui";
import { ConfirmDialog } from "~/components/ui/ConfirmDialog";

const COPY = {
  create: { title: "Add a target", submitLabel: "Add target" },
  update: { title: "Target", submitLabel: "Save target" },
} as const;

/**
 * The target editor's card, for adding a target to My targets and for editing one: the stored
 * values (none for a new target), or what the person typed when the action refused it.
 */
export function TargetEditor({
  intent,
  values,
  bands,
  retry,
  generation = 0,
}: {
  intent: keyof typeof COPY;
  values: TargetFormValues;
  bands: string[];
  retry: { values: TargetFormValues; errors: Record<string, string> } | undefined;
  /** Changes when a target was added (the list's length), so the new target's form starts blank. */
  generation?: number;
}) {
  return (
    <Card title={COPY[intent].title}>
      <TargetForm
        // A new target's form starts blank again once the target is added.
        key={intent === "create" ? `${retry ? "retry" : "blank"}-${generation}` : undefined}
        values={retry?.values ?? values}
        errors={retry?.errors ?? {}}
        bands={bands}
        submitLabel={COPY[intent].submitLabel}
        intent={intent}
      />
    </Card>
  );
}

/** The editor's second card: removes the target from My targets, once the person confirms in the dialog. */
export function RemoveTargetCard({ name, refused }: { name: string; refused: string | null }) {
  return (
    <Card title="Remove">
      {refused ? <Alert className="mb-4">{refused}</Alert> : null}
      <ConfirmDialog
        label="Remove from My targets"
        title={`Remove ${name}?`}
        intent="delete"
        confirmLabel="Remove from My targets"
        variant="danger"
      >
        {name} leaves My targets. Proposals that took a copy of it keep theirs.
      </ConfirmDialog>
    </Card>
  );
}
