/** Auto-assign: how many reviewers per proposal, the preview of what a run adds, and saving it. */
import { Form } from "react-router";
import { Alert, Button, Card, type Column, DataTable, TextField } from "~/components/ui";

export type AutoAssignPreview = {
  perProposal: number;
  added: { proposalId: number; reviewerId: number; title: string; reviewer: string }[];
  loads: { reviewerId: number; name: string; total: number; kept: number }[];
  shortfalls: { proposal: string; title: string; assigned: number; needed: number; reason: string }[];
  warnings: string[];
};

const addedColumns: Column<AutoAssignPreview["added"][number]>[] = [
  { key: "proposal", header: "Proposal", value: (a) => a.title },
  { key: "reviewer", header: "Reviewer", value: (a) => a.reviewer },
];

export function AutoAssignCard({
  perProposal,
  preview,
  disabled,
}: {
  perProposal: number;
  preview: AutoAssignPreview | null;
  disabled: boolean;
}) {
  const loads = preview?.loads.map((l) => l.total) ?? [];
  return (
    <Card title="Auto-assign">
      <p className="mb-3 text-sm text-night-700">
        Gives every proposal its reviewers with the load balanced (most and fewest differ by at most one where the
        conflicts allow), never a conflicted reviewer or one who declined, science categories spread. Assignments that
        exist — scored or not — are kept. Nothing is saved until you save the preview.
      </p>
      <Form method="post" className="flex flex-wrap items-end gap-3">
        <input type="hidden" name="intent" value="preview" />
        <div className="w-44">
          <TextField
            label="Reviewers per proposal"
            name="perProposal"
            inputMode="numeric"
            defaultValue={String(preview?.perProposal ?? perProposal)}
          />
        </div>
        <Button type="submit" variant="secondary" disabled={disabled}>
          Preview
        </Button>
      </Form>
      {preview ? (
        <section aria-label="Auto-assign preview" className="mt-4 grid gap-3">
          <p className="text-sm font-medium text-night-800">
            {preview.added.length === 0
              ? "Nothing to add: every proposal has its reviewers (or none is free of conflicts)."
              : `${preview.added.length} new assignment${preview.added.length === 1 ? "" : "s"}; loads after the run from ${Math.min(...loads)} to ${Math.max(...loads)} per reviewer.`}
          </p>
          {preview.added.length > 0 ? (
            <DataTable
              columns={addedColumns}
              rows={preview.added}
              rowKey={(a) => `${a.proposalId}:${a.reviewerId}`}
              caption="New assignments of the preview"
              exportName="auto-assign-preview"
              density="compact"
              className="max-h-72 overflow-y-auto"
            />
          ) : null}
          <p className="text-sm text-night-700">
            Loads after the run:{" "}
            {preview.loads.map((l) => `${l.name} ${l.total}${l.kept ? ` (${l.kept} kept)` : ""}`).join(" · ")}
          </p>
          {preview.shortfalls.map((s) => (
            <Alert key={s.proposal} tone="caution">
              “{s.title}”: {s.assigned} of {s.needed} reviewers — {s.reason}
            </Alert>
          ))}
          {preview.warnings.map((w) => (
            <Alert key={w} tone="caution">
              {w}
            </Alert>
          ))}
          {preview.added.length > 0 ? (
            <Form method="post">
              <input type="hidden" name="intent" value="save-auto" />
              {preview.added.map((a) => (
                <input
                  key={`${a.proposalId}:${a.reviewerId}`}
                  type="hidden"
                  name="pair"
                  value={`${a.proposalId}:${a.reviewerId}`}
                />
              ))}
              <Button type="submit">Save these {preview.added.length} assignments and notify the reviewers</Button>
            </Form>
          ) : null}
        </section>
      ) : null}
    </Card>
  );
}
