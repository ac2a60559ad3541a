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

const statusTone: Record<MailStatus, BadgeTone> = { sent: "ok", pending: "info", retrying: "caution" };

/** A delivery state as a badge: sent, pending (no attempt yet) or retrying; `children` replace the word. */
export function StatusBadge({ status, children }: { status: MailStatus; children?: ReactNode }) {
  return <Badge tone={statusTone[status]}>{children ?? status}</Badge>;
}

/** "1 attempt", "3 attempts"; with a qualifier, "3 failed attempts". */
export function attemptsText(attempts: number, qualifier?: string) {
  return `${attempts} ${qualifier ? `${qualifier} ` : ""}${attempts === 1 ? "attempt" : "attempts"}`;
}
