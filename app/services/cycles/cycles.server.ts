/**
 * Observing cycles as other features use them: proposals list the open ones, the registry names the
 * cycles offering a configuration, the seed creates the demo cycles. Queries and commands live in
 * queries.server.ts and commands.server.ts; the field rules in schemas.ts.
 */
export { createCycle, updateCycle } from "./commands.server";
export { type CyclePhase, cyclePhase } from "./phase";
export {
  committeeOf,
  cyclesOfferingConfigurations,
  findCycleByName,
  getCycle,
  listCycles,
  openCycles,
  reviewerChoices,
} from "./queries.server";
export type { CommitteeFields, CycleInput } from "./schemas";
export { STATE_WORDS, scoringClosedBecause, scoringOpen } from "./states";
