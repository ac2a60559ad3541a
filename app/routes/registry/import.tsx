import { useState } from "react";
import { data, Form, Link, useNavigation } from "react-router";
import * as v from "valibot";
import { ErrorPage } from "~/components/ErrorPage";
import { RegistryPreview, StationPreview } from "~/components/registry/ImportPreview";
import { registryPaths } from "~/components/registry/paths";
import { Button, Card, PageHeader, SelectField, TextArea } from "~/components/ui";
import { database } from "~/db/client.server";
import { redirectWithFlash } from "~/lib/flash.server";
import { requirePermission } from "~/lib/guards.server";
import {
  applyRegistryPlan,
  applyStationPlan,
  findSiteByName,
  getSite,
  loadSnapshot,
  pgCode,
  readForm,
  resolveSite,
  stationUsage,
  toId,
} from "~/services/registry/admin.server";
import {
  type Change,
  decodeUpload,
  issueText,
  MAX_IMPORT_BYTES,
  MAX_IMPORT_STATIONS,
  parseRegistryJson,
  parseStationsFile,
  planRegistry,
  planStations,
  type RegistryPlan,
  STATION_COLUMNS,
  type StationPlan,
} from "~/services/registry/io";
import { listSites } from "~/services/registry/queries.server";
import type { Route } from "./+types/import";

const Kind = v.picklist(["stations", "registry"], "Choose what the file holds: stations, or the whole registry.");
const Intent = v.picklist(["preview", "apply"], "Unknown action.");

