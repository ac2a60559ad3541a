/**
 * The committee's notices: assignments and reminders to reviewers, decisions to every member of a
 * proposal's team. Each is queued in the outbox inside the transaction of the change; the command wakes
 * the sender after the commit.
 */
import { createElement } from "react";
import { href } from "react-router";
import type { DbOrTx } from "~/db/client.server";
import type { proposals } from "~/db/schema/proposals";
import { DecisionEmail, type DecisionEmailProps } from "~/emails/DecisionEmail";
import { ReviewAssignmentEmail } from "~/emails/ReviewAssignmentEmail";
import { ReviewReminderEmail } from "~/emails/ReviewReminderEmail";
import { env } from "~/env.server";
import { formatUtc } from "~/lib/format";
import { enqueueMail } from "~/services/mail/outbox.server";
import { noticeTeam, proposalSubject } from "~/services/proposals/notices.server";

const origin = () => env().APP_ORIGIN.replace(/\/$/, "");

export const reviewDeskUrl = () => `${origin()}${href("/review")}`;

type Person = { id: number; email: string; name: string };

export async function queueAssignmentNotice(
  tx: DbOrTx,
  n: { reviewer: Person; cycleName: string; titles: string[]; reviewDeadline: Date | null; scale: string },
) {
  const count = n.titles.length;
  await enqueueMail(tx, {
    kind: "assignment",
    to: n.reviewer.email,
    userId: n.reviewer.id,
    subject: `${count} proposal${count === 1 ? "" : "s"} to review (${n.cycleName})`,
    relatedUrl: reviewDeskUrl(),
    element: createElement(ReviewAssignmentEmail, {
      name: n.reviewer.name,
      cycleName: n.cycleName,
      titles: n.titles,
      reviewDeadline: n.reviewDeadline ? formatUtc(n.reviewDeadline) : null,
      scale: n.scale,
      url: reviewDeskUrl(),
    }),
  });
}

export async function queueReminder(
  tx: DbOrTx,
  n: {
    reviewer: Person;
    cycleName: string;
    pending: { title: string; progress: string }[];
    reviewDeadline: Date | null;
  },
) {
  await enqueueMail(tx, {
    kind: "reminder",
    to: n.reviewer.email,
    userId: n.reviewer.id,
    subject: `Reminder: ${n.pending.length} review${n.pending.length === 1 ? "" : "s"} to submit (${n.cycleName})`,
    relatedUrl: reviewDeskUrl(),
    element: createElement(ReviewReminderEmail, {
      name: n.reviewer.name,
      cycleName: n.cycleName,
      pending: n.pending,
      reviewDeadline: n.reviewDeadline ? formatUtc(n.reviewDeadline) : null,
      url: reviewDeskUrl(),
    }),
  });
}

const SUBJECT_PREFIX: Record<DecisionEmailProps["decision"], string> = {
  accept: "Accepted",
  waitlist: "Waiting list",
  decline: "Not accepted",
};

/** The decision to the PI and every co-investigator, one message each. */
export async function queueDecisionNotices(
  tx: DbOrTx,
  n: {
    proposal: typeof proposals.$inferSelect;
    cycleName: string;
  } & Omit<DecisionEmailProps, "name" | "url" | "title" | "cycleName">,
) {
  const { proposal, cycleName, ...rest } = n;
  await noticeTeam(tx, {
    proposal,
    kind: "decision",
    subject: proposalSubject(SUBJECT_PREFIX[n.decision], proposal.title, cycleName),
    element: (to) =>
      createElement(DecisionEmail, {
        ...rest,
        name: to.name,
        title: proposal.title,
        cycleName,
        url: `${origin()}${href("/proposals/:proposalId", { proposalId: String(proposal.id) })}`,
      }),
  });
}
