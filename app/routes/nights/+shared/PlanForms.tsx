import { useFetcher } from "react-router";
import { Button, SelectField, TextField } from "~/components/ui";
import type { CandidateRow } from "~/services/nights/queries.server";
import { utcTime } from "~/services/nights/sky";
import type { BlockView } from "~/services/nights/view";
import { FetcherResult } from "./FetcherResult";
import type { NightActionData } from "./intents.server";

/** Insert a block: what to observe, after which block, for how long. */
export function InsertForm({
  candidates,
  blocks,
  defaultLengthMin,
}: {
  candidates: CandidateRow[];
  blocks: BlockView[];
  defaultLengthMin: number;
}) {
  const fetcher = useFetcher<NightActionData>();
  const errors = fetcher.data?.intent === "insert" ? fetcher.data.errors : {};
  return (
    <fetcher.Form method="post" aria-label="Insert a block" className="grid gap-3 sm:grid-cols-4 sm:items-end">
      <input type="hidden" name="intent" value="insert" />
      <SelectField label="What to observe" name="object" error={errors.object} required>
        {candidates.map((c) => (
          <optgroup key={c.proposalTargetId} label={c.key}>
            <option value={`${c.proposalTargetId}:science`}>Science: {c.key}</option>
            {c.calibrators.map((k, i) => (
              <option key={k.name} value={`${c.proposalTargetId}:cal:${i}`}>
                Calibrator {k.name} for {c.key}
              </option>
            ))}
          </optgroup>
        ))}
      </SelectField>
      <SelectField
        label="Where"
        name="after"
        defaultValue={blocks.length ? String(blocks[blocks.length - 1].id) : "start"}
        error={errors.after}
      >
        <option value="start">At the start of the night</option>
        {blocks.map((b) => (
          <option key={b.id} value={b.id}>
            After #{b.position} {b.kind} {b.object} (ends {utcTime(b.endUtc)})
          </option>
        ))}
      </SelectField>
      <TextField
        label="Length"
        unit="min"
        name="lengthMin"
        type="number"
        min={1}
        max={720}
        defaultValue={String(defaultLengthMin)}
        error={errors.lengthMin}
        required
      />
      <Button type="submit" variant="secondary" disabled={fetcher.state !== "idle" || candidates.length === 0}>
        Insert block
      </Button>
      {fetcher.data ? <FetcherResult data={fetcher.data} className="sm:col-span-4" /> : null}
    </fetcher.Form>
  );
}

/** Re-plan the rest of the night from a given time (UTC): kept blocks stay, the rest is planned afresh. */
export function ReplanForm({ defaultFrom }: { defaultFrom: string }) {
  const fetcher = useFetcher<NightActionData>();
  const errors = fetcher.data?.intent === "replan" ? fetcher.data.errors : {};
  return (
    <fetcher.Form
      method="post"
      aria-label="Re-plan the rest of the night"
      className="grid gap-3 sm:grid-cols-3 sm:items-end"
    >
      <input type="hidden" name="intent" value="replan" />
      <TextField
        label="Re-plan from (UTC)"
        name="fromUtc"
        type="datetime-local"
        defaultValue={defaultFrom}
        error={errors.fromUtc}
        hint="Blocks begun by then (with the calibrator closing a sequence under way) and blocks marked executed stay; the rest of the night is planned again."
        required
      />
      <Button type="submit" variant="secondary" disabled={fetcher.state !== "idle"}>
        {fetcher.state !== "idle" ? "Planning…" : "Re-plan the rest"}
      </Button>
      {fetcher.data ? <FetcherResult data={fetcher.data} className="sm:col-span-3" /> : null}
    </fetcher.Form>
  );
}
