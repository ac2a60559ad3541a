import { data, Form, Link, useNavigation } from "react-router";
import { ErrorPage } from "~/components/ErrorPage";
import { Badge, Button, Card, type Column, DataTable, PageHeader, TextArea } from "~/components/ui";
import { database } from "~/db/client.server";
import { parseForm, readBodyCapped } from "~/lib/body.server";
import { formatDeclination, formatRightAscension } from "~/lib/coordinates";
import { redirectWithFlash } from "~/lib/flash.server";
import { requirePermission } from "~/lib/guards.server";
import { MAX_TARGET_CSV_BYTES, parseTargetCsv, type RowError } from "~/services/targets/csv";
import { describeModel } from "~/components/targets/describe-model";
import { importTargets, targetNames } from "~/services/targets/targets.server";
import type { Route } from "./+types/import";

/** Room for the form fields around the file itself. */
const MAX_REQUEST_BYTES = MAX_TARGET_CSV_BYTES + 64 * 1024;

export async function loader({ request }: Route.LoaderArgs) {
  await requirePermission(request, "proposals:own");
  return { maxKb: MAX_TARGET_CSV_BYTES / 1024 };
}

type Preview = {
  csv: string;
  replace: boolean;
  rows: {
    row: number;
    name: string;
    ra: string;
    dec: string;
    model: string;
    magnitudes: string;
    change: "new" | "update";
  }[];
  errors: RowError[];
  warnings: string[];
};

function refuse(message: string) {
  return data({ preview: null, fileError: message }, { status: 400 });
}

export async function action({ request }: Route.ActionArgs) {
  const viewer = await requirePermission(request, "proposals:own");
  const read = await readBodyCapped(request, MAX_REQUEST_BYTES);
  if (!read.ok) {
    return read.reason === "too-large"
      ? refuse(`The file is larger than ${MAX_TARGET_CSV_BYTES / 1024} KB; split the list.`)
      : refuse("The upload was interrupted; please choose the file again.");
  }
  const form = await parseForm(request, read.bytes);
  if (!form) return refuse("The upload could not be read; please choose the file again.");
  const file = form.get("file");
  let csv = typeof form.get("csv") === "string" ? String(form.get("csv")) : "";
  if (file instanceof File && file.size > 0) {
    const bytes = new Uint8Array(await file.arrayBuffer());
    try {
      csv = new TextDecoder("utf-8", { fatal: true }).decode(bytes);
    } catch {
      return refuse(`${file.name} is not UTF-8 text; save it as CSV (UTF-8) and try again.`);
    }
  }
  const replace = form.get("replace") === "on";
  const db = database();
  const existing = await targetNames(db, viewer.user.id);
  const result = parseTargetCsv(csv, { existingNames: existing, replaceExisting: replace });
  const preview: Preview = {
    csv,
    replace,
    rows: result.targets.map((t) => ({
      row: t.row,
      name: t.name,
      ra: formatRightAscension(t.raDeg, 2),
      dec: formatDeclination(t.decDeg, 1),
      model: describeModel(t.model),
      magnitudes: Object.entries(t.magnitudes)
        .map(([b, m]) => `${b} ${m}`)
        .join(", "),
      change: existing.has(t.name.toLowerCase()) ? "update" : "new",
    })),
    errors: result.errors,
    warnings: result.warnings,
  };
  if (form.get("intent") !== "import" || result.errors.length > 0) {
    return data({ preview, fileError: null }, { status: result.errors.length ? 400 : 200 });
  }
  // All rows are good: write them together, or not at all.
  const counts = await importTargets(db, viewer.user.id, result.targets);
  return redirectWithFlash("/targets", {
    kind: "success",
    text: `Imported ${counts.created} new target${counts.created === 1 ? "" : "s"}${counts.updated ? ` and updated ${counts.updated}` : ""}.`,
  });
}

export const meta: Route.MetaFunction = () => [{ title: "Import targets — Fringe Docket" }];

type PreviewRow = Preview["rows"][number];
const previewColumns: Column<PreviewRow>[] = [
  { key: "row", header: "Row", align: "right", value: (r) => r.row },
  { key: "name", header: "Name", value: (r) => r.name },
  { key: "ra", header: "RA", unit: "h:m:s", value: (r) => r.ra },
  { key: "dec", header: "Dec", unit: "°:′:″", value: (r) => r.dec },
  { key: "model", header: "Model", value: (r) => r.model },
  { key: "mags", header: "Magnitudes", value: (r) => r.magnitudes },
  {
    key: "change",
    header: "Change",
    value: (r) => r.change,
    render: (r) => <Badge tone={r.change === "new" ? "ok" : "info"}>{r.change}</Badge>,
  },
];
const errorColumns: Column<RowError>[] = [
  { key: "row", header: "Row", align: "right", value: (e) => e.row },
  { key: "column", header: "Column", value: (e) => e.column },
  { key: "message", header: "Problem", value: (e) => e.message },
];

