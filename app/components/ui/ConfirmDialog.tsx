/**
 * A button that asks before it acts: it opens a modal dialog (the browser's <dialog>, which keeps the
 * focus inside and closes on Escape) saying what will happen, with the form that does it. The form
 * sends `intent` and `confirm=yes`; actions refuse a post without the confirmation.
 */
import { type ReactNode, useEffect, useRef } from "react";
import { Button, type ButtonVariant } from "./Button";
import { ModalForm } from "./ModalForm";

export function ConfirmDialog({
  label,
  title,
  intent,
  children,
  confirmLabel,
  variant = "primary",
  disabled = false,
  fields,
  hidden = {},
  closeOn,
}: {
  /** The button that opens the dialog. */
  label: string;
  title: string;
  intent: string;
  /** What will happen, in plain words. */
  children: ReactNode;
  confirmLabel: string;
  variant?: ButtonVariant;
  disabled?: boolean;
  /** Inputs the confirmation asks for (a new deadline). */
  fields?: ReactNode;
  hidden?: Record<string, string>;
  /** The dialog closes when this value changes (the action answered). */
  closeOn?: unknown;
}) {
  const ref = useRef<HTMLDialogElement>(null);
  useEffect(() => {
    if (closeOn !== undefined) ref.current?.close();
  }, [closeOn]);
  return (
    <>
      <Button variant={variant} disabled={disabled} onClick={() => ref.current?.showModal()}>
        {label}
      </Button>
      <ModalForm
        dialogRef={ref}
        title={title}
        intent={intent}
        hidden={{ confirm: "yes", ...hidden }}
        submitLabel={confirmLabel}
        variant={variant}
      >
        <div className="text-sm text-night-700">{children}</div>
        {fields}
      </ModalForm>
    </>
  );
}
