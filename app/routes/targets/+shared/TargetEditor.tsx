import { Form } from "react-router";
import { TargetForm, type TargetFormValues } from "~/components/targets/TargetForm";
import { Button, Card } from "~/components/ui";

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
}: {
  intent: keyof typeof COPY;
  values: TargetFormValues;
  bands: string[];
  retry: { values: TargetFormValues; errors: Record<string, string> } | undefined;
}) {
  return (
    <Card title={COPY[intent].title}>
      <TargetForm
        // A new target's form starts blank again once the target is added.
        key={intent === "create" ? (retry ? "retry" : "blank") : undefined}
        values={retry?.values ?? values}
        errors={retry?.errors ?? {}}
        bands={bands}
        submitLabel={COPY[intent].submitLabel}
        intent={intent}
      />
    </Card>
  );
}

/** The editor's second card: removes the target from My targets, once the person confirms. */
export function RemoveTargetCard({ name }: { name: string }) {
  return (
    <Card title="Remove">
      <Form
        method="post"
        onSubmit={(e) => {
          if (!confirm(`Remove ${name} from My targets?`)) e.preventDefault();
        }}
      >
        <input type="hidden" name="intent" value="delete" />
        <Button type="submit" variant="danger">
          Remove from My targets
        </Button>
      </Form>
    </Card>
  );
}
