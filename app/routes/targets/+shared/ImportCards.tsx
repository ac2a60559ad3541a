import { Form } from "react-router";
import { Badge, Button, Card, DataTable } from "~/components/ui";
import { FieldList, type FieldSpec, GroupError } from "~/components/ui/FieldList";
import { plural } from "~/lib/format";
import type { RowError } from "~/services/targets/csv";
import { coordinateColumns } from "./columns";
import type { Preview, PreviewRow } from "./preview";

const PASTE: FieldSpec[] = [
  { name: "csv", label: "…or paste the CSV here", multiline: true, className: "font-mono text-sm" },
];

/** Step 1: choose or paste the list, and say whether names already in My targets are replaced. */
export function ListCard({
  maxKb,
  pasted,
  replace,
  fileError,
  busy,
}: {
  maxKb: number;
  pasted: string;
  replace: boolean;
  fileError: string | null;
  busy: boolean;
}) {
  return (
    <Card title="1. The list">
      <Form method="post" encType="multipart/form-data" className="grid gap-4">
        <input type="hidden" name="intent" value="preview" />
        <div>
          <label htmlFor="file" className="block text-sm font-medium text-night-800">
            CSV file <span className="font-normal text-night-500">(UTF-8, at most {maxKb} KB)</span>
          </label>
          <input
            id="file"
            name="file"
            type="file"
            accept=".csv,text/csv"
            className="mt-1 block text-sm file:mr-3 file:rounded-lg file:border-0 file:bg-night-100 file:px-3 file:py-2 file:font-medium file:text-night-800 hover:file:bg-night-200"
          />
        </div>
        <FieldList fields={PASTE} values={{ csv: pasted }} errors={{}} />
        <label className="inline-flex items-center gap-2 text-sm">
          <input type="checkbox" name="replace" defaultChecked={replace} className="h-4 w-4 accent-ember-700" />
          Replace targets that already have the same name
        </label>
        <GroupError message={fileError} />
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
          <code>mag_H</code>, <code>mag_K</code>, … one per band, <code>notes</code>. A row whose name is a catalogue
          star (HD 39801, α Ori, Betelgeuse) may leave <code>ra</code> and <code>dec</code> empty, or the list may leave
          those columns out: the star's J2000 position is taken from the catalogue.
        </p>
      </details>
    </Card>
  );
}

/** A table's fixed parts (caption, columns, row key, empty text); the rows come with the preview. */
type Table<Row> = Omit<Parameters<typeof DataTable<Row>>[0], "rows">;

const previewTable: Table<PreviewRow> = {
  caption: "Targets read from the list",
  columns: [
    { key: "row", header: "Line", align: "right", value: (r) => r.row },
    { key: "name", header: "Name", value: (r) => r.name },
    ...coordinateColumns<PreviewRow>(),
    { key: "model", header: "Model", value: (r) => r.model },
    { key: "mags", header: "Magnitudes", value: (r) => r.magnitudes },
    {
      key: "change",
      header: "Change",
      value: (r) => r.change,
      render: (r) => <Badge tone={r.change === "new" ? "ok" : "info"}>{r.change}</Badge>,
    },
  ],
  rowKey: (r) => r.row,
  empty: "No target to import.",
};

const problemTable: Table<RowError> = {
  caption: "Problems by line of the file",
  columns: [
    { key: "row", header: "Line", align: "right", value: (e) => e.row },
    { key: "column", header: "Column", value: (e) => e.column },
    { key: "message", header: "Problem", value: (e) => e.message },
  ],
  rowKey: (e) => `${e.row}-${e.column}-${e.message}`,
};

/** Step 2: what the list would change, its problems, and the button that imports a clean list. */
export function PreviewCard({ preview, busy }: { preview: Preview; busy: boolean }) {
  const problems = preview.errors.length;
  return (
    <Card title="2. What would change">
      {preview.warnings.map((w) => (
        <p key={w} className="mb-2 text-sm text-caution-700">
          Note: {w}
        </p>
      ))}
      {problems > 0 ? (
        <div className="mb-4 space-y-2">
          <p role="alert" className="font-medium text-danger-700">
            {plural(problems, "problem")} to fix — nothing has been imported.
          </p>
          <DataTable {...problemTable} rows={preview.errors} />
        </div>
      ) : null}
      {preview.unchanged > 0 ? (
        <p role="status" className="mb-2 text-sm text-night-700">
          {preview.rows.length === 0 && problems === 0
            ? `All ${preview.unchanged} already in your list, unchanged: nothing to import.`
            : `${plural(preview.unchanged, "row")} already in your list, unchanged: left as they are.`}
        </p>
      ) : null}
      <DataTable {...previewTable} rows={preview.rows} />
      {problems === 0 && preview.rows.length > 0 ? (
        <Form method="post" encType="multipart/form-data" className="mt-4">
          <input type="hidden" name="intent" value="import" />
          <input type="hidden" name="csv" value={preview.csv} />
          {preview.replace ? <input type="hidden" name="replace" value="on" /> : null}
          <Button type="submit" disabled={busy}>
            Import {plural(preview.rows.length, "target")}
          </Button>
        </Form>
      ) : null}
    </Card>
  );
}
