import { href } from "react-router";
import { ButtonLink } from "~/components/ui";

/** The way back from a page of a proposal (its report, a version, a target) to the proposal. */
export function BackToProposal({ proposalId }: { proposalId: number }) {
  return (
    <ButtonLink to={href("/proposals/:proposalId", { proposalId: String(proposalId) })} variant="ghost">
      Back to the proposal
    </ButtonLink>
  );
}
