import { href, Link } from "react-router";
import { CycleTitle } from "~/components/committee/StateBadge";
import { ErrorPage } from "~/components/ErrorPage";
import { Badge, ButtonLink, Card, EmptyState, PageHeader } from "~/components/ui";
import { dbContext } from "~/context";
import { formatUtc } from "~/lib/format";
import { requirePermission } from "~/lib/guards.server";
import { isChair } from "~/services/committee/access.server";
import { myDesk } from "~/services/committee/desk.server";
import { scaleText } from "~/services/committee/scale";
import type { Route } from "./+types/index";

export async function loader({ request, context }: Route.LoaderArgs) {
  const viewer = await requirePermission(request, "review:desk");
  const now = new Date();
  const seats = await myDesk(context.get(dbContext), { userId: viewer.user.id });
  return {
    chair: isChair(viewer),
    seats: seats.map(({ cycle, assignments }) => {
      const active = assignments.filter((a) => a.status === "active");
      const due = cycle.reviewDeadline;
      const daysLeft = due ? Math.ceil((due.getTime() - now.getTime()) / 86_400_000) : null;
      return {
        cycle: {
          id: cycle.id,
          name: cycle.name,
          state: cycle.state,
          reviewDeadline: due ? formatUtc(due) : null,
          daysLeft,
          scale: scaleText({ best: cycle.scoreBest, worst: cycle.scoreWorst }),
        },
        submitted: active.filter((a) => a.progress === "submitted").length,
        total: active.length,
        assignments: assignments.map((a) => ({ ...a, savedAt: a.savedAt ? formatUtc(a.savedAt) : null })),
      };
    }),
  };
}

export const meta: Route.MetaFunction = () => [{ title: "Review desk — Fringe Docket" }];

const PROGRESS_TONE = { "not started": "neutral", draft: "caution", submitted: "ok" } as const;

function due(daysLeft: number | null, state: string) {
  if (daysLeft === null || state !== "reviewing") return "";
  if (daysLeft < 0) return " (passed)";
  if (daysLeft === 0) return " (today)";
  return ` (${daysLeft} day${daysLeft === 1 ? "" : "s"} left)`;
}

export default function ReviewDesk({ loaderData: d }: Route.ComponentProps) {
  return (
    <>
      <PageHeader
        title="Review desk"
        lead="The proposals you review, by cycle, with the review deadline. Scores and comments save as drafts until you submit them; other reviewers never see your name."
        actions={
          d.chair ? (
            <ButtonLink to={href("/board")} variant="secondary">
              Ranking board
            </ButtonLink>
          ) : null
        }
      />
      {d.seats.length === 0 ? (
        <EmptyState title="You sit on no committee yet">
          The chair puts reviewers on a cycle's committee; your assignments appear here.
        </EmptyState>
      ) : null}
      <div className="page-stack">
        {d.seats.map((s) => (
          <Card
            key={s.cycle.id}
            title={<CycleTitle name={`Cycle ${s.cycle.name}`} state={s.cycle.state} />}
            actions={
              s.cycle.state === "open" || s.cycle.state === "reviewing" ? (
                <ButtonLink
                  to={href("/review/cycles/:cycleId/conflicts", { cycleId: String(s.cycle.id) })}
                  variant="secondary"
                  size="sm"
                >
                  Declare conflicts
                </ButtonLink>
              ) : null
            }
          >
            <p className="mb-3 text-sm text-night-700">
              Review deadline:{" "}
              <span className="num font-medium">
                {s.cycle.reviewDeadline ?? "not set yet"}
                {due(s.cycle.daysLeft, s.cycle.state)}
              </span>{" "}
              · Scale {s.cycle.scale} ·{" "}
              <span className="font-medium">
                {s.submitted} of {s.total} submitted
              </span>
            </p>
            {s.total > 0 ? (
              <div
                className="mb-3 h-2 w-full overflow-hidden rounded-full bg-night-100"
                role="progressbar"
                aria-label={`Reviews submitted in ${s.cycle.name}`}
                aria-valuemin={0}
                aria-valuemax={s.total}
                aria-valuenow={s.submitted}
              >
                <div className="h-full bg-ok-700" style={{ width: `${(100 * s.submitted) / s.total}%` }} />
              </div>
            ) : null}
            {s.assignments.length === 0 ? (
              <p className="text-sm text-night-600">No assignment yet in this cycle.</p>
            ) : (
              <ul className="divide-y divide-night-100">
                {s.assignments.map((a) => (
                  <li key={a.id} className="flex flex-wrap items-center gap-2 py-2">
                    {a.status === "active" ? (
                      <Link
                        to={href("/review/proposals/:proposalId", { proposalId: String(a.proposalId) })}
                        className="font-medium text-ember-800 underline"
                      >
                        {a.title}
                      </Link>
                    ) : (
                      <span className="font-medium text-night-700">{a.title}</span>
                    )}
                    <span className="text-sm text-night-600">{a.category}</span>
                    {a.status === "declined" ? (
                      <Badge tone="danger">declined: {a.declineReason}</Badge>
                    ) : (
                      <Badge tone={PROGRESS_TONE[a.progress]}>
                        {a.progress}
                        {a.score !== null ? ` · score ${a.score}` : ""}
                      </Badge>
                    )}
                    {a.savedAt ? <span className="num text-xs text-night-500">saved {a.savedAt}</span> : null}
                  </li>
                ))}
              </ul>
            )}
          </Card>
        ))}
      </div>
    </>
  );
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
