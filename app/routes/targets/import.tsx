import { data, href, useNavigation } from "react-router";
import { ErrorPage } from "~/components/ErrorPage";
import { dbContext } from "~/context";
import { redirectWithFlash } from "~/lib/flash.server";
import { requirePermission } from "~/lib/guards.server";
import { MAX_TARGET_CSV_BYTES, parseTargetCsv } from "~/services/targets/csv";
import { starPosition } from "~/services/targets/star-names.server";
import { importTargets, targetsByName } from "~/services/targets/targets.server";
import { ListCard, PreviewCard } from "./+shared/ImportCards";
import { previewOf } from "./+shared/preview";
import { TargetsPage } from "./+shared/TargetsPage";
import { readUpload } from "./+shared/upload.server";
import type { Route } from "./+types/import";

export async function loader({ request }: Route.LoaderArgs) {
  await requirePermission(request, "proposals:own");
  return { maxKb: MAX_TARGET_CSV_BYTES / 1024 };
}

/** Checks the list ("preview"), or writes it when every row is good ("import"). */
export async function action({ request, context }: Route.ActionArgs) {
  const viewer = await requirePermission(request, "proposals:own");
  const upload = await readUpload(request);
  if (!upload.ok) return data({ preview: null, fileError: upload.message }, { status: 400 });
  const db = context.get(dbContext);
  const existing = await targetsByName(db, { ownerId: viewer.user.id });
  const result = parseTargetCsv(upload.csv, {
    existing,
    replaceExisting: upload.replace,
    resolveName: starPosition,
  });
  if (upload.intent !== "import" || result.errors.length > 0 || result.targets.length === 0) {
    const preview = previewOf(upload, result, new Set(existing.keys()));
    return data({ preview, fileError: null }, { status: result.errors.length ? 400 : 200 });
  }
  // All rows are good: write them together, or not at all.
  const counts = await importTargets(db, { ownerId: viewer.user.id, list: result.targets });
  const updated = counts.updated ? ` and updated ${counts.updated}` : "";
  return redirectWithFlash(href("/targets"), {
    kind: "success",
    text: `Imported ${counts.created} new target${counts.created === 1 ? "" : "s"}${updated}.`,
  });
}

/** The page's title and lead, for the header and the browser tab. */
const PAGE = {
  title: "Import targets",
  lead: "Check a CSV list first; nothing is written until every row is right, and then all rows are written together.",
};

export const meta: Route.MetaFunction = () => [{ title: `${PAGE.title} — Fringe Docket` }];

export default function ImportTargets({ loaderData, actionData }: Route.ComponentProps) {
  const busy = useNavigation().state === "submitting";
  const preview = actionData?.preview ?? null;
  return (
    <TargetsPage {...PAGE} back>
      <ListCard
        maxKb={loaderData.maxKb}
        pasted={preview?.csv ?? ""}
        replace={preview?.replace ?? false}
        fileError={actionData?.fileError ?? null}
        busy={busy}
      />
      {preview ? <PreviewCard preview={preview} busy={busy} /> : null}
    </TargetsPage>
  );
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
