/**
 * The post of the Triangle finder's "Use this triangle" dialog: the fields checked (a 400 naming the
 * field), the triangle stored on the chosen target of one of the viewer's drafts (a 4xx with the
 * proposal's refusal otherwise), then the target's page with a flash message.
 */
import { data, href } from "react-router";
import * as v from "valibot";
import { triangleText } from "~/components/targets/closure-triangle";
import type { Database } from "~/db/client.server";
import { readFormBody } from "~/lib/body.server";
import { redirectWithFlash } from "~/lib/flash.server";
import type { Viewer } from "~/lib/guards.server";
import { UseTriangleSchema } from "~/services/sketch/triangle-choice";
import { storeTriangle } from "~/services/sketch/triangle-choice.server";

/** What the page shows when the triangle was not stored. */
export type TriangleRefusal = { triangleError: string };

const refuse = (triangleError: string, status: number) => data<TriangleRefusal>({ triangleError }, { status });

const FIELDS = ["target", "stations", "site", "instrument", "band", "pool"] as const;

export async function chooseTriangleAction(db: Database, viewer: Viewer, request: Request) {
  const body = await readFormBody(request);
  if (!body.ok) return refuse(body.error, body.status);
  if (body.form.get("intent") !== "use-triangle") return refuse("Unknown action.", 400);
  const values = Object.fromEntries(FIELDS.map((k) => [k, body.form.get(k) ?? undefined]));
  const parsed = v.safeParse(UseTriangleSchema, values);
  if (!parsed.success) return refuse(parsed.issues[0].message, 400);
  const stored = await storeTriangle(db, { viewer, input: parsed.output });
  if (!stored.ok) return refuse(stored.message, stored.status);
  const to = href("/proposals/:proposalId/targets/:targetId", {
    proposalId: String(stored.proposalId),
    targetId: String(stored.targetId),
  });
  return redirectWithFlash(to, {
    kind: "success",
    text: `Closure triangle ${triangleText(parsed.output)} stored for ${stored.name}.`,
  });
}
