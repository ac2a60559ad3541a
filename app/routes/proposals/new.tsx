import { data, Form, href, useNavigation } from "react-router";
import * as v from "valibot";
import { ErrorPage } from "~/components/ErrorPage";
import { Button, ButtonLink, Card, EmptyState, FormErrors, PageHeader, SelectField, TextField } from "~/components/ui";
import { dbContext } from "~/context";
import { requireFormBody } from "~/lib/body.server";
import { redirectWithFlash } from "~/lib/flash.server";
import { fieldErrors } from "~/lib/form-errors";
import { formatUtc } from "~/lib/format";
import { requirePermission } from "~/lib/guards.server";
import { createProposal } from "~/services/proposals/commands.server";
import { ProposalRefusal } from "~/services/proposals/lock.server";
import { listOpenCycles } from "~/services/proposals/queries.server";
import { NewProposalSchema, PROPOSAL_LIMITS } from "~/services/proposals/schemas";
import { deadlineCountdown } from "~/services/proposals/words";
import type { Route } from "./+types/new";

export async function loader({ request, context }: Route.LoaderArgs) {
  await requirePermission(request, "proposals:own");
  const now = new Date();
  const cycles = await listOpenCycles(context.get(dbContext), { now });
  return {
    titleMax: PROPOSAL_LIMITS.titleMaxChars,
    cycles: cycles.map((c) => ({
      id: c.id,
      name: c.name,
      deadline: formatUtc(c.submissionDeadline),
      countdown: deadlineCountdown(c.submissionDeadline, now),
      observing: `${c.observingStart} to ${c.observingEnd}`,
    })),
  };
}

export async function action({ request, context }: Route.ActionArgs) {
  const viewer = await requirePermission(request, "proposals:own");
  const form = await requireFormBody(request);
  const values = { cycleId: String(form.get("cycleId") ?? ""), title: String(form.get("title") ?? "") };
  const parsed = v.safeParse(NewProposalSchema, values);
  if (!parsed.success) return data({ values, errors: fieldErrors(parsed.issues, { depth: 1 }) }, { status: 400 });
  try {
    const row = await createProposal(context.get(dbContext), { viewer, input: parsed.output });
    return redirectWithFlash(href("/proposals/:proposalId", { proposalId: String(row.id) }), {
      kind: "success",
      text: "Draft created. It saves as you type; submit it before the deadline.",
    });
  } catch (e) {
    if (e instanceof ProposalRefusal)
      return data({ values, errors: { [e.field ?? "form"]: e.message } }, { status: e.status });
    throw e;
  }
}

export const meta: Route.MetaFunction = () => [{ title: "New proposal — Fringe Docket" }];

export default function NewProposal({ loaderData, actionData }: Route.ComponentProps) {
  const navigation = useNavigation();
  const errors: Record<string, string | undefined> = actionData?.errors ?? {};
  const values = actionData?.values;
  if (loaderData.cycles.length === 0) {
    return (
      <>
        <PageHeader title="New proposal" />
        <EmptyState
          title="No cycle is open for proposals"
          action={
            <ButtonLink to={href("/proposals")} variant="secondary">
              Back to my proposals
            </ButtonLink>
          }
        >
          A new proposal belongs to a cycle whose submission deadline is still ahead.
        </EmptyState>
      </>
    );
  }
  return (
    <>
      <PageHeader
        title="New proposal"
        lead="Choose the cycle and give the proposal a working title. Everything else is filled in on the next page."
      />
      <Card className="max-w-2xl">
        <Form method="post" className="grid gap-4" noValidate>
          <FormErrors errors={errors.form ? [errors.form] : undefined} />
          <SelectField
            label="Cycle"
            name="cycleId"
            defaultValue={values?.cycleId ?? String(loaderData.cycles[0].id)}
            error={errors.cycleId}
            hint="The cycle cannot be changed once the proposal exists."
          >
            {loaderData.cycles.map((c) => (
              <option key={c.id} value={c.id}>
                {c.name} — observing {c.observing}; deadline {c.deadline} ({c.countdown})
              </option>
            ))}
          </SelectField>
          <TextField
            label="Title"
            name="title"
            defaultValue={values?.title ?? ""}
            error={errors.title}
            maxLength={loaderData.titleMax}
            required
          />
          <div className="flex gap-3">
            <Button type="submit" disabled={navigation.state === "submitting"}>
              Create the draft
            </Button>
            <ButtonLink to={href("/proposals")} variant="ghost">
              Cancel
            </ButtonLink>
          </div>
        </Form>
      </Card>
    </>
  );
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
