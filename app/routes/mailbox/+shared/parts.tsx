import type { ReactNode } from "react";
import { Badge, type BadgeTone } from "~/components/ui";
import type { MailStatus } from "~/services/mailbox/queries.server";

/** The recipient's address, marked when it is the viewer's own. */
export function Recipient({ to, toViewer }: { to: string; toViewer: boolean }) {
  return (
    <span className="inline-flex flex-wrap items-center gap-1.5">
      <span className="break-all">{to}</span>
      {toViewer ? <Badge tone="accent">you</Badge> : null}
    </span>
  );
}

const statusTone: Record<MailStatus, BadgeTone> = {
  delivered: "ok",
  queued: "info",
  retrying: "caution",
  abandoned: "danger",
};
const statusWord: Record<MailStatus, string> = {
  delivered: "delivered",
  queued: "queued",
  retrying: "queued · retrying",
  abandoned: "not sent: too late",
};

/**
 * A delivery state as a badge: delivered, queued (no attempt yet), queued and retrying, or not sent
 * because it could no longer arrive in time; `children` replace the words.
 */
export function StatusBadge({ status, children }: { status: MailStatus; children?: ReactNode }) {
  return <Badge tone={statusTone[status]}>{children ?? statusWord[status]}</Badge>;
}

/** "1 attempt", "3 attempts"; with a qualifier, "3 failed attempts". */
export function attemptsText(attempts: number, qualifier?: string) {
  return `${attempts} ${qualifier ? `${qualifier} ` : ""}${attempts === 1 ? "attempt" : "attempts"}`;
}
