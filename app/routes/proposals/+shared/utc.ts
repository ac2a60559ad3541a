// Moved to app/components/proposals/ (shared with the Review desk); kept here for the proposal pages.
export { shownUtc } from "~/components/proposals/utc";
