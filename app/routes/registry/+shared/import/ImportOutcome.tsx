/** The import page's second column: the problems or notes of a file, its preview and the apply form. */
import { Form, useNavigation } from "react-router";
import { Button, Card } from "~/components/ui";
import { totalChanges } from "~/services/registry/plan";
import type { ImportResult } from "./import.server";
import { RegistryPreview } from "./RegistryPreview";
import { StationPreview } from "./StationPreview";

/** How many records applying the previewed file would write. */
export function changesOf(result: ImportResult | undefined): number {
  if (result?.stations) return totalChanges(result.stations.counts);
  if (result?.registry) return Object.values(result.registry.counts).reduce((n, c) => n + totalChanges(c), 0);
  return 0;
}

function Problems({ errors }: { errors: string[] }) {
  return (
    <section
      role="alert"
      aria-labelledby="import-errors"
      className="rounded-[var(--radius-card)] border border-danger-700/30 bg-danger-50 p-5 text-danger-700"
    >
      <h2 id="import-errors" className="text-lg font-semibold">
        Nothing was imported{errors.length > 1 ? `: ${errors.length} problems` : ""}
      </h2>
      <p className="mt-1 text-sm">Correct the file and preview it again.</p>
      <ul className="mt-3 list-disc space-y-1 pl-5 text-sm">
        {errors.slice(0, 200).map((e, i) => (
          <li key={i}>{e}</li>
        ))}
      </ul>
      {errors.length > 200 ? <p className="mt-2 text-sm">…and {errors.length - 200} more.</p> : null}
    </section>
  );
}

/** The preview of a valid file, and the form that applies it with the text the preview read. */
function ApplyCard({ result }: { result: ImportResult }) {
  const navigation = useNavigation();
  const applying = navigation.state === "submitting" && navigation.formData?.get("intent") === "apply";
  const changes = changesOf(result);
  return (
    <Card title="2. Check and apply">
      <div className="space-y-4">
        {result.stations ? <StationPreview lines={result.stations.lines} counts={result.stations.counts} /> : null}
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
            <Button type="submit" disabled={navigation.state === "submitting"}>
              {applying ? "Applying…" : `Apply ${changes} change${changes === 1 ? "" : "s"}`}
            </Button>
          ) : (
            <p className="text-sm font-medium text-night-700">
              The file matches the registry: there is nothing to change.
            </p>
          )}
        </Form>
      </div>
    </Card>
  );
}

export function ImportOutcome({ result, ready }: { result: ImportResult | undefined; ready: boolean }) {
  return (
    <div className="grid min-w-0 grid-cols-1 content-start gap-6">
      {!result ? (
        <Card title="2. Check and apply">
          <p className="text-sm text-night-600">
            The preview appears here: each station new, updated or unchanged, and any errors with their row and column.
          </p>
        </Card>
      ) : null}
      {result && result.errors.length > 0 ? <Problems errors={result.errors} /> : null}
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
      {ready && result ? <ApplyCard result={result} /> : null}
    </div>
  );
}
