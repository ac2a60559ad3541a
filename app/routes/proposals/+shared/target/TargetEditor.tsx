/** The page of a proposal's target, new or existing: the target and model, constraints, calibrators, notes. */
import { Form, href, useNavigation } from "react-router";
import { ImagingPreview } from "~/components/imaging/ImagingPreview";
import { rankedForText, triangleText } from "~/components/targets/closure-triangle";
import { TargetFields } from "~/components/targets/TargetForm";
import { Button, ButtonLink, Card, FormErrors, PageHeader, TextArea } from "~/components/ui";
import type { ClosureTriangleJson } from "~/db/schema/proposals";
import type { TargetFormState } from "~/services/proposals/target-form.server";
import { BackToProposal } from "../BackToProposal";
import { bind } from "../bind";
import { CalibratorsCard } from "./CalibratorsCard";
import { ConstraintsCard } from "./ConstraintsCard";

export type TargetEditorPage = TargetFormState & {
  proposalId: number;
  proposalTitle: string;
  targetId: number | null;
  name: string;
  /** The stored model in words (an existing target). */
  model: string | null;
  /** The closure triangle chosen in the Triangle finder, if any. */
  closureTriangle: ClosureTriangleJson | null;
  editable: boolean;
  bands: string[];
  siteMinElevationDeg: number;
  limits: { windowsMax: number; calibratorsMax: number };
};

export function TargetEditor({
  page,
  answer,
}: {
  page: TargetEditorPage;
  answer?: TargetFormState & { errors: Record<string, string> };
}) {
  const values = answer?.values ?? page.values;
  const errors: Record<string, string> = answer?.errors ?? {};
  const busy = useNavigation().state === "submitting";
  const back = href("/proposals/:proposalId", { proposalId: String(page.proposalId) });
  const readOnly = !page.editable;
  return (
    <>
      <PageHeader
        title={page.targetId === null ? "New target" : page.name}
        lead={<>Target of “{page.proposalTitle || "untitled proposal"}”. Coordinates are J2000; times are UTC.</>}
        actions={<BackToProposal proposalId={page.proposalId} />}
      />
      {readOnly ? (
        <p className="mb-4 rounded-lg bg-info-50 p-3 text-sm text-info-700 ring-1 ring-info-700/20">
          The proposal is read-only; this is how the target stands.
        </p>
      ) : null}
      <Form method="post" noValidate className="grid gap-6" aria-label="Target">
        <FormErrors errors={Object.values(errors)} />
        <fieldset disabled={readOnly} className="grid gap-6">
          <Card title="Target and model">
            <div className="grid gap-4">
              <TargetFields values={values} errors={errors} bands={page.bands} />
            </div>
          </Card>
          <ConstraintsCard
            minElevationDeg={values.minElevationDeg ?? ""}
            siteMinElevationDeg={page.siteMinElevationDeg}
            windows={answer?.windows ?? page.windows}
            windowsMax={page.limits.windowsMax}
            errors={errors}
          />
          <CalibratorsCard
            calibrators={answer?.calibrators ?? page.calibrators}
            calibratorsMax={page.limits.calibratorsMax}
            errors={errors}
            shortlistTo={
              page.targetId === null
                ? undefined
                : href("/catalogue/proposals/:proposalId/targets/:targetId/calibrators", {
                    proposalId: String(page.proposalId),
                    targetId: String(page.targetId),
                  })
            }
          />
          <Card title="Notes">
            <TextArea
              label="Notes for the committee and the night planners"
              {...bind("notes", values, errors)}
              maxLength={1000}
              className="min-h-20"
            />
          </Card>
        </fieldset>
        {readOnly ? null : (
          <div className="flex gap-3">
            <Button type="submit" disabled={busy}>
              {busy ? "Saving…" : page.targetId === null ? "Add the target" : "Save the target"}
            </Button>
            <ButtonLink to={back} variant="ghost">
              Cancel
            </ButtonLink>
          </div>
        )}
      </Form>
      {page.model ? <p className="mt-4 text-sm text-night-600">Stored model: {page.model}.</p> : null}
      {page.closureTriangle ? (
        <p className="mt-2 text-sm text-night-700">
          <span className="font-medium">Closure triangle: {triangleText(page.closureTriangle)}</span> (
          {rankedForText(page.closureTriangle)}; chosen in the Triangle finder).
        </p>
      ) : null}
      {page.targetId !== null ? (
        <div className="mt-6">
          <ImagingPreview
            source={{ kind: "proposalTarget", proposalId: page.proposalId, targetId: page.targetId }}
            intro="Simulates what the proposal's coverage would measure of this target (the requested configuration with the most stations, the proposal's band, the middle night of the cycle), then reconstructs an image from it. The committee sees the previews you make here."
          />
        </div>
      ) : null}
    </>
  );
}
