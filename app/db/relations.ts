import { type AnyColumn, relations } from "drizzle-orm";
import { bands, configurationStations, configurations, instruments, sites, stations } from "./schema/array";
import {
  allocatedHours,
  committeeMembers,
  proposalDecisions,
  reviewAssignments,
  reviewConflicts,
  reviews,
} from "./schema/committee";
import { imagingJobs } from "./schema/imaging";
import { nightConfigurations, nightPlanBlocks, nightPlans } from "./schema/nights";
import {
  cycleConfigurations,
  cycles,
  type hoursPerConfiguration,
  proposalHours,
  proposalMembers,
  proposals,
  proposalTargets,
  proposalVersions,
  targets,
} from "./schema/proposals";
import { userRoles, users } from "./schema/users";

/**
 * A `one` relation over a single column pair: `field` of this table matches `reference` of the other
 * (mostly a foreign key and the id it names; a review is found the other way, by its assignment).
 */
function on<TField extends AnyColumn, TReference extends AnyColumn>(field: TField, reference: TReference) {
  return { fields: [field] as [TField], references: [reference] as [TReference] };
}

/** Requested and allocated hours are tables of one shape (hoursPerConfiguration), related alike. */
function hoursPerConfigurationRelations<TName extends string>(table: ReturnType<typeof hoursPerConfiguration<TName>>) {
  return relations(table, ({ one }) => ({
    proposal: one(proposals, on(table.proposalId, proposals.id)),
    configuration: one(configurations, on(table.configurationId, configurations.id)),
  }));
}

export const sitesRelations = relations(sites, ({ many }) => ({
  stations: many(stations),
  configurations: many(configurations),
  instruments: many(instruments),
}));

export const stationsRelations = relations(stations, ({ one, many }) => ({
  site: one(sites, on(stations.siteId, sites.id)),
  configurations: many(configurationStations),
}));

export const configurationsRelations = relations(configurations, ({ one, many }) => ({
  site: one(sites, on(configurations.siteId, sites.id)),
  stations: many(configurationStations),
}));

export const configurationStationsRelations = relations(configurationStations, ({ one }) => ({
  configuration: one(configurations, on(configurationStations.configurationId, configurations.id)),
  station: one(stations, on(configurationStations.stationId, stations.id)),
}));

export const instrumentsRelations = relations(instruments, ({ one, many }) => ({
  site: one(sites, on(instruments.siteId, sites.id)),
  bands: many(bands),
}));

export const bandsRelations = relations(bands, ({ one }) => ({
  instrument: one(instruments, on(bands.instrumentId, instruments.id)),
}));

export const usersRelations = relations(users, ({ many }) => ({
  roles: many(userRoles),
}));

export const userRolesRelations = relations(userRoles, ({ one }) => ({
  user: one(users, on(userRoles.userId, users.id)),
}));

export const cyclesRelations = relations(cycles, ({ many }) => ({
  configurations: many(cycleConfigurations),
  proposals: many(proposals),
}));

export const cycleConfigurationsRelations = relations(cycleConfigurations, ({ one }) => ({
  cycle: one(cycles, on(cycleConfigurations.cycleId, cycles.id)),
  configuration: one(configurations, on(cycleConfigurations.configurationId, configurations.id)),
}));

export const targetsRelations = relations(targets, ({ one }) => ({
  owner: one(users, on(targets.ownerId, users.id)),
}));

export const proposalsRelations = relations(proposals, ({ one, many }) => ({
  cycle: one(cycles, on(proposals.cycleId, cycles.id)),
  pi: one(users, on(proposals.piId, users.id)),
  instrument: one(instruments, on(proposals.instrumentId, instruments.id)),
  band: one(bands, on(proposals.bandId, bands.id)),
  members: many(proposalMembers),
  hours: many(proposalHours),
  targets: many(proposalTargets),
  versions: many(proposalVersions),
}));

export const proposalMembersRelations = relations(proposalMembers, ({ one }) => ({
  proposal: one(proposals, on(proposalMembers.proposalId, proposals.id)),
  user: one(users, on(proposalMembers.userId, users.id)),
}));

export const proposalHoursRelations = hoursPerConfigurationRelations(proposalHours);

export const proposalTargetsRelations = relations(proposalTargets, ({ one }) => ({
  proposal: one(proposals, on(proposalTargets.proposalId, proposals.id)),
}));

export const proposalVersionsRelations = relations(proposalVersions, ({ one }) => ({
  proposal: one(proposals, on(proposalVersions.proposalId, proposals.id)),
}));

export const nightConfigurationsRelations = relations(nightConfigurations, ({ one }) => ({
  cycle: one(cycles, on(nightConfigurations.cycleId, cycles.id)),
  configuration: one(configurations, on(nightConfigurations.configurationId, configurations.id)),
}));

export const nightPlansRelations = relations(nightPlans, ({ one, many }) => ({
  cycle: one(cycles, on(nightPlans.cycleId, cycles.id)),
  configuration: one(configurations, on(nightPlans.configurationId, configurations.id)),
  blocks: many(nightPlanBlocks),
}));

export const nightPlanBlocksRelations = relations(nightPlanBlocks, ({ one }) => ({
  plan: one(nightPlans, on(nightPlanBlocks.planId, nightPlans.id)),
  proposal: one(proposals, on(nightPlanBlocks.proposalId, proposals.id)),
  proposalTarget: one(proposalTargets, on(nightPlanBlocks.proposalTargetId, proposalTargets.id)),
}));

// ---------------------------------------------------------------- committee

export const committeeMembersRelations = relations(committeeMembers, ({ one }) => ({
  cycle: one(cycles, on(committeeMembers.cycleId, cycles.id)),
  user: one(users, on(committeeMembers.userId, users.id)),
}));

export const reviewConflictsRelations = relations(reviewConflicts, ({ one }) => ({
  proposal: one(proposals, on(reviewConflicts.proposalId, proposals.id)),
  reviewer: one(users, on(reviewConflicts.reviewerId, users.id)),
}));

export const reviewAssignmentsRelations = relations(reviewAssignments, ({ one }) => ({
  proposal: one(proposals, on(reviewAssignments.proposalId, proposals.id)),
  reviewer: one(users, on(reviewAssignments.reviewerId, users.id)),
  review: one(reviews, on(reviewAssignments.id, reviews.assignmentId)),
}));

export const reviewsRelations = relations(reviews, ({ one }) => ({
  assignment: one(reviewAssignments, on(reviews.assignmentId, reviewAssignments.id)),
}));

export const proposalDecisionsRelations = relations(proposalDecisions, ({ one }) => ({
  proposal: one(proposals, on(proposalDecisions.proposalId, proposals.id)),
}));

export const allocatedHoursRelations = hoursPerConfigurationRelations(allocatedHours);

export const imagingJobsRelations = relations(imagingJobs, ({ one }) => ({
  owner: one(users, on(imagingJobs.ownerId, users.id)),
  proposalTarget: one(proposalTargets, on(imagingJobs.proposalTargetId, proposalTargets.id)),
}));
