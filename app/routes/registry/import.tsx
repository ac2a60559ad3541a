import { href, Link } from "react-router";
import * as v from "valibot";
import { ErrorPage } from "~/components/ErrorPage";
import { PageHeader } from "~/components/ui";
import { dbContext } from "~/context";
import { readFormBody } from "~/lib/body.server";
import { requirePermission } from "~/lib/guards.server";
import { toId } from "~/lib/not-found";
import { listSites, resolveSite } from "~/services/registry/queries.server";
import { MAX_IMPORT_BYTES, MAX_IMPORT_TEXT } from "~/services/registry/upload";
import { formText } from "./+shared/editor.server";
import { ChooseFileCard } from "./+shared/import/ChooseFileCard";
import { ImportOutcome } from "./+shared/import/ImportOutcome";
import {
  blankResult,
  fail,
  type ImportResult,
  Intent,
  importRegistry,
  importStations,
  importText,
  Kind,
} from "./+shared/import/import.server";
import { withSite } from "./+shared/links";
import type { Route } from "./+types/import";

/** Parts of the body beyond the file itself (the other fields and the multipart framing). */
const FORM_OVERHEAD_BYTES = 64_000;

export async function loader({ request, url, context }: Route.LoaderArgs) {
  await requirePermission(request, "registry:edit");
  const db = context.get(dbContext);
  const [sites, chosen] = await Promise.all([listSites(db), resolveSite(db, { param: url.searchParams.get("site") })]);
  return { sites: sites.map((s) => ({ id: s.id, name: s.name })), siteId: chosen?.id ?? null };
}

export async function action({ request, context }: Route.ActionArgs) {
  const viewer = await requirePermission(request, "registry:edit");
  const body = await readFormBody(request, {
    maxBytes: MAX_IMPORT_BYTES + FORM_OVERHEAD_BYTES,
    tooLargeMessage: `The file is larger than the limit of ${MAX_IMPORT_TEXT}; split it into smaller files.`,
  });
  const result = blankResult();
  if (!body.ok) return fail(result, [body.error], body.status);
  const { form } = body;
  const intent = v.safeParse(Intent, form.get("intent"));
  const kind = v.safeParse(Kind, form.get("kind"));
  result.removeMissing = form.get("removeMissing") === "on";
  result.siteId = toId(formText(form, "siteId"));
  if (kind.success) result.kind = kind.output;
  if (!intent.success) return fail(result, [intent.issues[0].message]);
  if (!kind.success) return fail(result, [kind.issues[0].message]);
  const read = await importText(form, intent.output, result);
  if ("error" in read) return fail(result, [read.error]);
  const post = { db: context.get(dbContext), actorId: viewer.user.id, intent: intent.output, result, text: read.text };
  return result.kind === "stations" ? importStations(post) : importRegistry(post);
}

export const meta: Route.MetaFunction = () => [{ title: "Import — Array registry — Fringe Docket" }];

export default function ImportPage({ loaderData, actionData }: Route.ComponentProps) {
  const result = actionData as ImportResult | undefined;
  const siteId = result?.siteId ?? loaderData.siteId;
  const ready = !!result && result.errors.length === 0 && result.content !== null;
  return (
    <>
      <PageHeader
        title="Import into the registry"
        lead="Upload stations, or a whole registry, and see what would change before anything is written."
        actions={
          <Link
            to={withSite(href("/registry"), siteId)}
            className="self-center text-sm font-medium text-ember-800 underline-offset-2 hover:underline"
          >
            Back to the registry
          </Link>
        }
      />
      <div className="grid grid-cols-1 gap-6 lg:grid-cols-[24rem_minmax(0,1fr)]">
        <ChooseFileCard sites={loaderData.sites} siteId={siteId} result={result} ready={ready} />
        <ImportOutcome result={result} ready={ready} />
      </div>
    </>
  );
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
