/** The proposal's targets in order, with links to edit them, and the copy from "My targets". */

import { Form, href, Link } from "react-router";
import { Coordinates } from "~/components/targets/Coordinates";
import { Button, ButtonLink, Card, SelectField } from "~/components/ui";
import type { TargetSummary } from "~/services/proposals/target-summary";
import { Choices } from "../Choices";
import { IntentButton, RemoveButton } from "./IntentButton";
import type { ActionResult } from "./result";

type TargetLine = TargetSummary & { id: number; windows: number };

export type TargetsCardProps = {
  proposalId: number;
  targets: TargetLine[];
  /** The viewer's own targets; `added` when the proposal has it already (copied, or one of that name). */
  myTargets: { id: number; name: string; added: boolean }[];
  editable: boolean;
  result?: ActionResult;
};

const targetHref = (proposalId: number, targetId: number | "new") =>
  href("/proposals/:proposalId/targets/:targetId", { proposalId: String(proposalId), targetId: String(targetId) });

function TargetItem({
  target: t,
  at,
  last,
  proposalId,
  editable,
}: {
  target: TargetLine;
  at: number;
  last: boolean;
  proposalId: number;
  editable: boolean;
}) {
  const move = (direction: "up" | "down") => (
    <IntentButton
      intent="move-target"
      fields={{ targetId: t.id, direction }}
      size="sm"
      variant="ghost"
      disabled={direction === "up" ? at === 0 : last}
      aria-label={`Move ${t.name} ${direction}`}
    >
      {direction === "up" ? "↑" : "↓"}
    </IntentButton>
  );
  return (
    <li className="flex flex-col gap-2 p-3 sm:flex-row sm:items-start sm:gap-3">
      <div className="min-w-0 flex-1">
        <p className="font-semibold text-night-900">
          <span className="num mr-2 font-normal text-night-500">{at + 1}.</span>
          {t.name}
        </p>
        <p className="num text-sm text-night-700">
          <Coordinates raDeg={t.raDeg} decDeg={t.decDeg} /> · {t.model} · {t.magnitudes}
        </p>
        <p className="text-sm text-night-600">
          {t.minElevationDeg === null ? "the array's elevation limit" : `elevation ≥ ${t.minElevationDeg}°`} ·{" "}
          {t.windows} time window{t.windows === 1 ? "" : "s"} ·{" "}
          {t.calibrators.length ? `calibrators ${t.calibrators.join(", ")}` : "no calibrator yet"}
        </p>
      </div>
      <div className="flex flex-wrap gap-1">
        <ButtonLink
          to={targetHref(proposalId, t.id)}
          size="sm"
          variant="secondary"
          aria-label={`${editable ? "Edit" : "View"} ${t.name}`}
        >
          {editable ? "Edit" : "View"}
        </ButtonLink>
        {editable ? (
          <>
            {move("up")}
            {move("down")}
            <RemoveButton intent="remove-target" fields={{ targetId: t.id }} what={t.name} />
          </>
        ) : null}
      </div>
    </li>
  );
}

function CopyFromMine({ myTargets, result }: Pick<TargetsCardProps, "myTargets" | "result">) {
  const none = myTargets.length === 0;
  const left = myTargets.filter((t) => !t.added).length;
  return (
    <Form method="post" className="mt-4 flex flex-wrap items-end gap-3" aria-label="Copy from my targets">
      <input type="hidden" name="intent" value="add-my-target" />
      <div className="min-w-56 flex-1">
        <SelectField
          label="From my targets"
          name="myTargetId"
          defaultValue={result?.values?.myTargetId ?? ""}
          error={result?.errors.myTargetId}
          disabled={none || left === 0}
          hint={
            !none && left === 0 ? (
              "Every one of your targets is already on the proposal."
            ) : none ? (
              <>
                Your list is empty; targets you keep under{" "}
                <Link className="underline" to={href("/targets")}>
                  My targets
                </Link>{" "}
                show here.
              </>
            ) : undefined
          }
        >
          <Choices
            items={myTargets.map((t) => ({
              value: t.id,
              label: t.added ? `${t.name} (already added)` : t.name,
              disabled: t.added,
            }))}
          />
        </SelectField>
      </div>
      <Button type="submit" variant="secondary" disabled={none || left === 0}>
        Copy into the proposal
      </Button>
    </Form>
  );
}

export function TargetsCard({ proposalId, targets, myTargets, editable, result }: TargetsCardProps) {
  return (
    <Card
      title={`Targets (${targets.length})`}
      actions={
        editable ? (
          <ButtonLink to={targetHref(proposalId, "new")} size="sm">
            Add a target
          </ButtonLink>
        ) : null
      }
    >
      {targets.length === 0 ? (
        <p className="mb-3 text-sm text-night-600">No target yet. Type one in, or copy one of your own targets.</p>
      ) : (
        <ol className="divide-y divide-night-100 rounded-lg ring-1 ring-night-200">
          {targets.map((t, i) => (
            <TargetItem
              key={t.id}
              target={t}
              at={i}
              last={i === targets.length - 1}
              proposalId={proposalId}
              editable={editable}
            />
          ))}
        </ol>
      )}
      {editable ? <CopyFromMine myTargets={myTargets} result={result} /> : null}
    </Card>
  );
}
