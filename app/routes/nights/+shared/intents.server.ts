/**
 * The night page's posts: one schema per intent, one service call each. Every answer has the same
 * shape, `{intent, ok, message | error, field, errors}`, with status 200 or the refusal's (400 for a
 * bad field, 404 for a block that is not in the plan, 409 for a state that does not allow it).
 */
import { data } from "react-router";
import * as v from "valibot";
import type { Database } from "~/db/client.server";
import { readFormBody } from "~/lib/body.server";
import { type FieldErrors, fieldErrors } from "~/lib/form-errors";
import type { Viewer } from "~/lib/guards.server";
import {
  autoPlan,
  discardDraft,
  editPlan,
  markBlock,
  replanRest,
  savePlanSettings,
} from "~/services/nights/commands.server";
import { publishPlan } from "~/services/nights/publish.server";
import type { CommandResult } from "~/services/nights/result";
import { NightActionSchema } from "~/services/nights/schemas";

export type NightActionData = {
  intent: string;
  ok: boolean;
  message: string | null;
  error: string | null;
  field: string | null;
  errors: FieldErrors;
};

function answer(intent: string, result: CommandResult<unknown>) {
  if (result.ok) {
    return data({
      intent,
      ok: true,
      message: result.message,
      error: null,
      field: null,
      errors: {},
    } satisfies NightActionData);
  }
  const errors = result.field ? { [result.field]: result.error } : {};
  return data(
    {
      intent,
      ok: false,
      message: null,
      error: result.error,
      field: result.field ?? null,
      errors,
    } satisfies NightActionData,
    { status: result.status },
  );
}

/** Reads, checks and carries out one post of the night page. */
export async function nightAction(request: Request, db: Database, { date, viewer }: { date: string; viewer: Viewer }) {
  const body = await readFormBody(request);
  if (!body.ok) return answer("unknown", { ok: false, status: body.status, error: body.error });
  const form = Object.fromEntries(
    [...body.form.entries()].filter((e): e is [string, string] => typeof e[1] === "string"),
  );
  const parsed = v.safeParse(NightActionSchema, form);
  const intent = typeof form.intent === "string" ? form.intent.slice(0, 20) : "unknown";
  if (!parsed.success) {
    const errors = fieldErrors(parsed.issues, { depth: 1 });
    const field = Object.keys(errors)[0] ?? null;
    return data(
      { intent, ok: false, message: null, error: parsed.issues[0].message, field, errors } satisfies NightActionData,
      { status: 400 },
    );
  }
  const input = parsed.output;
  const userId = viewer.user.id;
  switch (input.intent) {
    case "settings": {
      const { intent: _, ...settings } = input;
      return answer(input.intent, await savePlanSettings(db, { date, settings, userId }));
    }
    case "auto":
      return answer(input.intent, await autoPlan(db, { date, userId }));
    case "discard":
      return answer(input.intent, await discardDraft(db, { date }));
    case "publish":
      return answer(input.intent, await publishPlan(db, { date, userId }));
    case "replan":
      return answer(input.intent, await replanRest(db, { date, from: input.fromUtc }));
    case "mark":
      return answer(
        input.intent,
        await markBlock(db, { date, blockId: input.blockId, outcome: input.outcome, note: input.note, userId }),
      );
    case "move":
    case "remove":
    case "resize":
    case "insert":
      return answer(input.intent, await editPlan(db, { date, op: input, userId }));
  }
}
