import { href } from "react-router";
import { CycleTitle } from "~/components/committee/StateBadge";
import { ErrorPage } from "~/components/ErrorPage";
import { Card, EmptyState, PageHeader } from "~/components/ui";
import { dbContext } from "~/context";
import { requirePermission } from "~/lib/guards.server";
import { boardCycles } from "~/services/committee/board-page.server";
import type { Route } from "./+types/index";

export async function loader({ request, context }: Route.LoaderArgs) {
  await requirePermission(request, "ranking:board");
  return { cycles: await boardCycles(context.get(dbContext)) };
}

export const meta: Route.MetaFunction = () => [{ title: "Ranking board — Fringe Docket" }];

export default function Boards({ loaderData }: Route.ComponentProps) {
  return (
    <>
      <PageHeader
        title="Ranking board"
        lead="One board per cycle: scores and ranking, demand and LST pressure, the suggested allocation and the decisions."
      />
      {loaderData.cycles.length === 0 ? <EmptyState title="No cycle yet" /> : null}
      <div className="grid gap-4 md:grid-cols-2">
        {loaderData.cycles.map((c) => (
          <Card
            key={c.id}
            title={<CycleTitle name={c.name} state={c.state} to={href("/board/:cycleId", { cycleId: String(c.id) })} />}
          >
            <p className="text-sm text-night-700">
              Nights {c.observingStart} → {c.observingEnd} · {c.proposals} proposal{c.proposals === 1 ? "" : "s"}{" "}
              submitted · review deadline <span className="num">{c.reviewDeadline ?? "not set"}</span> · decisions{" "}
              {c.decisionDate ?? "not dated"}
            </p>
          </Card>
        ))}
      </div>
    </>
  );
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
