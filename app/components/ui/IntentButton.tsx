/**
 * A form of one button that posts an intent and the ids it acts on (sign out a session, take back an
 * assignment, withdraw a declaration): what a card row offers when the action needs no confirmation.
 */
import type { ReactNode } from "react";
import { Form } from "react-router";
import { Button, type ButtonVariant } from "./Button";

export function IntentButton({
  intent,
  hidden = {},
  label,
  children,
  variant = "secondary",
  className,
}: {
  intent: string;
  /** Hidden fields posted with the intent, e.g. `{ sessionId: "12" }`. */
  hidden?: Record<string, string | number>;
  /** The button's accessible name when its text alone does not say what it acts on. */
  label?: string;
  children: ReactNode;
  variant?: ButtonVariant;
  className?: string;
}) {
  return (
    <Form method="post" className={className}>
      <input type="hidden" name="intent" value={intent} />
      {Object.entries(hidden).map(([name, value]) => (
        <input key={name} type="hidden" name={name} value={value} />
      ))}
      <Button type="submit" size="sm" variant={variant} aria-label={label}>
        {children}
      </Button>
    </Form>
  );
}
