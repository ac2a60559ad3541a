/**
 * The frame of the inputs shared by the Sketchpad and the Triangle finder: every input is controlled
 * and keeps exactly what was typed; errors (the page's own checks or the API's 400) appear under the
 * input they belong to.
 */
import type { ReactNode } from "react";
import { cx } from "~/components/ui";
import type { FieldErrors } from "~/services/sketch/inputs";
import type { CommonState } from "~/services/sketch/state";

/** How an input group changes the page's state: a patch of the inputs it owns. */
export type Patch = (patch: Partial<CommonState>) => void;

/** The props of every input group: the state as typed, its patcher and the errors to show. */
export interface GroupProps {
  state: CommonState;
  set: Patch;
  errors: FieldErrors;
}

/** The keys of `S` whose values are strings (the inputs kept as typed). */
type TextKey<S> = { [K in keyof S]: S[K] extends string ? K : never }[keyof S] & string;

/**
 * Binds text fields and selects to the strings of a state: `field("date")` gives the form name
 * (the key unless told), the value as typed and the change handler that patches it.
 */
export function binder<S>(state: S, set: (patch: Partial<S>) => void) {
  return (key: TextKey<S>, name: string = key) => ({
    name,
    value: state[key] as string,
    onChange: (e: { target: { value: string } }) => set({ [key]: e.target.value } as Partial<S>),
  });
}

/** A titled group of inputs (a fieldset with a visible legend). */
export function InputGroup({ title, children, className }: { title: string; children: ReactNode; className?: string }) {
  return (
    <fieldset className={cx("space-y-3 rounded-lg border border-night-200 bg-white p-4", className)}>
      <legend className="px-1 text-sm font-semibold text-night-900">{title}</legend>
      {children}
    </fieldset>
  );
}

/**
 * An error under an input that has no error slot of its own (a group of inputs, a checkbox), or in
 * a box of its own (`boxed`) for the request as a whole.
 */
export function InputError({ message, boxed = false }: { message: string | null | undefined; boxed?: boolean }) {
  if (!message) return null;
  return (
    <p
      role="alert"
      className={
        boxed
          ? "rounded-lg border border-danger-700/30 bg-danger-50 p-3 text-sm text-danger-700"
          : "text-sm font-medium text-danger-700"
      }
    >
      {message}
    </p>
  );
}
