import { href, useFetcher } from "react-router";
import { Alert, Badge, Button, buttonClass, Card } from "~/components/ui";
import type { NightPageData } from "~/services/nights/queries.server";
import { FetcherResult } from "./FetcherResult";
import type { NightActionData } from "./intents.server";
import { STATE_TONE, STATE_WORDS } from "./NightsCalendar";
import { InsertForm, ReplanForm } from "./PlanForms";
import { PlanTable } from "./PlanTable";
import { Timeline } from "./Timeline";

/** The toolbar: the automatic plan, publication, discarding a draft, and the exports. */
function PlanActions({ page }: { page: NightPageData }) {
  const fetcher = useFetcher<NightActionData>();
  const state = page.plan?.state ?? "none";
  const busy = fetcher.state !== "idle";
  const post = (intent: string) => fetcher.submit({ intent }, { method: "post" });
  const file = (name: string) => href("/nights/:date/export/:file", { date: page.date, file: name });
  return (
    <div className="space-y-3">
      <div className="flex flex-wrap items-center gap-2">
        {state === "none" || state === "draft" ? (
          <Button onClick={() => post("auto")} disabled={busy}>
            {busy && fetcher.formData?.get("intent") === "auto" ? "Planning…" : "Plan automatically"}
          </Button>
        ) : null}
        {state === "draft" ? (
          <>
            <Button variant="secondary" onClick={() => post("publish")} disabled={busy || !page.canPublish}>
              Publish to the PIs
            </Button>
            <Button variant="ghost" onClick={() => post("discard")} disabled={busy}>
              Discard draft
            </Button>
          </>
        ) : null}
        {page.plan ? (
          <span className="ml-auto flex flex-wrap items-center gap-2 text-sm">
            Export:
            <a className={buttonClass("secondary", "sm")} href={file("plan.csv")} download>
              CSV
            </a>
            <a className={buttonClass("secondary", "sm")} href={file("plan.json")} download>
              JSON
            </a>
            <a className={buttonClass("secondary", "sm")} href={file("plan.ics")} download>
              iCalendar
            </a>
          </span>
        ) : null}
      </div>
      <FetcherResult data={fetcher.data} />
    </div>
  );
}

/** The plan of the night: what the planner reported, the timeline, the table, and the edits the state allows. */
export function PlanCard({ page }: { page: NightPageData }) {
  const state = page.plan?.state ?? "none";
  const bad = page.blocks.filter((b) => b.violations.length > 0).length;
  const mode = state === "draft" ? "edit" : state === "none" ? "read" : "mark";
  const report = page.plan?.report;
  return (
    <Card
      title={
        <span className="flex items-center gap-2">
          Plan <Badge tone={STATE_TONE[state]}>{STATE_WORDS[state]}</Badge>
        </span>
      }
    >
      <div className="space-y-4">
        <PlanActions page={page} />
        {bad > 0 ? (
          <Alert>
            {bad} block{bad === 1 ? " breaks" : "s break"} a rule (marked in red below). Nothing invalid can be
            published: move, shorten or remove {bad === 1 ? "it" : "them"}, or plan again.
          </Alert>
        ) : null}
        {state === "published" || state === "executed" ? (
          <p className="text-sm text-night-600">
            Published{page.plan?.publishedAt ? ` ${page.plan.publishedAt.slice(0, 16).replace("T", " ")} UTC` : ""}.
            After the night, mark each block executed or lost with a note: the hours owed follow. Re-planning the rest
            of the night makes it a draft to publish again.
          </p>
        ) : null}
        {report && (report.unplaced.length > 0 || report.warnings.length > 1) ? (
          <details className="rounded-lg bg-night-50 p-3 text-sm">
            <summary className="cursor-pointer font-medium">
              The planner's report: {report.unplaced.length} target{report.unplaced.length === 1 ? "" : "s"} without
              time, {report.warnings.length} note{report.warnings.length === 1 ? "" : "s"}
            </summary>
            <ul className="mt-2 list-disc space-y-1 pl-5">
              {report.unplaced.map((u) => (
                <li key={u.target}>
                  <strong>{u.target}</strong>: {u.reason}
                </li>
              ))}
              {report.warnings.map((w) => (
                <li key={w}>{w}</li>
              ))}
            </ul>
          </details>
        ) : null}
        {page.blocks.length > 0 && page.sky ? (
          <Timeline blocks={page.blocks} sky={page.sky} moon={page.moonCurve} />
        ) : (
          <p className="text-night-600">No blocks yet: plan automatically, or insert blocks one by one.</p>
        )}
        {page.blocks.length > 0 ? <PlanTable blocks={page.blocks} mode={mode} /> : null}
        {state === "draft" || state === "none" ? (
          <section aria-labelledby="insert-heading" className="space-y-2">
            <h3 id="insert-heading" className="font-semibold">
              Insert a block
            </h3>
            <InsertForm
              candidates={page.candidates}
              blocks={page.blocks}
              defaultLengthMin={page.settings?.scienceBlockMin ?? 40}
            />
          </section>
        ) : null}
        {page.plan && page.blocks.length > 0 ? (
          <section aria-labelledby="replan-heading" className="space-y-2">
            <h3 id="replan-heading" className="font-semibold">
              Re-plan the rest of the night
            </h3>
            <ReplanForm defaultFrom={page.replanFrom} />
          </section>
        ) : null}
      </div>
    </Card>
  );
}
