/** The "hours" intent: the hours requested per configuration (HoursCard). */
import * as v from "valibot";
import { redirectWithFlash } from "~/lib/flash.server";
import { saveHours } from "~/services/proposals/commands.server";
import { hoursField } from "~/services/proposals/schemas";
import { fail, type IntentArgs, textOf } from "./intent.server";
import type { Values } from "./result";

export async function saveHoursIntent({ db, viewer, proposalId, form, intent, here }: IntentArgs) {
  const values: Values = {};
  const errors: Record<string, string> = {};
  const lines: { configurationId: number; hours: number }[] = [];
  for (const [key, raw] of form.entries()) {
    const m = /^hours-(\d{1,9})$/.exec(key);
    if (!m || typeof raw !== "string") continue;
    values[key] = raw;
    const label = textOf(form, `label-${m[1]}`) || "this configuration";
    const parsed = v.safeParse(hoursField, raw);
    if (!parsed.success) errors[key] = `Hours for ${label}: ${parsed.issues[0].message}.`;
    else if (parsed.output !== null) lines.push({ configurationId: Number(m[1]), hours: parsed.output });
  }
  if (Object.keys(errors).length > 0) return fail(intent, errors, 400, values);
  await saveHours(db, { viewer, proposalId, lines });
  return redirectWithFlash(here, {
    kind: "success",
    text: lines.length
      ? `Requested hours saved (${lines.reduce((a, l) => a + l.hours, 0)} h in all).`
      : "Requested hours cleared.",
  });
}
