import { href } from "react-router";
import { CycleTitle } from "~/components/committee/StateBadge";
import { ErrorPage } from "~/components/ErrorPage";
import { Badge, type BadgeTone, ButtonLink, Card, EmptyState, PageHeader } from "~/components/ui";
import { dbContext } from "~/context";
import { formatUtc } from "~/lib/format";
import { requirePermission } from "~/lib/guards.server";
import { type CyclePhase, cyclePhase, listCycles } from "~/services/cycles/cycles.server";
import type { Route } from "./+types/index";

export async function loader({ request, context }: Route.LoaderArgs) {
  const viewer = await requirePermission(request, "cycles:read");
  const list = await listCycles(context.get(dbContext));
  const now = new Date();
  return {
    canManage: viewer.permissions.has("cycles:manage"),
    cycles: list.map((c) => ({
      id: c.id,
      name: c.name,
      description: c.description,
      observingStart: c.observingStart,
      observingEnd: c.observingEnd,
      submissionDeadline: c.submissionDeadline.toISOString(),
      reviewDeadline: c.reviewDeadline?.toISOString() ?? null,
      state: c.state,
      phase: cyclePhase(c, now),
      offers: c.offers.map((o) => ({ name: o.name, nightsAvailable: o.nightsAvailable })),
    })),
  };
}

export const meta: Route.MetaFunction = () => [{ title: "Cycles — Fringe Docket" }];

const phaseTone: Record<CyclePhase, BadgeTone> = {
  open: "ok",
  "in review": "info",
  observing: "accent",
  finished: "neutral",
};

export default function Cycles({ loaderData }: Route.ComponentProps) {
  return (
    <>
      <PageHeader
        title="Cycles"
        lead="Each observing cycle has a submission deadline and the configurations it offers, with the nights each will be on the array."
        actions={loaderData.canManage ? <ButtonLink to={href("/cycles/new")}>New cycle</ButtonLink> : null}
      />
      {loaderData.cycles.length === 0 ? (
        <EmptyState title="No cycles yet">The chair opens a cycle with its dates and deadline.</EmptyState>
      ) : (
        <div className="grid gap-4">
          {loaderData.cycles.map((c) => (
            <Card
              key={c.id}
              title={
                <CycleTitle
                  name={c.name}
                  state={c.state}
                  to={loaderData.canManage ? href("/cycles/:cycleId", { cycleId: String(c.id) }) : undefined}
                >
                  <Badge tone={phaseTone[c.phase]}>{c.phase}</Badge>
                </CycleTitle>
              }
              actions={
                loaderData.canManage ? (
                  <ButtonLink
                    to={href("/cycles/:cycleId/edit", { cycleId: String(c.id) })}
                    variant="secondary"
                    size="sm"
                    aria-label={`Edit cycle ${c.name}`}
                  >
                    Edit
                  </ButtonLink>
                ) : null
              }
            >
              {c.description ? <p className="mb-3 text-night-700">{c.description}</p> : null}
              <dl className="grid gap-3 sm:grid-cols-4">
                <div>
                  <dt className="text-sm text-night-600">Nights</dt>
                  <dd className="num font-medium">
                    {c.observingStart} → {c.observingEnd}
                  </dd>
                </div>
                <div>
                  <dt className="text-sm text-night-600">Submission deadline</dt>
                  <dd className="num font-medium">{formatUtc(new Date(c.submissionDeadline))}</dd>
                </div>
                <div>
                  <dt className="text-sm text-night-600">Review deadline</dt>
                  <dd className="num font-medium">{c.reviewDeadline ? formatUtc(new Date(c.reviewDeadline)) : "—"}</dd>
                </div>
                <div>
                  <dt className="text-sm text-night-600">Configurations on offer</dt>
                  <dd className="font-medium">
                    {c.offers
                      .map((o) => `${o.name}${o.nightsAvailable != null ? ` (${o.nightsAvailable} nights)` : ""}`)
                      .join(", ") || "—"}
                  </dd>
                </div>
              </dl>
            </Card>
          ))}
        </div>
      )}
    </>
  );
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
