/**
 * A button that asks before it acts: it opens a modal dialog (the browser's <dialog>, which keeps the
 * focus inside and closes on Escape) saying what will happen, with the form that does it. The form
 * sends `intent` and `confirm=yes`; actions refuse a post without the confirmation.
 */
import { type ReactNode, useEffect, useId, useRef } from "react";
import { Form, useNavigation } from "react-router";
import { Button, type ButtonVariant } from "./Button";

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
  const heading = useId();
  const busy = useNavigation().state === "submitting";
  useEffect(() => {
    if (closeOn !== undefined) ref.current?.close();
  }, [closeOn]);
  return (
    <>
      <Button variant={variant} disabled={disabled} onClick={() => ref.current?.showModal()}>
        {label}
      </Button>
      <dialog
        ref={ref}
        aria-labelledby={heading}
        className="m-auto w-[min(32rem,calc(100vw-2rem))] rounded-xl bg-white p-0 shadow-xl ring-1 ring-night-200 backdrop:bg-night-950/40"
      >
        <Form method="post" className="grid gap-4 p-5" onSubmit={() => ref.current?.close()}>
          <h2 id={heading} className="text-lg font-semibold text-night-900">
            {title}
          </h2>
          <div className="text-sm text-night-700">{children}</div>
          {fields}
          <input type="hidden" name="intent" value={intent} />
          <input type="hidden" name="confirm" value="yes" />
          {Object.entries(hidden).map(([k, v]) => (
            <input key={k} type="hidden" name={k} value={v} />
          ))}
          <div className="flex flex-wrap justify-end gap-2">
            <Button variant="secondary" onClick={() => ref.current?.close()}>
              Cancel
            </Button>
            <Button type="submit" variant={variant} disabled={busy}>
              {confirmLabel}
            </Button>
          </div>
        </Form>
      </dialog>
    </>
  );
}
