/**
 * A modal dialog holding one form (the browser's <dialog>: the focus stays inside, Escape closes it):
 * a heading, what the caller puts in, the `intent` and hidden fields, and Cancel / submit buttons.
 * The caller opens it through `dialogRef` (`showModal()`); it closes itself when the form is sent.
 */
import { type ReactNode, type RefObject, useId } from "react";
import { Form, useNavigation } from "react-router";
import { Button, type ButtonVariant } from "./Button";

export function ModalForm({
  dialogRef,
  title,
  intent,
  hidden = {},
  submitLabel,
  variant = "primary",
  onClose,
  children,
}: {
  dialogRef: RefObject<HTMLDialogElement | null>;
  title: ReactNode;
  intent: string;
  hidden?: Record<string, string>;
  submitLabel: string;
  variant?: ButtonVariant;
  onClose?: () => void;
  children: ReactNode;
}) {
  const heading = useId();
  const busy = useNavigation().state === "submitting";
  const close = () => dialogRef.current?.close();
  return (
    <dialog
      ref={dialogRef}
      aria-labelledby={heading}
      onClose={onClose}
      className="m-auto w-[min(32rem,calc(100vw-2rem))] rounded-xl bg-white p-0 shadow-xl ring-1 ring-night-200 backdrop:bg-night-950/40"
    >
      <Form method="post" className="grid gap-4 p-5" onSubmit={close}>
        <h2 id={heading} className="text-lg font-semibold text-night-900">
          {title}
        </h2>
        {children}
        <input type="hidden" name="intent" value={intent} />
        {Object.entries(hidden).map(([k, v]) => (
          <input key={k} type="hidden" name={k} value={v} />
        ))}
        <div className="flex flex-wrap justify-end gap-2">
          <Button variant="secondary" onClick={close}>
            Cancel
          </Button>
          <Button type="submit" variant={variant} disabled={busy}>
            {submitLabel}
          </Button>
        </div>
      </Form>
    </dialog>
  );
}
