/** The import page's first card: what the file holds, where it goes, the file or its text, and how files are read. */
import { useState } from "react";
import { Form, useNavigation } from "react-router";
import { Button, Card, SelectField, TextArea } from "~/components/ui";
import { STATION_COLUMNS } from "~/services/registry/schemas";
import { MAX_IMPORT_STATIONS, MAX_IMPORT_TEXT } from "~/services/registry/upload";
import type { ImportResult } from "./import.server";

export function ChooseFileCard({
  sites,
  siteId,
  result,
  ready,
}: {
  sites: { id: number; name: string }[];
  siteId: number | null;
  result: ImportResult | undefined;
  /** A valid preview is shown: previewing again is the secondary step. */
  ready: boolean;
}) {
  const navigation = useNavigation();
  const busy = navigation.state === "submitting";
  const [kind, setKind] = useState<"stations" | "registry">(result?.kind ?? "stations");
  return (
    <Card title="1. Choose the file">
      <Form method="post" encType="multipart/form-data" className="space-y-4" aria-label="Choose the file to import">
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
          sites.length === 0 ? (
            <p className="text-sm text-danger-700">There is no site yet: add one first, or import a whole registry.</p>
          ) : (
            <SelectField label="Into the site" name="siteId" defaultValue={siteId ?? undefined}>
              {sites.map((s) => (
                <option key={s.id} value={s.id}>
                  {s.name}
                </option>
              ))}
            </SelectField>
          )
        ) : null}
        <div className="space-y-1">
          <label htmlFor="import-file" className="block text-sm font-medium text-night-800">
            File <span className="font-normal text-night-500">(CSV or JSON, UTF-8, up to {MAX_IMPORT_TEXT})</span>
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
            Station CSV: a header row naming <code>{STATION_COLUMNS.join(", ")}</code> (metres; any order; “East (m)” or
            “east_m” work too), then one station per row, every cell filled. Other columns are ignored and listed.
          </li>
          <li>Station JSON: a list of objects with the same fields, or an object with a “stations” list.</li>
          <li>
            The whole registry: the JSON of “Whole registry (JSON)” on the registry page; the site is matched by name.
          </li>
          <li>
            Stations, configurations, instruments and bands are matched by name: new ones are added, changed ones
            updated.
          </li>
          <li>
            A CSV row is named by its line in the file (the header on line 1); a JSON item by its place in its list. Up
            to {MAX_IMPORT_STATIONS} stations at once.
          </li>
          <li>One error anywhere and nothing is written.</li>
        </ul>
      </details>
    </Card>
  );
}
