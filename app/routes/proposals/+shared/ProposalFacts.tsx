// Moved to app/components/proposals/ so the Review desk shows the same facts; kept here for the proposal pages.
export { ProposalFacts } from "~/components/proposals/ProposalFacts";
