import { data, href, Link } from "react-router";
import * as v from "valibot";
import { CycleLinks } from "~/components/committee/CycleLinks";
import { StateBadge } from "~/components/committee/StateBadge";
import { ErrorPage } from "~/components/ErrorPage";
import { CycleImagingQueue } from "~/components/imaging/CycleImagingQueue";
import { Alert, Card, DetailList, PageHeader, TextField } from "~/components/ui";
import { ConfirmDialog } from "~/components/ui/ConfirmDialog";
import { dbContext } from "~/context";
import { requireFormBody } from "~/lib/body.server";
import { redirectWithFlash } from "~/lib/flash.server";
import { requirePermission } from "~/lib/guards.server";
import { cyclePage } from "~/services/cycles/page.server";
import { ReviewDeadline } from "~/services/cycles/schemas";
import { STATE_WORDS, TRANSITION_SPECS, TRANSITIONS } from "~/services/cycles/states";
import { transitionCycle } from "~/services/cycles/transitions.server";
import { CycleLog } from "./+shared/CycleLog";
import { DarknessCard } from "./+shared/DarknessCard";
import { cycleOfParam } from "./+shared/editor.server";
import type { Route } from "./+types/cycle";

const TransitionForm = v.object({
  intent: v.picklist(TRANSITIONS, "Unknown action."),
  confirm: v.literal("yes", "Confirm the change in the dialog."),
  reviewDeadline: ReviewDeadline,
});

export async function loader({ request, params, context }: Route.LoaderArgs) {
  await requirePermission(request, "cycles:manage");
  const db = context.get(dbContext);
  const stored = await cycleOfParam(db, params.cycleId);
  const { offers: _offers, ...cycle } = stored;
  return cyclePage(db, { cycle, now: new Date() });
}

export async function action({ request, params, context }: Route.ActionArgs) {
  const viewer = await requirePermission(request, "cycles:manage");
  const db = context.get(dbContext);
  const cycle = await cycleOfParam(db, params.cycleId);
  const form = await requireFormBody(request);
  const text = (k: string) => String(form.get(k) ?? "");
  const parsed = v.safeParse(TransitionForm, {
    intent: text("intent"),
    confirm: text("confirm"),
    reviewDeadline: text("reviewDeadline"),
  });
  if (!parsed.success) return data({ error: parsed.issues[0].message }, { status: 400 });
  const { intent, reviewDeadline } = parsed.output;
  if (intent === "reopen-scoring" && !reviewDeadline)
    return data({ error: "New review deadline: give a date and time (UTC)." }, { status: 400 });
  const result = await transitionCycle(db, {
    cycleId: cycle.id,
    transition: intent,
    actorId: viewer.user.id,
    newReviewDeadline: reviewDeadline || null,
  });
  if (!result.ok) return data({ error: result.refusal }, { status: 409 });
  const moved =
    intent === "start-review" ? ` ${result.moved} proposal${result.moved === 1 ? " is" : "s are"} under review.` : "";
  return redirectWithFlash(href("/cycles/:cycleId", { cycleId: String(cycle.id) }), {
    kind: "success",
    text: `${cycle.name}: ${TRANSITION_SPECS[intent].label.toLowerCase()} — done.${moved}`,
  });
}

export const meta: Route.MetaFunction = ({ data: d }) => [{ title: `${d?.cycle.name ?? "Cycle"} — Fringe Docket` }];

export default function CyclePage({ loaderData: d, actionData }: Route.ComponentProps) {
  const c = d.cycle;
  const id = String(c.id);
  const count = (s: string) => d.proposals[s] ?? 0;
  const submitted = ["submitted", "under_review", "accepted", "waitlisted", "declined", "scheduled"].reduce(
    (n, s) => n + count(s),
    0,
  );
  return (
    <>
      <PageHeader
        title={`Cycle ${c.name}`}
        lead={
          <>
            <StateBadge state={c.state} /> Nights {c.observingStart} → {c.observingEnd}. {c.description}
          </>
        }
        back={{ to: href("/cycles"), label: "All cycles" }}
        actions={<CycleLinks cycleId={id} pages={["edit", "assignments", "board"]} primary="board" />}
      />
      {actionData?.error ? <Alert className="mb-4">{actionData.error}</Alert> : null}
      <div className="grid grid-cols-[minmax(0,1fr)] gap-6 lg:grid-cols-2">
        <Card title="The season">
          <DetailList
            className="grid gap-3 sm:grid-cols-2"
            valueClassName="num font-medium"
            items={[
              { label: "Submission deadline", value: c.submissionDeadline },
              { label: "Review deadline", value: c.reviewDeadline ?? "not set" },
              { label: "Decision date", value: c.decisionDate ?? "not set" },
              { label: "Score scale", value: c.scale },
              { label: "Proposals submitted", value: submitted },
              { label: "Reviews submitted", value: `${d.reviews.submitted} of ${d.reviews.assigned} assigned` },
            ]}
          />
          <div className="mt-5 grid gap-3">
            {d.transitions.length === 0 ? (
              <p className="text-sm text-night-600">Decisions have been sent; the season of this cycle is over.</p>
            ) : null}
            {d.transitions.map((t) => (
              <div key={t.transition} className="flex flex-wrap items-center gap-3">
                <ConfirmDialog
                  label={t.label}
                  title={`${t.label}?`}
                  intent={t.transition}
                  confirmLabel={`Yes, ${t.label.toLowerCase()}`}
                  disabled={t.refusal !== null}
                  closeOn={actionData}
                  fields={
                    t.transition === "reopen-scoring" ? (
                      <TextField
                        label="New review deadline"
                        unit="UTC"
                        type="datetime-local"
                        name="reviewDeadline"
                        required
                      />
                    ) : undefined
                  }
                >
                  <p>{t.consequence}</p>
                  <p className="mt-2">
                    Cycle {c.name} will be “{STATE_WORDS[t.to]}”. This is written to the audit log.
                  </p>
                </ConfirmDialog>
                {t.refusal ? <span className="text-sm text-night-600">{t.refusal}</span> : null}
              </div>
            ))}
            {c.state === "deciding" ? (
              <p className="text-sm text-night-700">
                Decisions are recorded and released on the{" "}
                <Link className="text-ember-800 underline" to={href("/board/:cycleId", { cycleId: id })}>
                  Ranking board
                </Link>
                .
              </p>
            ) : null}
          </div>
        </Card>
        <Card title={`Committee (${d.committee.length})`}>
          {d.committee.length === 0 ? (
            <p className="text-sm text-night-600">No reviewer on the committee yet: add them in Edit.</p>
          ) : (
            <ul className="grid gap-1 text-sm">
              {d.committee.map((m) => (
                <li key={m.id}>
                  <span className="font-medium">{m.name}</span> <span className="text-night-600">{m.institute}</span>
                </li>
              ))}
            </ul>
          )}
        </Card>
      </div>
      <DarknessCard darkness={d.darkness} />
      <div className="mt-6">
        <CycleImagingQueue cycleId={Number(id)} cycleName={c.name} />
      </div>
      <CycleLog log={d.log} />
    </>
  );
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
