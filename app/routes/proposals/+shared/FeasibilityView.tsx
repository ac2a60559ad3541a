// Moved to app/components/proposals/ so the Review desk shows the same report; kept here for the proposal pages.
export { FeasibilityView } from "~/components/proposals/FeasibilityView";
