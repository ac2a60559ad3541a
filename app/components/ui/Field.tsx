import type { InputHTMLAttributes, ReactNode, SelectHTMLAttributes, TextareaHTMLAttributes } from "react";
import { useId } from "react";
import { Alert } from "./Alert";
import { cx } from "./cx";

const control =
  "block w-full rounded-lg border bg-white px-3 py-2 text-night-900 placeholder:text-night-400 " +
  "outline-offset-1 focus-visible:outline-3 focus-visible:outline-solid focus-visible:outline-ember-500";

function controlClass(error?: string) {
  return cx(control, error ? "border-danger-700" : "border-night-300");
}

type Common = { label: string; hint?: ReactNode; error?: string; unit?: string };

/** Label, control, optional unit, hint and error text, wired with aria attributes. */
function FieldFrame({ id, label, hint, error, unit, children }: Common & { id: string; children: ReactNode }) {
  return (
    <div className="space-y-1">
      <label htmlFor={id} className="block text-sm font-medium text-night-800">
        {label}
        {unit ? <span className="ml-1 font-normal text-night-500">({unit})</span> : null}
      </label>
      {children}
      {hint && !error ? (
        <p id={`${id}-hint`} className="text-sm text-night-600">
          {hint}
        </p>
      ) : null}
      {error ? (
        <p id={`${id}-error`} role="alert" className="text-sm font-medium text-danger-700">
          {error}
        </p>
      ) : null}
    </div>
  );
}

function describedBy(id: string, hint?: ReactNode, error?: string) {
  if (error) return `${id}-error`;
  if (hint) return `${id}-hint`;
  return undefined;
}

type FieldProps = Common & {
  control: "input" | "textarea" | "select";
  extraClass?: string;
  id?: string;
  className?: string;
  [attribute: string]: unknown;
};

/**
 * A form field around one kind of control: the frame above, and the control with its id, error
 * state, description and classes; every other prop goes to the control.
 */
function Field({ control: Control, extraClass, label, hint, error, unit, className, id, ...rest }: FieldProps) {
  const auto = useId();
  const fieldId = id ?? auto;
  return (
    <FieldFrame id={fieldId} label={label} hint={hint} error={error} unit={unit}>
      <Control
        id={fieldId}
        aria-invalid={error ? true : undefined}
        aria-describedby={describedBy(fieldId, hint, error)}
        className={cx(controlClass(error), extraClass, className)}
        {...rest}
      />
    </FieldFrame>
  );
}

export function TextField(props: Common & InputHTMLAttributes<HTMLInputElement>) {
  return <Field control="input" {...props} />;
}

export function TextArea(props: Common & TextareaHTMLAttributes<HTMLTextAreaElement>) {
  return <Field control="textarea" extraClass="min-h-28" {...props} />;
}

export function SelectField(props: Common & SelectHTMLAttributes<HTMLSelectElement>) {
  return <Field control="select" {...props} />;
}

/** A summary of form errors at the top of a form, so a keyboard or screen-reader user hears it first. */
export function FormErrors({ errors }: { errors?: string[] }) {
  if (!errors || errors.length === 0) return null;
  return (
    <Alert as="div">
      <p className="font-semibold">Please correct the following:</p>
      <ul className="mt-1 list-disc pl-5">
        {errors.map((e) => (
          <li key={e}>{e}</li>
        ))}
      </ul>
    </Alert>
  );
}
