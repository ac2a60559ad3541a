/**
 * The import page's action, step by step: the text (an uploaded file, pasted text, or the text the
 * preview carried to the apply step), then stations or a whole registry planned against the
 * registry (the preview), or applied in one transaction (the apply step).
 */
import { data } from "react-router";
import * as v from "valibot";
import type { Database } from "~/db/client.server";
import { PG_FOREIGN_KEY_VIOLATION, PG_UNIQUE_VIOLATION, pgCode } from "~/lib/pg-errors";
import {
  applyRegistryPlan,
  applyStationPlan,
  planRegistryImport,
  planStationImport,
  registryImportSummary,
  stationImportSummary,
} from "~/services/registry/import.server";
import { type RegistryPlan, type StationPlan, totalChanges } from "~/services/registry/plan";
import { getSite } from "~/services/registry/queries.server";
import { decodeUpload, MAX_IMPORT_BYTES, MAX_IMPORT_TEXT } from "~/services/registry/upload";
import { formText, sendOn } from "../editor.server";
import { overviewHref } from "../links";

export const Kind = v.picklist(
  ["stations", "registry"],
  "Choose what the file holds: stations, or the whole registry.",
);
export const Intent = v.picklist(["preview", "apply"], "Unknown action.");
type Intent = v.InferOutput<typeof Intent>;

export type ImportResult = {
  kind: v.InferOutput<typeof Kind>;
  siteId: number | null;
  removeMissing: boolean;
  fileName: string;
  /** The pasted text, given back so the box keeps it. */
  pasted: string;
  /** The file's text when the preview is valid, carried to the apply step. */
  content: string | null;
  errors: string[];
  notices: string[];
  stations: StationPlan | null;
  registry: RegistryPlan | null;
};

export const blankResult = (): ImportResult => ({
  kind: "stations",
  siteId: null,
  removeMissing: false,
  fileName: "",
  pasted: "",
  content: null,
  errors: [],
  notices: [],
  stations: null,
  registry: null,
});

/** The page answers a refused file with the result so far, its problems, and no text to apply. */
export const fail = (result: ImportResult, errors: string[], status = 400) =>
  data({ ...result, content: null, errors }, { status });

/** The text to import, or why there is none; notes the file's name and the pasted text on `result`. */
export async function importText(
  form: FormData,
  intent: Intent,
  result: ImportResult,
): Promise<{ text: string } | { error: string }> {
  const file = form.get("file");
  const typed = formText(form, "content");
  if (intent === "preview" && file instanceof File && file.size > 0) {
    result.fileName = file.name.slice(0, 200);
    const decoded = decodeUpload(new Uint8Array(await file.arrayBuffer()));
    return decoded.ok ? { text: decoded.text } : { error: decoded.error };
  }
  if (intent === "preview") result.pasted = typed.slice(0, MAX_IMPORT_BYTES);
  if (file instanceof File && file.name && file.size === 0) return { error: "The file is empty." };
  if (typed.trim() === "")
    return {
      error:
        intent === "apply"
          ? "The preview's text was lost; upload the file again."
          : "Choose a file, or paste its text into the box.",
    };
  if (new TextEncoder().encode(typed).length > MAX_IMPORT_BYTES)
    return { error: `The text is larger than the limit of ${MAX_IMPORT_TEXT}; split it into smaller files.` };
  return { text: typed };
}

export type ImportPost = { db: Database; actorId: number; intent: Intent; result: ImportResult; text: string };

/** Applies a plan; a record changed by someone else since the preview refuses it (409) and nothing is written. */
async function applyOrRefuse(result: ImportResult, apply: () => Promise<unknown>) {
  try {
    await apply();
    return null;
  } catch (e) {
    const code = pgCode(e);
    if (code !== PG_FOREIGN_KEY_VIOLATION && code !== PG_UNIQUE_VIOLATION) throw e;
    const message =
      "The registry changed while you were looking at the preview, so nothing was imported; preview the file again.";
    return fail(result, [message], 409);
  }
}

const unchanged = (siteId?: number | null) =>
  sendOn({ to: overviewHref(siteId), kind: "info", text: "The file matches the registry; nothing was changed." });

/** Stations (CSV or JSON) into the chosen site. */
export async function importStations({ db, actorId, intent, result, text }: ImportPost) {
  const site = result.siteId ? await getSite(db, { id: result.siteId }) : null;
  if (!site) return fail(result, ["Choose the site the stations belong to."]);
  const planned = await planStationImport(db, { siteId: site.id, text, removeMissing: result.removeMissing });
  result.notices = planned.notices;
  if (!planned.ok) return fail(result, planned.errors);
  const { plan } = planned;
  result.stations = plan;
  if (intent === "preview") return { ...result, content: text };
  if (totalChanges(plan.counts) === 0) return unchanged(site.id);
  const refused = await applyOrRefuse(result, () => applyStationPlan(db, { actorId, site, plan }));
  return refused ?? sendOn({ to: overviewHref(site.id), text: stationImportSummary(site.name, plan.counts) });
}

/** A whole registry (JSON, as exported) into the site of its name, or a new site. */
export async function importRegistry({ db, actorId, intent, result, text }: ImportPost) {
  const planned = await planRegistryImport(db, { text, removeMissing: result.removeMissing });
  result.notices = planned.notices;
  if (!planned.ok) return fail(result, planned.errors);
  const { plan } = planned;
  result.registry = plan;
  if (intent === "preview") return { ...result, content: text };
  if (Object.values(plan.counts).reduce((n, c) => n + totalChanges(c), 0) === 0) return unchanged(planned.siteId);
  let siteId = 0;
  const refused = await applyOrRefuse(result, async () => {
    siteId = await applyRegistryPlan(db, { actorId, plan });
  });
  return refused ?? sendOn({ to: overviewHref(siteId), text: registryImportSummary(plan) });
}
