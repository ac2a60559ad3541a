import { data, Form, useNavigation } from "react-router";
import * as v from "valibot";
import { ErrorPage } from "~/components/ErrorPage";
import { Button, ButtonLink, Card, EmptyState, FormErrors, PageHeader, SelectField, TextField } from "~/components/ui";
import { database } from "~/db/client.server";
import { redirectWithFlash } from "~/lib/flash.server";
import { requirePermission } from "~/lib/guards.server";
import { openCycles } from "~/services/cycles/cycles.server";
import {
  createProposal,
  deadlineCountdown,
  formatUtc,
  PROPOSAL_LIMITS,
  ProposalRefusal,
} from "~/services/proposals/proposals.server";
import type { Route } from "./+types/new";

const NewProposalSchema = v.object({
  cycleId: v.pipe(
    v.string("Cycle: choose one of the open cycles."),
    v.regex(/^\d{1,9}$/, "Cycle: choose one of the open cycles."),
    v.transform(Number),
  ),
  title: v.pipe(
    v.string("Title: write a title."),
    v.trim(),
    v.nonEmpty("Title: write a title (it can change later)."),
    v.regex(/^[^\r\n\t]*$/, "Title: must be a single line."),
    v.maxLength(PROPOSAL_LIMITS.titleMaxChars, `Title: at most ${PROPOSAL_LIMITS.titleMaxChars} characters.`),
  ),
});

export async function loader({ request }: Route.LoaderArgs) {
  await requirePermission(request, "proposals:own");
  const now = new Date();
  const cycles = await openCycles(database(), now);
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

export async function action({ request }: Route.ActionArgs) {
  const viewer = await requirePermission(request, "proposals:own");
  const form = await request.formData();
  const values = { cycleId: String(form.get("cycleId") ?? ""), title: String(form.get("title") ?? "") };
  const parsed = v.safeParse(NewProposalSchema, values);
  if (!parsed.success) {
    const errors: Record<string, string> = {};
    for (const issue of parsed.issues) {
      const key = String(issue.path?.[0]?.key ?? "form");
      errors[key] ??= issue.message;
    }
    return data({ values, errors }, { status: 400 });
  }
  try {
    const row = await createProposal(database(), viewer, parsed.output);
    return redirectWithFlash(`/proposals/${row.id}`, {
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
            <ButtonLink to="/proposals" variant="secondary">
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
            <ButtonLink to="/proposals" variant="ghost">
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
