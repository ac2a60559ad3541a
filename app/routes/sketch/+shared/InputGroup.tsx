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

/**
 * The props of every input group: the state as typed, its patchers and the errors to show. `set` is
 * for picks (selects, checkboxes, buttons: computed at once), `type` for typing (computed once the
 * typing pauses).
 */
export interface GroupProps {
  state: CommonState;
  set: Patch;
  type: Patch;
  errors: FieldErrors;
}

/** True for an input a person types into (text, number, date), false for selects, checkboxes and radios. */
export function isTyped(target: EventTarget | null): boolean {
  return (
    typeof HTMLInputElement !== "undefined" &&
    target instanceof HTMLInputElement &&
    !["checkbox", "radio", "button", "submit", "reset", "range", "color", "file"].includes(target.type)
  );
}

/** The keys of `S` whose values are strings (the inputs kept as typed). */
type TextKey<S> = { [K in keyof S]: S[K] extends string ? K : never }[keyof S] & string;

/**
 * Binds text fields and selects to the strings of a state: `field("date")` gives the form name
 * (the key unless told), the value as typed and the change handler that patches it — through `type`
 * when the change comes from typing, through `set` for a pick.
 */
export function binder<S>(state: S, set: (patch: Partial<S>) => void, type: (patch: Partial<S>) => void = set) {
  return (key: TextKey<S>, name: string = key) => ({
    name,
    value: state[key] as string,
    onChange: (e: { target: EventTarget & { value: string } }) =>
      (isTyped(e.target) ? type : set)({ [key]: e.target.value } as Partial<S>),
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
