/** A form of one submit button that posts an intent of the editor, with hidden fields beside it. */
import type { ComponentProps, ReactNode } from "react";
import { Form } from "react-router";
import { Button } from "~/components/ui";

type IntentButtonProps = Omit<ComponentProps<typeof Button>, "type"> & {
  intent: string;
  fields?: Record<string, string | number>;
  formClassName?: string;
  /** Shown in the form above the button (what the button will do). */
  before?: ReactNode;
};

export function IntentButton({ intent, fields = {}, formClassName, before, ...button }: IntentButtonProps) {
  return (
    <Form method="post" className={formClassName}>
      <input type="hidden" name="intent" value={intent} />
      {Object.entries(fields).map(([name, value]) => (
        <input key={name} type="hidden" name={name} value={value} />
      ))}
      {before}
      <Button type="submit" {...button} />
    </Form>
  );
}

/** The small "Remove" button of a list item, posting `intent` with the item's id. */
export function RemoveButton({
  intent,
  fields,
  what,
}: {
  intent: string;
  fields: Record<string, number>;
  what: string;
}) {
  return (
    <IntentButton intent={intent} fields={fields} size="sm" variant="ghost" aria-label={`Remove ${what}`}>
      Remove
    </IntentButton>
  );
}
