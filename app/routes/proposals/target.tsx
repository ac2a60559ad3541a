/** A target of a proposal: `targets/new` for a new one, `targets/:targetId` for one of its targets. */
import { ErrorPage } from "~/components/ErrorPage";
import { loadTargetEditor, saveTargetEditor } from "./+shared/target/editor.server";
import { TargetEditor } from "./+shared/target/TargetEditor";
import type { Route } from "./+types/target";

export const loader = (args: Route.LoaderArgs) => loadTargetEditor(args);

export const action = (args: Route.ActionArgs) => saveTargetEditor(args);

export const meta: Route.MetaFunction = ({ data: d }) => [
  { title: `${d?.name ?? "Target"} — Proposal — Fringe Docket` },
];

export default function ProposalTarget({ loaderData, actionData }: Route.ComponentProps) {
  return <TargetEditor page={loaderData} answer={actionData} />;
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
