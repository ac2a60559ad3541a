/**
 * The Calibrator shortlist of one of a proposal's targets, with the proposal's band, configuration and
 * cycle as defaults, and "Add as calibrator" on an editable draft.
 */
import { data, Form, href, useLocation, useNavigation } from "react-router";
import { ErrorPage } from "~/components/ErrorPage";
import { Alert, Badge, Button, PageHeader } from "~/components/ui";
import { dbContext } from "~/context";
import type { CalibratorEntry } from "~/engine";
import { requireFormBody } from "~/lib/body.server";
import { formatDeclination, formatRightAscension } from "~/lib/coordinates";
import { redirectWithFlash } from "~/lib/flash.server";
import { requirePermission } from "~/lib/guards.server";
import {
  addShortlistedCalibrator,
  openProposalTarget,
  proposalTargetShortlist,
} from "~/services/catalogue/proposal.server";
import { readAddCalibrator } from "~/services/catalogue/schemas";
import { SettingsForm } from "./+shared/SettingsForm";
import { ShortlistResult } from "./+shared/ShortlistResult";
import type { Route } from "./+types/proposal-shortlist";

export async function loader({ request, url, params, context }: Route.LoaderArgs) {
  const viewer = await requirePermission(request, "proposals:own");
  const page = await proposalTargetShortlist(context.get(dbContext), {
    viewer,
    proposalId: params.proposalId,
    targetId: params.targetId,
    params: url.searchParams,
  });
  return data(page, { status: Object.keys(page.run.errors).length ? 400 : 200 });
}

/** "Add as calibrator": the star's number; back to the same shortlist with a message. */
export async function action({ request, url, params, context }: Route.ActionArgs) {
  const viewer = await requirePermission(request, "proposals:own");
  const db = context.get(dbContext);
  // Someone off the proposal's team gets the 404 before anything they sent is read.
  const opened = await openProposalTarget(db, { viewer, proposalId: params.proposalId, targetId: params.targetId });
  const picked = readAddCalibrator(await requireFormBody(request));
  if (!picked.ok) return data({ error: picked.message }, { status: 400 });
  const done = await addShortlistedCalibrator(db, { opened, hip: picked.hip, params: url.searchParams });
  if (!done.ok) return data({ error: done.message }, { status: done.status });
  return redirectWithFlash(`${url.pathname}${url.search}`, { kind: "success", text: done.text });
}

export const meta: Route.MetaFunction = ({ data: d }) => [
  { title: `Calibrators for ${d?.target.name ?? "a target"} — Fringe Docket` },
];

function AddButton({ entry, added, full }: { entry: CalibratorEntry; added: boolean; full: boolean }) {
  const location = useLocation();
  const navigation = useNavigation();
  const busy = navigation.state === "submitting" && navigation.formData?.get("hip") === String(entry.hip);
  if (added) return <Badge tone="ok">A calibrator</Badge>;
  return (
    <Form method="post" action={`${location.pathname}${location.search}`}>
      <input type="hidden" name="hip" value={entry.hip} />
      <Button
        type="submit"
        size="sm"
        variant="secondary"
        disabled={busy || full}
        className="whitespace-nowrap"
        aria-label={`Add ${entry.name} as calibrator`}
      >
        {busy ? "Adding…" : "Add as calibrator"}
      </Button>
    </Form>
  );
}

export default function ProposalShortlist({ loaderData, actionData }: Route.ComponentProps) {
  const page = loaderData;
  const back = href("/proposals/:proposalId/targets/:targetId", {
    proposalId: String(page.proposal.id),
    targetId: String(page.target.id),
  });
  const full = page.target.calibrators >= page.calibratorsMax;
  const fixed = (
    <p className="text-sm text-night-700">
      Target <span className="font-semibold text-night-900">{page.target.name}</span> at RA{" "}
      {formatRightAscension(page.target.raDeg, 1)}, Dec {formatDeclination(page.target.decDeg, 0)} (J2000); it has{" "}
      {page.target.calibrators} of at most {page.calibratorsMax} calibrators.
    </p>
  );
  return (
    <>
      <PageHeader
        title={`Calibrators for ${page.target.name}`}
        lead={<>Target of “{page.proposal.title || "untitled proposal"}”. Defaults come from the proposal.</>}
        back={{ to: back, label: "Back to the target" }}
      />
      <div className="grid grid-cols-1 gap-6">
        {actionData?.error ? <Alert>{actionData.error}</Alert> : null}
        {!page.editable ? (
          <Alert tone="info">{page.lockedBecause ?? "The proposal is read-only"}: calibrators cannot be added.</Alert>
        ) : full ? (
          <Alert tone="caution">The target has {page.calibratorsMax} calibrators, the most it may have.</Alert>
        ) : null}
        <SettingsForm
          values={page.values}
          errors={page.run.errors}
          choices={page.choices}
          withTarget={false}
          fixedTarget={fixed}
        />
        <ShortlistResult
          run={page.run}
          exportName={`calibrators-${page.target.name.replace(/[^\p{L}\p{N}]+/gu, "-")}`}
          action={
            page.editable
              ? {
                  header: "Proposal",
                  cell: (c) => <AddButton entry={c} added={page.added.includes(c.hip)} full={full} />,
                }
              : undefined
          }
        />
      </div>
    </>
  );
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