type ImportResult = {
  kind: "stations" | "registry";
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

/** Parts of the body beyond the file itself (the other fields and the multipart framing). */
const FORM_OVERHEAD_BYTES = 64_000;
const LIMIT_TEXT = `${MAX_IMPORT_BYTES / 1_000_000} MB`;

export async function loader({ request, url }: Route.LoaderArgs) {
  await requirePermission(request, "registry:edit");
  const db = database();
  const [sites, chosen] = await Promise.all([listSites(db), resolveSite(db, url.searchParams.get("site"))]);
  return { sites: sites.map((s) => ({ id: s.id, name: s.name })), siteId: chosen?.id ?? null };
}

const totalChanges = (counts: Record<Change, number>) => counts.new + counts.updated + counts.remove;

export async function action({ request }: Route.ActionArgs) {
  await requirePermission(request, "registry:edit");
  const read = await readForm(
    request,
    MAX_IMPORT_BYTES + FORM_OVERHEAD_BYTES,
    `The file is larger than the limit of ${LIMIT_TEXT}; split it into smaller files.`,
  );
  const result: ImportResult = {
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
  };
  const fail = (message: string[], status = 400) => data({ ...result, content: null, errors: message }, { status });
  if ("error" in read) return fail([read.error], read.status);
  const form = read.form;

  const intent = v.safeParse(Intent, form.get("intent"));
  const kind = v.safeParse(Kind, form.get("kind"));
  result.removeMissing = form.get("removeMissing") === "on";
  result.siteId = toId(form.get("siteId"));
  if (kind.success) result.kind = kind.output;
  if (!intent.success) return fail([intent.issues[0].message]);
  if (!kind.success) return fail([kind.issues[0].message]);

  // The text: an uploaded file, or pasted text, or (when applying) the text the preview carried.
  const file = form.get("file");
  const typed = typeof form.get("content") === "string" ? (form.get("content") as string) : "";
  let text: string;
  if (intent.output === "preview" && file instanceof File && file.size > 0) {
    result.fileName = file.name.slice(0, 200);
    const decoded = decodeUpload(new Uint8Array(await file.arrayBuffer()));
    if (!decoded.ok) return fail([decoded.error]);
    text = decoded.text;
  } else {
    if (intent.output === "preview") result.pasted = typed.slice(0, MAX_IMPORT_BYTES);
    if (file instanceof File && file.name && file.size === 0) return fail(["The file is empty."]);
    if (typed.trim() === "")
      return fail([
        intent.output === "apply"
          ? "The preview's text was lost; upload the file again."
          : "Choose a file, or paste its text into the box.",
      ]);
    if (new TextEncoder().encode(typed).length > MAX_IMPORT_BYTES)
      return fail([`The text is larger than the limit of ${LIMIT_TEXT}; split it into smaller files.`]);
    text = typed;
  }

  const db = database();
  let summary: string;
  let redirectSite: number;
  if (result.kind === "stations") {
    const site = result.siteId ? await getSite(db, result.siteId) : null;
    if (!site) return fail(["Choose the site the stations belong to."]);
    const parsed = parseStationsFile(text);
    result.notices = parsed.notices;
    if (parsed.errors.length > 0) return fail(parsed.errors.map(issueText));
    const [snapshot, usage] = await Promise.all([loadSnapshot(db, site.id), stationUsage(db, site.id)]);
    const plan = planStations(snapshot?.stations ?? [], parsed.stations, {
      removeMissing: result.removeMissing,
      usage,
    });
    result.stations = plan;
    result.notices = [...parsed.notices, ...plan.notices];
    if (intent.output === "preview") return { ...result, content: text };
    if (totalChanges(plan.counts) === 0)
      return redirectWithFlash(registryPaths.overview(site.id), {
        kind: "info",
        text: "The file matches the registry; nothing was changed.",
      });
    try {
      await applyStationPlan(db, site.id, plan);
    } catch (e) {
      const code = pgCode(e);
      if (code !== "23503" && code !== "23505") throw e;
      return fail(
        [
          "The registry changed while you were looking at the preview, so nothing was imported; preview the file again.",
        ],
        409,
      );
    }
    const c = plan.counts;
    summary = `Stations imported into ${site.name}: ${c.new} new, ${c.updated} updated, ${c.unchanged} unchanged${c.remove ? `, ${c.remove} removed` : ""}.`;
    redirectSite = site.id;
  } else {
    const parsed = parseRegistryJson(text);
    result.notices = parsed.notices;
    if (!parsed.registry) return fail(parsed.errors.map(issueText));
    const existing = await findSiteByName(db, parsed.registry.site.name);
    const snapshot = existing ? await loadSnapshot(db, existing.id) : null;
    const plan = planRegistry(snapshot, parsed.registry, { removeMissing: result.removeMissing });
    result.notices = [...parsed.notices, ...plan.notices];
    if (plan.errors.length > 0) return fail(plan.errors.map(issueText));
    result.registry = plan;
    if (intent.output === "preview") return { ...result, content: text };
    const counts = plan.counts;
    const changes = Object.values(counts).reduce((n, c) => n + totalChanges(c), 0);
    if (changes === 0)
      return redirectWithFlash(registryPaths.overview(existing?.id), {
        kind: "info",
        text: "The file matches the registry; nothing was changed.",
      });
    try {
      redirectSite = await applyRegistryPlan(db, plan);
    } catch (e) {
      const code = pgCode(e);
      if (code !== "23503" && code !== "23505") throw e;
      return fail(
        [
          "The registry changed while you were looking at the preview, so nothing was imported; preview the file again.",
        ],
        409,
      );
    }
    const part = (noun: string, c: Record<Change, number>) =>
      `${noun} ${c.new} new, ${c.updated} updated${c.remove ? `, ${c.remove} removed` : ""}`;
    summary = `Registry of ${plan.site.name} imported (site ${plan.site.change}): ${[
      part("stations", counts.stations),
      part("configurations", counts.configurations),
      part("instruments", counts.instruments),
      part("bands", counts.bands),
    ].join("; ")}.`;
  }
  return redirectWithFlash(registryPaths.overview(redirectSite), { kind: "success", text: summary });
}

export const meta: Route.MetaFunction = () => [{ title: "Import — Array registry — Fringe Docket" }];

export default function ImportPage({ loaderData, actionData }: Route.ComponentProps) {
  const navigation = useNavigation();
  const busy = navigation.state === "submitting";
  const result = actionData as ImportResult | undefined;
  const [kind, setKind] = useState<"stations" | "registry">(result?.kind ?? "stations");
  const siteId = result?.siteId ?? loaderData.siteId;
  const ready = result && result.errors.length === 0 && result.content !== null;
  const changes = result?.stations
    ? totalChanges(result.stations.counts)
    : result?.registry
      ? Object.values(result.registry.counts).reduce((n, c) => n + totalChanges(c), 0)
      : 0;

  return (
    <>
      <PageHeader
        title="Import into the registry"
        lead="Upload stations, or a whole registry, and see what would change before anything is written."
        actions={
          <Link
            to={registryPaths.overview(siteId)}
            className="self-center text-sm font-medium text-ember-800 underline-offset-2 hover:underline"
          >
            Back to the registry
          </Link>
        }
      />
      <div className="grid grid-cols-1 gap-6 lg:grid-cols-[24rem_minmax(0,1fr)]">
        <Card title="1. Choose the file">
          <Form
            method="post"
            encType="multipart/form-data"
            className="space-y-4"
            aria-label="Choose the file to import"
          >
            <input type="hidden" name="intent" value="preview" />
            <fieldset className="space-y-2">
              <legend className="text-sm font-medium text-night-800">The file holds</legend>
              {(
                [
                  ["stations", "Stations (CSV or JSON)"],
                  ["registry", "The whole registry (JSON, as exported)"],
                ] as const
              ).map(([value, text]) => (
                <label key={value} className="flex items-center gap-2 text-sm">
                  <input
                    type="radio"
                    name="kind"
                    value={value}
                    checked={kind === value}
                    onChange={() => setKind(value)}
                    className="h-4 w-4 accent-ember-700"
                  />
                  {text}
                </label>
              ))}
            </fieldset>
            {kind === "stations" ? (
              loaderData.sites.length === 0 ? (
                <p className="text-sm text-danger-700">
                  There is no site yet: add one first, or import a whole registry.
                </p>
              ) : (
                <SelectField label="Into the site" name="siteId" defaultValue={siteId ?? undefined}>
                  {loaderData.sites.map((s) => (
                    <option key={s.id} value={s.id}>
                      {s.name}
                    </option>
                  ))}
                </SelectField>
              )
            ) : null}
            <div className="space-y-1">
              <label htmlFor="import-file" className="block text-sm font-medium text-night-800">
                File <span className="font-normal text-night-500">(CSV or JSON, UTF-8, up to {LIMIT_TEXT})</span>
              </label>
              <input
                id="import-file"
                type="file"
                name="file"
                accept=".csv,.json,.txt,text/csv,application/json,text/plain"
                className="block w-full text-sm file:mr-3 file:rounded-lg file:border-0 file:bg-night-100 file:px-3 file:py-2 file:font-medium file:text-night-800 hover:file:bg-night-200"
              />
              {result?.fileName ? <p className="text-sm text-night-600">Last file: {result.fileName}</p> : null}
            </div>
            <TextArea
              label="…or paste its text"
              name="content"
              defaultValue={result?.pasted ?? ""}
              className="font-mono text-xs"
              spellCheck={false}
            />
            <label className="flex items-start gap-2 text-sm">
              <input
                type="checkbox"
                name="removeMissing"
                defaultChecked={result?.removeMissing ?? false}
                className="mt-0.5 h-4 w-4 accent-ember-700"
              />
              <span>Remove stations missing from the file (a station that a configuration uses always stays)</span>
            </label>
            <Button type="submit" variant={ready ? "secondary" : "primary"} disabled={busy}>
              {busy && navigation.formData?.get("intent") === "preview" ? "Reading…" : "Preview the import"}
            </Button>
          </Form>
          <details className="mt-5 text-sm text-night-700">
            <summary className="cursor-pointer font-medium text-night-800">How files are read</summary>
            <ul className="mt-2 list-disc space-y-1 pl-5">
              <li>
                Station CSV: a header row naming <code>{STATION_COLUMNS.join(", ")}</code> (metres; any order; “East
                (m)” or “east_m” work too), then one station per row, every cell filled. Other columns are ignored and
                listed.
              </li>
              <li>Station JSON: a list of objects with the same fields, or an object with a “stations” list.</li>
              <li>
                The whole registry: the JSON of “Whole registry (JSON)” on the registry page; the site is matched by
                name.
              </li>
              <li>
                Stations, configurations, instruments and bands are matched by name: new ones are added, changed ones
                updated.
              </li>
              <li>
                Rows count from 1 at the first row under the header. Up to {MAX_IMPORT_STATIONS} stations at once.
              </li>
              <li>One error anywhere and nothing is written.</li>
            </ul>
          </details>
        </Card>

        <div className="grid min-w-0 grid-cols-1 content-start gap-6">
          {!result ? (
            <Card title="2. Check and apply">
              <p className="text-sm text-night-600">
                The preview appears here: each station new, updated or unchanged, and any errors with their row and
                column.
              </p>
            </Card>
          ) : null}
          {result && result.errors.length > 0 ? (
            <section
              role="alert"
              aria-labelledby="import-errors"
              className="rounded-[var(--radius-card)] border border-danger-700/30 bg-danger-50 p-5 text-danger-700"
            >
              <h2 id="import-errors" className="text-lg font-semibold">
                Nothing was imported{result.errors.length > 1 ? `: ${result.errors.length} problems` : ""}
              </h2>
              <p className="mt-1 text-sm">Correct the file and preview it again.</p>
              <ul className="mt-3 list-disc space-y-1 pl-5 text-sm">
                {result.errors.slice(0, 200).map((e, i) => (
                  <li key={i}>{e}</li>
                ))}
              </ul>
              {result.errors.length > 200 ? (
                <p className="mt-2 text-sm">…and {result.errors.length - 200} more.</p>
              ) : null}
            </section>
          ) : null}
          {result && result.notices.length > 0 ? (
            <ul
              className="space-y-1 rounded-lg border border-info-700/30 bg-info-50 p-3 text-sm text-info-700"
              aria-label="Notes on the file"
            >
              {result.notices.map((n) => (
                <li key={n}>{n}</li>
              ))}
            </ul>
          ) : null}
          {ready ? (
            <Card title="2. Check and apply">
              <div className="space-y-4">
                {result.stations ? <StationPreview plan={result.stations} /> : null}
                {result.registry ? <RegistryPreview plan={result.registry} /> : null}
                <Form
                  method="post"
                  encType="multipart/form-data"
                  className="flex flex-wrap items-center gap-3"
                  aria-label="Apply the import"
                >
                  <input type="hidden" name="intent" value="apply" />
                  <input type="hidden" name="kind" value={result.kind} />
                  {result.siteId ? <input type="hidden" name="siteId" value={result.siteId} /> : null}
                  {result.removeMissing ? <input type="hidden" name="removeMissing" value="on" /> : null}
                  <textarea name="content" hidden readOnly value={result.content ?? ""} />
                  {changes > 0 ? (
                    <Button type="submit" disabled={busy}>
                      {busy && navigation.formData?.get("intent") === "apply"
                        ? "Applying…"
                        : `Apply ${changes} change${changes === 1 ? "" : "s"}`}
                    </Button>
                  ) : (
                    <p className="text-sm font-medium text-night-700">
                      The file matches the registry: there is nothing to change.
                    </p>
                  )}
                </Form>
              </div>
            </Card>
          ) : null}
        </div>
      </div>
    </>
  );
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
