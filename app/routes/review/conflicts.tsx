import { data, Form, href } from "react-router";
import * as v from "valibot";
import { StateBadge } from "~/components/committee/StateBadge";
import { ErrorPage } from "~/components/ErrorPage";
import { Alert, Badge, Button, Card, IntentButton, PageHeader, TextArea } from "~/components/ui";
import { dbContext } from "~/context";
import { requireFormBody } from "~/lib/body.server";
import { redirectWithFlash } from "~/lib/flash.server";
import { fieldErrors } from "~/lib/form-errors";
import { requirePermission } from "~/lib/guards.server";
import { notFound, toId } from "~/lib/not-found";
import {
  CONFLICT_STATES,
  conflictList,
  cycleForMember,
  declareConflict,
  withdrawConflict,
} from "~/services/committee/desk.server";
import { ConflictFormSchema, REASON_MAX_CHARS, WholeNumber } from "~/services/committee/schemas";
import type { Route } from "./+types/conflicts";

const NOT_YOURS = "You sit on no committee of a cycle with this number.";

/** The cycle of the address, for a member of its committee; the 404 page for anyone else. */
async function memberCycle(db: Parameters<typeof cycleForMember>[0], raw: string | undefined, userId: number) {
  const cycleId = toId(raw);
  const cycle = cycleId === null ? null : await cycleForMember(db, { cycleId, userId });
  if (!cycle) notFound(NOT_YOURS);
  return cycle;
}

export async function loader({ request, params, context }: Route.LoaderArgs) {
  const viewer = await requirePermission(request, "review:desk");
  const db = context.get(dbContext);
  const cycle = await memberCycle(db, params.cycleId, viewer.user.id);
  const list = await conflictList(db, { cycleId: cycle.id, member: viewer.user });
  return {
    cycle: { id: cycle.id, name: cycle.name, state: cycle.state },
    editable: CONFLICT_STATES.has(cycle.state),
    proposals: list,
  };
}

export async function action({ request, params, context }: Route.ActionArgs) {
  const viewer = await requirePermission(request, "review:desk");
  const db = context.get(dbContext);
  const cycle = await memberCycle(db, params.cycleId, viewer.user.id);
  const form = await requireFormBody(request);
  const intent = String(form.get("intent") ?? "");
  const here = href("/review/cycles/:cycleId/conflicts", { cycleId: String(cycle.id) });
  if (intent === "declare") {
    const parsed = v.safeParse(ConflictFormSchema, {
      proposalId: String(form.get("proposalId") ?? ""),
      reason: String(form.get("reason") ?? ""),
    });
    if (!parsed.success) {
      const proposalId = String(form.get("proposalId") ?? "");
      return data(
        { proposalId, errors: fieldErrors(parsed.issues), reason: String(form.get("reason") ?? "") },
        { status: 400 },
      );
    }
    const result = await declareConflict(db, { cycleId: cycle.id, reviewerId: viewer.user.id, ...parsed.output });
    if (!result.ok)
      return data(
        {
          proposalId: String(parsed.output.proposalId),
          errors: { reason: result.message },
          reason: parsed.output.reason,
        },
        { status: 409 },
      );
    return redirectWithFlash(here, {
      kind: "success",
      text: result.declined
        ? "Conflict declared; your assignment to it is declined and the chair will ask someone else."
        : "Conflict declared; you will not be given this proposal.",
    });
  }
  if (intent === "withdraw") {
    const id = v.safeParse(WholeNumber("Proposal", 1, 2_147_483_647), String(form.get("proposalId") ?? ""));
    if (!id.success)
      return data({ proposalId: "", errors: { reason: id.issues[0].message }, reason: "" }, { status: 400 });
    const result = await withdrawConflict(db, { cycleId: cycle.id, proposalId: id.output, reviewerId: viewer.user.id });
    if (!result.ok)
      return data({ proposalId: String(id.output), errors: { reason: result.message }, reason: "" }, { status: 409 });
    return redirectWithFlash(here, { kind: "success", text: "Declaration withdrawn." });
  }
  return data({ proposalId: "", errors: { reason: "Unknown action." }, reason: "" }, { status: 400 });
}

export const meta: Route.MetaFunction = ({ data: d }) => [
  { title: `Conflicts — ${d?.cycle.name ?? "Cycle"} — Fringe Docket` },
];

export default function Conflicts({ loaderData: d, actionData }: Route.ComponentProps) {
  return (
    <>
      <PageHeader
        title={`Conflicts — ${d.cycle.name}`}
        lead={
          <>
            <StateBadge state={d.cycle.state} /> Every submitted proposal of the cycle, by title and abstract. Declare a
            conflict of interest with a reason; conflicts with your own team and institute are found automatically.
          </>
        }
        back={{ to: href("/review"), label: "Back to the Review desk" }}
      />
      {!d.editable ? (
        <Alert tone="info" className="mb-4">
          The review is closed: conflicts can no longer change.
        </Alert>
      ) : null}
      <ul className="grid gap-4">
        {d.proposals.map((p) => {
          const mine = actionData && actionData.proposalId === String(p.id) ? actionData : null;
          return (
            <li key={p.id}>
              <Card title={p.title}>
                <p className="mb-2 text-sm text-night-600">{p.category}</p>
                <p className="mb-3 whitespace-pre-wrap text-sm text-night-900">{p.abstract || "—"}</p>
                <div className="flex flex-wrap items-center gap-2">
                  {p.conflict ? (
                    <Badge tone="danger">Conflict: {p.conflict}</Badge>
                  ) : (
                    <Badge tone="ok">No conflict</Badge>
                  )}
                  {p.assignment ? <Badge tone="info">assigned to you ({p.assignment})</Badge> : null}
                </div>
                {d.editable && p.declared ? (
                  <IntentButton
                    intent="withdraw"
                    hidden={{ proposalId: p.id }}
                    label={`Withdraw the conflict on ${p.title}`}
                    className="mt-3"
                  >
                    Withdraw the declaration
                  </IntentButton>
                ) : null}
                {d.editable && !p.declared && !p.automatic ? (
                  <Form method="post" className="mt-3 grid gap-2" aria-label={`Declare a conflict on ${p.title}`}>
                    <input type="hidden" name="intent" value="declare" />
                    <input type="hidden" name="proposalId" value={p.id} />
                    <TextArea
                      label="Reason for a conflict"
                      name="reason"
                      maxLength={REASON_MAX_CHARS}
                      defaultValue={mine?.reason ?? ""}
                      error={mine?.errors.reason}
                      hint="E.g. a close collaborator, a competing programme. The chair sees it; other reviewers do not."
                      className="min-h-16"
                    />
                    <div>
                      <Button type="submit" size="sm" variant="secondary">
                        Declare a conflict
                      </Button>
                    </div>
                  </Form>
                ) : null}
              </Card>
            </li>
          );
        })}
      </ul>
    </>
  );
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
