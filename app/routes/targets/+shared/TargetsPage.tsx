import type { ReactNode } from "react";
import { href } from "react-router";
import { PageHeader } from "~/components/ui";

/**
 * The frame of the My targets pages: the page header (with "Back to My targets" on the pages under
 * the list, `back`), then the page's cards one under another.
 */
export function TargetsPage({
  title,
  lead,
  actions,
  back = false,
  children,
}: {
  title: string;
  lead: string;
  actions?: ReactNode;
  back?: boolean;
  children: ReactNode;
}) {
  return (
    <>
      <PageHeader
        title={title}
        lead={lead}
        actions={actions}
        back={back ? { to: href("/targets"), label: "Back to My targets" } : undefined}
      />
      <div className="grid grid-cols-1 gap-6">{children}</div>
    </>
  );
}
