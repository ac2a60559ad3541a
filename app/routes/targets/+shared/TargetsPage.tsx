import type { ReactNode } from "react";
import { PageHeader } from "~/components/ui";

/** The frame of the My targets pages: the page header, then the page's cards one under another. */
export function TargetsPage({
  title,
  lead,
  actions,
  children,
}: {
  title: string;
  lead: string;
  actions?: ReactNode;
  children: ReactNode;
}) {
  return (
    <>
      <PageHeader title={title} lead={lead} actions={actions} />
      <div className="grid grid-cols-1 gap-6">{children}</div>
    </>
  );
}
