import type { ReactNode } from "react";
import { useNavigation } from "react-router";
import { Button } from "./Button";
import { cx } from "./cx";
import { TextArea, TextField } from "./Field";

/** One text field of a form, described once: its value and error are looked up by `name`. */
export type FieldSpec = {
  name: string;
  label: string;
  hint?: ReactNode;
  unit?: string;
  type?: "text" | "date" | "datetime-local";
  inputMode?: "decimal" | "numeric" | "text";
  maxLength?: number;
  required?: boolean;
  placeholder?: string;
  className?: string;
  /** A text area instead of a one-line input. */
  multiline?: boolean;
  /** Wraps the field in a `<div>` of this class (a grid span). */
  wrapClassName?: string;
};

type Bound = {
  /** The form's values by field name; fields that are not text (a list of ticked boxes) are passed over. */
  values: Readonly<Record<string, unknown>>;
  errors: Readonly<Partial<Record<string, string>>>;
};

function BoundField({ spec, values, errors }: Bound & { spec: FieldSpec }) {
  const { name, multiline, wrapClassName, type, inputMode, ...shown } = spec;
  const value = values[name];
  const bound = { ...shown, name, defaultValue: typeof value === "string" ? value : undefined, error: errors[name] };
  const field = multiline ? <TextArea {...bound} /> : <TextField {...bound} type={type} inputMode={inputMode} />;
  return wrapClassName ? <div className={wrapClassName}>{field}</div> : field;
}

/**
 * Text fields from their specs, each showing the value typed before (`values[name]`) and its error
 * (`errors[name]`): forms that list many fields write each one as data, not as markup.
 */
export function FieldList({ fields, values, errors }: Bound & { fields: readonly FieldSpec[] }) {
  return fields.map((spec) => <BoundField key={spec.name} spec={spec} values={values} errors={errors} />);
}

/** A form's submit button, disabled and saying `busyLabel` while the form is being sent. */
export function SubmitButton({ label, busyLabel = "Saving…" }: { label: string; busyLabel?: string }) {
  const busy = useNavigation().state === "submitting";
  return (
    <Button type="submit" disabled={busy}>
      {busy ? busyLabel : label}
    </Button>
  );
}

/** A message for a group of fields rather than one (a list of boxes, a file); nothing when there is none. */
export function GroupError({ message, className }: { message?: string | null; className?: string }) {
  if (!message) return null;
  return (
    <p role="alert" className={cx(className, "text-sm font-medium text-danger-700")}>
      {message}
    </p>
  );
}
