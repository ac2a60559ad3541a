import { relations } from "drizzle-orm";
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
  proposalHours,
  proposalMembers,
  proposals,
  proposalTargets,
  proposalVersions,
  targets,
} from "./schema/proposals";
import { userRoles, users } from "./schema/users";

export const sitesRelations = relations(sites, ({ many }) => ({
  stations: many(stations),
  configurations: many(configurations),
  instruments: many(instruments),
}));

export const stationsRelations = relations(stations, ({ one, many }) => ({
  site: one(sites, { fields: [stations.siteId], references: [sites.id] }),
  configurations: many(configurationStations),
}));

export const configurationsRelations = relations(configurations, ({ one, many }) => ({
  site: one(sites, { fields: [configurations.siteId], references: [sites.id] }),
  stations: many(configurationStations),
}));

export const configurationStationsRelations = relations(configurationStations, ({ one }) => ({
  configuration: one(configurations, {
    fields: [configurationStations.configurationId],
    references: [configurations.id],
  }),
  station: one(stations, { fields: [configurationStations.stationId], references: [stations.id] }),
}));

export const instrumentsRelations = relations(instruments, ({ one, many }) => ({
  site: one(sites, { fields: [instruments.siteId], references: [sites.id] }),
  bands: many(bands),
}));

export const bandsRelations = relations(bands, ({ one }) => ({
  instrument: one(instruments, { fields: [bands.instrumentId], references: [instruments.id] }),
}));

export const usersRelations = relations(users, ({ many }) => ({
  roles: many(userRoles),
}));

export const userRolesRelations = relations(userRoles, ({ one }) => ({
  user: one(users, { fields: [userRoles.userId], references: [users.id] }),
}));

export const cyclesRelations = relations(cycles, ({ many }) => ({
  configurations: many(cycleConfigurations),
  proposals: many(proposals),
}));

export const cycleConfigurationsRelations = relations(cycleConfigurations, ({ one }) => ({
  cycle: one(cycles, { fields: [cycleConfigurations.cycleId], references: [cycles.id] }),
  configuration: one(configurations, {
    fields: [cycleConfigurations.configurationId],
    references: [configurations.id],
  }),
}));

export const targetsRelations = relations(targets, ({ one }) => ({
  owner: one(users, { fields: [targets.ownerId], references: [users.id] }),
}));

export const proposalsRelations = relations(proposals, ({ one, many }) => ({
  cycle: one(cycles, { fields: [proposals.cycleId], references: [cycles.id] }),
  pi: one(users, { fields: [proposals.piId], references: [users.id] }),
  instrument: one(instruments, { fields: [proposals.instrumentId], references: [instruments.id] }),
  band: one(bands, { fields: [proposals.bandId], references: [bands.id] }),
  members: many(proposalMembers),
  hours: many(proposalHours),
  targets: many(proposalTargets),
  versions: many(proposalVersions),
}));

export const proposalMembersRelations = relations(proposalMembers, ({ one }) => ({
  proposal: one(proposals, { fields: [proposalMembers.proposalId], references: [proposals.id] }),
  user: one(users, { fields: [proposalMembers.userId], references: [users.id] }),
}));

export const proposalHoursRelations = relations(proposalHours, ({ one }) => ({
  proposal: one(proposals, { fields: [proposalHours.proposalId], references: [proposals.id] }),
  configuration: one(configurations, { fields: [proposalHours.configurationId], references: [configurations.id] }),
}));

export const proposalTargetsRelations = relations(proposalTargets, ({ one }) => ({
  proposal: one(proposals, { fields: [proposalTargets.proposalId], references: [proposals.id] }),
}));

export const proposalVersionsRelations = relations(proposalVersions, ({ one }) => ({
  proposal: one(proposals, { fields: [proposalVersions.proposalId], references: [proposals.id] }),
}));

export const nightConfigurationsRelations = relations(nightConfigurations, ({ one }) => ({
  cycle: one(cycles, { fields: [nightConfigurations.cycleId], references: [cycles.id] }),
  configuration: one(configurations, {
    fields: [nightConfigurations.configurationId],
    references: [configurations.id],
  }),
}));

export const nightPlansRelations = relations(nightPlans, ({ one, many }) => ({
  cycle: one(cycles, { fields: [nightPlans.cycleId], references: [cycles.id] }),
  configuration: one(configurations, { fields: [nightPlans.configurationId], references: [configurations.id] }),
  blocks: many(nightPlanBlocks),
}));

export const nightPlanBlocksRelations = relations(nightPlanBlocks, ({ one }) => ({
  plan: one(nightPlans, { fields: [nightPlanBlocks.planId], references: [nightPlans.id] }),
  proposal: one(proposals, { fields: [nightPlanBlocks.proposalId], references: [proposals.id] }),
  proposalTarget: one(proposalTargets, {
    fields: [nightPlanBlocks.proposalTargetId],
    references: [proposalTargets.id],
  }),
}));

// ---------------------------------------------------------------- committee

export const committeeMembersRelations = relations(committeeMembers, ({ one }) => ({
  cycle: one(cycles, { fields: [committeeMembers.cycleId], references: [cycles.id] }),
  user: one(users, { fields: [committeeMembers.userId], references: [users.id] }),
}));

export const reviewConflictsRelations = relations(reviewConflicts, ({ one }) => ({
  proposal: one(proposals, { fields: [reviewConflicts.proposalId], references: [proposals.id] }),
  reviewer: one(users, { fields: [reviewConflicts.reviewerId], references: [users.id] }),
}));

export const reviewAssignmentsRelations = relations(reviewAssignments, ({ one }) => ({
  proposal: one(proposals, { fields: [reviewAssignments.proposalId], references: [proposals.id] }),
  reviewer: one(users, { fields: [reviewAssignments.reviewerId], references: [users.id] }),
  review: one(reviews, { fields: [reviewAssignments.id], references: [reviews.assignmentId] }),
}));

export const reviewsRelations = relations(reviews, ({ one }) => ({
  assignment: one(reviewAssignments, { fields: [reviews.assignmentId], references: [reviewAssignments.id] }),
}));

export const proposalDecisionsRelations = relations(proposalDecisions, ({ one }) => ({
  proposal: one(proposals, { fields: [proposalDecisions.proposalId], references: [proposals.id] }),
}));

export const allocatedHoursRelations = relations(allocatedHours, ({ one }) => ({
  proposal: one(proposals, { fields: [allocatedHours.proposalId], references: [proposals.id] }),
  configuration: one(configurations, { fields: [allocatedHours.configurationId], references: [configurations.id] }),
}));

export const imagingJobsRelations = relations(imagingJobs, ({ one }) => ({
  owner: one(users, { fields: [imagingJobs.ownerId], references: [users.id] }),
  proposalTarget: one(proposalTargets, { fields: [imagingJobs.proposalTargetId], references: [proposalTargets.id] }),
}));