export default function ImportTargets({ loaderData, actionData }: Route.ComponentProps) {
  const busy = useNavigation().state === "submitting";
  const preview = actionData?.preview ?? null;
  return (
    <>
      <PageHeader
        title="Import targets"
        lead="Check a CSV list first; nothing is written until every row is right, and then all rows are written together."
        actions={
          <Link to="/targets" className="font-medium text-ember-700 underline">
            Back to My targets
          </Link>
        }
      />
      <div className="grid gap-6">
        <Card title="1. The list">
          <Form method="post" encType="multipart/form-data" className="grid gap-4">
            <input type="hidden" name="intent" value="preview" />
            <div>
              <label htmlFor="file" className="block text-sm font-medium text-night-800">
                CSV file <span className="font-normal text-night-500">(UTF-8, at most {loaderData.maxKb} KB)</span>
              </label>
              <input
                id="file"
                name="file"
                type="file"
                accept=".csv,text/csv"
                className="mt-1 block text-sm file:mr-3 file:rounded-lg file:border-0 file:bg-night-100 file:px-3 file:py-2 file:font-medium file:text-night-800 hover:file:bg-night-200"
              />
            </div>
            <TextArea
              label="…or paste the CSV here"
              name="csv"
              defaultValue={preview?.csv ?? ""}
              className="font-mono text-sm"
            />
            <label className="inline-flex items-center gap-2 text-sm">
              <input
                type="checkbox"
                name="replace"
                defaultChecked={preview?.replace ?? false}
                className="h-4 w-4 accent-ember-700"
              />
              Replace targets that already have the same name
            </label>
            {actionData?.fileError ? (
              <p role="alert" className="text-sm font-medium text-danger-700">
                {actionData.fileError}
              </p>
            ) : null}
            <div>
              <Button type="submit" variant="secondary" disabled={busy}>
                Check the list
              </Button>
            </div>
          </Form>
          <details className="mt-4 text-sm text-night-700">
            <summary className="cursor-pointer font-medium">Columns</summary>
            <p className="mt-2">
              Required: <code>name</code>, <code>ra</code> (hours 05:36:12.8 or degrees), <code>dec</code> (degrees).
              Optional: <code>model</code> (point, uniformDisk, gaussian, limbDarkenedDisk, ring, binary),{" "}
              <code>size_mas</code> (diameter or FWHM), <code>ld_coefficient</code>, <code>separation_mas</code>,{" "}
              <code>position_angle_deg</code> (east of north), <code>flux_ratio</code> (secondary/primary),{" "}
              <code>mag_H</code>, <code>mag_K</code>, … one per band, <code>notes</code>.
            </p>
          </details>
        </Card>

        {preview ? (
          <Card title="2. What would change">
            {preview.warnings.map((w) => (
              <p key={w} className="mb-2 text-sm text-caution-700">
                Note: {w}
              </p>
            ))}
            {preview.errors.length > 0 ? (
              <div className="mb-4 space-y-2">
                <p role="alert" className="font-medium text-danger-700">
                  {preview.errors.length} problem{preview.errors.length === 1 ? "" : "s"} to fix — nothing has been
                  imported.
                </p>
                <DataTable
                  caption="Problems by row"
                  columns={errorColumns}
                  rows={preview.errors}
                  rowKey={(e) => `${e.row}-${e.column}-${e.message}`}
                />
              </div>
            ) : null}
            <DataTable
              caption="Targets read from the list"
              columns={previewColumns}
              rows={preview.rows}
              rowKey={(r) => r.row}
              empty="No row could be read."
            />
            {preview.errors.length === 0 && preview.rows.length > 0 ? (
              <Form method="post" encType="multipart/form-data" className="mt-4">
                <input type="hidden" name="intent" value="import" />
                <input type="hidden" name="csv" value={preview.csv} />
                {preview.replace ? <input type="hidden" name="replace" value="on" /> : null}
                <Button type="submit" disabled={busy}>
                  Import {preview.rows.length} target{preview.rows.length === 1 ? "" : "s"}
                </Button>
              </Form>
            ) : null}
          </Card>
        ) : null}
      </div>
    </>
  );
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
