/** What each intent's handler of the editor is given, and how it answers a refusal. */
import { data } from "react-router";
import type { Database } from "~/db/client.server";
import type { Viewer } from "~/lib/guards.server";
import { ProposalRefusal } from "~/services/proposals/lock.server";
import type { ActionResult, Values } from "./result";

/** A refusal for the card that posted `intent`, with what it typed when given. */
export const fail = (intent: string, errors: Record<string, string>, status: number, values?: Values) =>
  data<ActionResult>({ intent, errors, values }, { status });

/** What a handler is given: the database, who asks, the proposal, the post and where to go back to. */
export type IntentArgs = {
  db: Database;
  viewer: Viewer;
  proposalId: number;
  form: FormData;
  intent: string;
  /** The editor's own address. */
  here: string;
};

/** A text field of the post ("" when absent or a file). */
export function textOf(form: FormData, name: string): string {
  const x = form.get(name);
  return typeof x === "string" ? x : "";
}

/**
 * The refusal of a post that should have been confirmed in its dialog (`confirm=yes`), or null when it was.
 * `what`: "the submission", "the deletion"…
 */
export function unconfirmed({ form, intent }: IntentArgs, what: string) {
  return textOf(form, "confirm") === "yes" ? null : fail(intent, { form: `Confirm ${what} in the dialog.` }, 400);
}

/** A refused change as the answer for the card that posted it, keeping what was typed; anything else is rethrown. */
export function refusalAnswer(error: unknown, intent: string, form: FormData) {
  if (!(error instanceof ProposalRefusal)) throw error;
  const values: Values = {};
  for (const [k, x] of form.entries()) if (typeof x === "string" && k !== "intent") values[k] = x;
  return fail(intent, { [error.field ?? "form"]: error.message }, error.status, values);
}
