/**
 * The team of a proposal: the PI adds co-investigators by e-mail (linked to an account when one
 * exists for the address; each is sent a notice) and removes them.
 */
import { eq, sql } from "drizzle-orm";
import { createElement } from "react";
import type { Database } from "~/db/client.server";
import { proposalMembers } from "~/db/schema/proposals";
import { users } from "~/db/schema/users";
import { CoInvestigatorAddedEmail } from "~/emails/CoInvestigatorAddedEmail";
import { formatUtc } from "~/lib/format";
import type { ProposalViewer } from "./access.server";
import { changeProposal, type ProposalRef, ProposalRefusal } from "./lock.server";
import { NOTICE_KIND, proposalUrl, queueNotice, thenSend } from "./notices.server";
import { PROPOSAL_LIMITS } from "./schemas";
import { clip } from "./words";

/** Adds a co-investigator by e-mail and queues their notice, then wakes the sender. Returns the member row. */
export async function addCoInvestigator(
  db: Database,
  { email, ...ref }: ProposalRef & { viewer: ProposalViewer & { user: { name: string } }; email: string },
) {
  const added = changeProposal(
    db,
    ref,
    "canManageTeam",
    async ({ tx, proposal, cycle, members, now, proposalId }) => {
      const lower = email.trim().toLowerCase();
      const [pi] = await tx.select().from(users).where(eq(users.id, proposal.piId));
      if (pi && pi.email.toLowerCase() === lower)
        throw new ProposalRefusal(400, "Co-investigator e-mail: that is the PI's own address.", "email");
      if (members.some((m) => m.email.toLowerCase() === lower))
        throw new ProposalRefusal(400, `Co-investigator e-mail: ${email} is already on the team.`, "email");
      if (members.length >= PROPOSAL_LIMITS.coInvestigatorsMax) {
        throw new ProposalRefusal(
          400,
          `Co-investigator e-mail: a team has at most ${PROPOSAL_LIMITS.coInvestigatorsMax} co-investigators.`,
          "email",
        );
      }
      const [account] = await tx.select().from(users).where(sql`lower(${users.email}) = ${lower}`);
      const [row] = await tx
        .insert(proposalMembers)
        .values({ proposalId, email: email.trim(), userId: account?.id ?? null, invitedAt: now })
        .returning();
      await queueNotice(tx, {
        kind: NOTICE_KIND.coInvestigator,
        proposalId,
        subject: `You are a co-investigator on "${clip(proposal.title, 120)}"`,
        to: { email: row.email, name: account?.name ?? null, userId: account?.id ?? null },
        element: createElement(CoInvestigatorAddedEmail, {
          name: account?.name ?? null,
          piName: ref.viewer.user.name,
          title: proposal.title,
          cycleName: cycle.name,
          deadline: formatUtc(cycle.submissionDeadline),
          url: proposalUrl(proposalId),
          hasAccount: !!account,
        }),
      });
      return row;
    },
    { touch: true },
  );
  return thenSend(added);
}

/** Takes a co-investigator off the team. Returns the member row removed. */
export async function removeCoInvestigator(db: Database, { memberId, ...ref }: ProposalRef & { memberId: number }) {
  return changeProposal(
    db,
    ref,
    "canManageTeam",
    async ({ tx, members }) => {
      // The team was read under the proposal's lock: it is the team as it stands.
      const member = members.find((m) => m.id === memberId);
      if (!member) throw new ProposalRefusal(400, "That person is not on the team (any more).");
      await tx.delete(proposalMembers).where(eq(proposalMembers.id, member.id));
      return member;
    },
    { touch: true },
  );
}
