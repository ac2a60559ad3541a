/**
 * The cycle pages' door to the committee's assignment work (the chair assigns from the cycle): the
 * overview, auto-assign preview and save, assigning by hand, taking back, and reminders. The logic lives
 * in services/committee.
 */
export {
  assignmentOverview,
  DEFAULT_REVIEWERS_PER_PROPOSAL,
  type Pair,
  previewAutoAssign,
  removeAssignment,
  saveAssignments,
} from "~/services/committee/assignments.server";
export { sendReminders } from "~/services/committee/desk.server";
export { WholeNumber } from "~/services/committee/schemas";
