/** The triage line (after which position of the board proposals are not discussed) and the disagreement threshold. */
import { Form } from "react-router";
import { Button, Card, TextField } from "~/components/ui";

export function SettingsCard({
  triageAfter,
  disagreementSpread,
  count,
  editable,
  errors,
}: {
  triageAfter: number | null;
  disagreementSpread: number;
  count: number;
  editable: boolean;
  errors: Record<string, string>;
}) {
  return (
    <Card title="Triage line and disagreement">
      <Form method="post" className="grid gap-3 sm:grid-cols-[1fr_1fr_auto] sm:items-end" aria-label="Triage line">
        <input type="hidden" name="intent" value="settings" />
        <TextField
          label="Triage line after position"
          name="triageAfter"
          inputMode="numeric"
          defaultValue={triageAfter === null ? "" : String(triageAfter)}
          error={errors.triageAfter}
          hint={`1 … ${count}; empty for no line. Below it, proposals are not discussed.`}
          disabled={!editable}
        />
        <TextField
          label="Flag a disagreement above a spread of"
          name="disagreementSpread"
          unit="score SD"
          inputMode="decimal"
          defaultValue={String(disagreementSpread)}
          error={errors.disagreementSpread}
          disabled={!editable}
        />
        <Button type="submit" variant="secondary" disabled={!editable}>
          Place the line
        </Button>
      </Form>
    </Card>
  );
}
