/**
 * The chair's page of one cycle: where it stands, the transitions it offers now, the darkness of the
 * period at the site and the hours each configuration's nights give, the committee, and the cycle's
 * entries in the audit log.
 */
import { and, desc, eq, sql } from "drizzle-orm";
import type { DbOrTx } from "~/db/client.server";
import { auditLog } from "~/db/schema/auth";
import { reviewAssignments, reviews } from "~/db/schema/committee";
import { type cycles, proposals } from "~/db/schema/proposals";
import { users } from "~/db/schema/users";
import { activeAssignment } from "~/lib/conditions.server";
import { formatUtc } from "~/lib/format";
import { reviewOfAssignment } from "~/lib/joins.server";
import { cycleDarkness } from "~/services/committee/dark-time.server";
import { scaleText } from "~/services/committee/scale";
import { committeeOf, offersWithSites } from "./queries.server";
import { availableTransitions, STATE_WORDS } from "./states";
import { guardFacts } from "./transitions.server";

/** Darkness of the period per offered configuration: nights × mean dark hours per night (Sun below −18°). */
export async function cycleDarknessSummary(db: DbOrTx, cycle: typeof cycles.$inferSelect) {
  const offers = await offersWithSites(db, { cycleId: cycle.id });
  const siteList = [...new Map(offers.map((o) => [o.site.id, o.site])).values()];
  const dark = await cycleDarkness(db, {
    cycleId: cycle.id,
    first: cycle.observingStart,
    last: cycle.observingEnd,
    sites: siteList,
  });
  return {
    sites: siteList.map((s) => {
      const d = dark.get(s.id)!;
      const hours = d.nights.map((n) => n.darkHours);
      return {
        name: s.name,
        periodNights: d.periodNights,
        meanDarkHoursPerNight: d.meanDarkHoursPerNight,
        shortestH: Math.min(...hours),
        longestH: Math.max(...hours),
      };
    }),
    offers: offers.map((o) => {
      const perNight = dark.get(o.site.id)!.meanDarkHoursPerNight;
      return {
        id: o.id,
        name: o.name,
        nights: o.nights,
        darkHoursPerNight: perNight,
        hoursOffered: o.nights === null ? null : o.nights * perNight,
      };
    }),
  };
}

/** The audit log's entries about this cycle, newest first. */
export async function cycleLog(db: DbOrTx, { cycleId, limit = 40 }: { cycleId: number; limit?: number }) {
  const rows = await db
    .select({
      id: auditLog.id,
      action: auditLog.action,
      detail: auditLog.detail,
      at: auditLog.createdAt,
      actor: users.name,
    })
    .from(auditLog)
    .leftJoin(users, eq(users.id, auditLog.actorId))
    .where(sql`(${auditLog.detail} ->> 'cycleId')::int = ${cycleId}`)
    .orderBy(desc(auditLog.createdAt), desc(auditLog.id))
    .limit(limit);
  return rows.map((r) => ({ ...r, at: formatUtc(r.at) }));
}

export async function cyclePage(db: DbOrTx, { cycle, now }: { cycle: typeof cycles.$inferSelect; now: Date }) {
  const [facts, darkness, committee, counts, progress, log] = await Promise.all([
    guardFacts(db, cycle),
    cycleDarknessSummary(db, cycle),
    committeeOf(db, { cycleId: cycle.id }),
    db
      .select({ status: proposals.status, n: sql<number>`count(*)::int` })
      .from(proposals)
      .where(eq(proposals.cycleId, cycle.id))
      .groupBy(proposals.status),
    db
      .select({ assigned: sql<number>`count(*)::int`, submitted: sql<number>`count(${reviews.submittedAt})::int` })
      .from(reviewAssignments)
      .leftJoin(reviews, reviewOfAssignment)
      .where(and(eq(reviewAssignments.cycleId, cycle.id), activeAssignment)),
    cycleLog(db, { cycleId: cycle.id }),
  ]);
  return {
    cycle: {
      id: cycle.id,
      name: cycle.name,
      description: cycle.description,
      state: cycle.state,
      stateWords: STATE_WORDS[cycle.state],
      observingStart: cycle.observingStart,
      observingEnd: cycle.observingEnd,
      submissionDeadline: formatUtc(cycle.submissionDeadline),
      reviewDeadline: cycle.reviewDeadline ? formatUtc(cycle.reviewDeadline) : null,
      decisionDate: cycle.decisionDate,
      scale: scaleText({ best: cycle.scoreBest, worst: cycle.scoreWorst }),
    },
    transitions: availableTransitions(facts, now),
    darkness,
    committee,
    proposals: Object.fromEntries(counts.map((c) => [c.status, c.n])) as Record<string, number>,
    reviews: progress[0] ?? { assigned: 0, submitted: 0 },
    log,
  };
}
