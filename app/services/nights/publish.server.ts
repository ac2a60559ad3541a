/**
 * Publishing a night plan: only a valid draft with planned blocks; the plan is published and every PI
 * and co-investigator of a program in it gets an e-mail with their blocks and a link to the iCalendar
 * file of their blocks, written to the outbox in the same transaction.
 */
import { eq, inArray } from "drizzle-orm";
import { createElement } from "react";
import { href } from "react-router";
import type { Database } from "~/db/client.server";
import { nightPlans } from "~/db/schema/nights";
import { proposalMembers, proposals } from "~/db/schema/proposals";
import { users } from "~/db/schema/users";
import { NightPlanPublishedEmail } from "~/emails/NightPlanPublishedEmail";
import { PLAN_SAFETY_WARNING } from "~/engine";
import { env } from "~/env.server";
import { piOfProposal } from "~/lib/joins.server";
import { enqueueMail } from "~/services/mail/outbox.server";
import { wakeOutboxSender } from "~/services/mail/sender.server";
import { planContext, planRequest } from "./candidates";
import { loadNight } from "./night.server";
import { type CommandResult, done, refuse } from "./result";
import { lstText, utcTime } from "./sky";
import { viewBlocks } from "./view";

const clip = (s: string, n: number) => (s.length > n ? `${s.slice(0, n - 1)}…` : s);

/** Publishes the draft plan of `date` and notifies the programs' teams (links on the app's public address). */
export async function publishPlan(
  db: Database,
  { date, userId, origin = env().APP_ORIGIN }: { date: string; userId: number | null; origin?: string },
): Promise<CommandResult<{ messages: number }>> {
  const out = await db.transaction(async (tx) => {
    const night = await loadNight(tx, { date, lock: true });
    if (!night.plan) return refuse(404, `There is no plan for the night of ${date} yet.`);
    if (night.plan.state !== "draft") return refuse(409, `The plan is already ${night.plan.state}.`);
    if (!night.setting || !night.installation) return refuse(409, "No configuration is installed on this night.");
    const input = planRequest(night.setting, night.candidates);
    const { blocks, ok } = viewBlocks(input, planContext(input), night.blocks, night.candidates);
    const planned = blocks.filter((b) => b.outcome === "planned");
    if (planned.length === 0) return refuse(409, "The plan has no planned blocks to publish.");
    if (!ok) {
      const bad = blocks.filter((b) => b.violations.length > 0).length;
      return refuse(
        409,
        `${bad} block${bad === 1 ? " breaks" : "s break"} a rule (marked in the plan): fix ${bad === 1 ? "it" : "them"} before publishing.`,
      );
    }
    await tx
      .update(nightPlans)
      .set({ state: "published", publishedAt: new Date(), publishedById: userId })
      .where(eq(nightPlans.id, night.plan.id));

    const ids = [...new Set(planned.map((b) => b.proposalId).filter((x): x is number => x !== null))];
    const programs = ids.length
      ? await tx
          .select({
            id: proposals.id,
            title: proposals.title,
            /** The PI as a recipient of the notice. */
            pi: { name: users.name, userId: users.id, email: users.email },
          })
          .from(proposals)
          .innerJoin(users, piOfProposal)
          .where(inArray(proposals.id, ids))
      : [];
    const members = ids.length
      ? await tx
          .select({
            proposalId: proposalMembers.proposalId,
            email: proposalMembers.email,
            userId: users.id,
            name: users.name,
          })
          .from(proposalMembers)
          .leftJoin(users, eq(users.id, proposalMembers.userId))
          .where(inArray(proposalMembers.proposalId, ids))
      : [];
    const icsUrl = new URL(href("/nights/:date/export/:file", { date, file: "plan.ics" }), origin).toString();
    let messages = 0;
    for (const p of programs) {
      const own = planned.filter((b) => b.proposalId === p.id);
      const scienceHours = own
        .filter((b) => b.kind === "science")
        .reduce((h, b) => h + (Date.parse(b.endUtc) - Date.parse(b.startUtc)) / 3_600_000, 0);
      const title = p.title || `Proposal ${p.id}`;
      const recipients = new Map<string, { name: string | null; userId: number | null; email: string }>();
      recipients.set(p.pi.email.toLowerCase(), p.pi);
      for (const m of members.filter((x) => x.proposalId === p.id)) {
        if (!recipients.has(m.email.toLowerCase())) {
          recipients.set(m.email.toLowerCase(), { name: m.name, userId: m.userId, email: m.email });
        }
      }
      const proposalUrl = new URL(href("/proposals/:proposalId", { proposalId: String(p.id) }), origin).toString();
      for (const r of recipients.values()) {
        await enqueueMail(tx, {
          kind: "night-plan",
          to: r.email,
          subject: `Night plan ${date}: ${own.length} blocks for “${clip(title, 120)}”`,
          userId: r.userId,
          relatedUrl: proposalUrl,
          element: createElement(NightPlanPublishedEmail, {
            name: r.name,
            date,
            configuration: night.installation.configurationName,
            programTitle: title,
            blocks: own.map((b) => ({
              kind: b.kind,
              target: b.target,
              object: b.object,
              startUt: utcTime(b.startUtc),
              endUt: utcTime(b.endUtc),
              startLst: b.fields ? lstText(b.fields.startLstH) : "—",
            })),
            scienceHours,
            proposalUrl,
            icsUrl,
            caution: PLAN_SAFETY_WARNING,
          }),
        });
        messages++;
      }
    }
    return done(
      `The plan of ${date} is published; ${messages} e-mail${messages === 1 ? "" : "s"} to the teams of ${programs.length} program${programs.length === 1 ? "" : "s"}.`,
      { messages },
    );
  });
  if (out.ok) wakeOutboxSender();
  return out;
}
