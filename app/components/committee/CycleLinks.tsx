/** The buttons a cycle's pages show to reach its other pages (the cycle, its editor, assignments, board). */
import { href } from "react-router";
import { ButtonLink } from "~/components/ui";

const PAGES = {
  cycle: { label: "Cycle", to: (cycleId: string) => href("/cycles/:cycleId", { cycleId }) },
  edit: { label: "Edit", to: (cycleId: string) => href("/cycles/:cycleId/edit", { cycleId }) },
  assignments: { label: "Assignments", to: (cycleId: string) => href("/cycles/:cycleId/assignments", { cycleId }) },
  board: { label: "Ranking board", to: (cycleId: string) => href("/board/:cycleId", { cycleId }) },
} as const;

export type CyclePage = keyof typeof PAGES;

/** Links to `pages` of the cycle, in that order; `primary` is the one the page leads on to. */
export function CycleLinks({ cycleId, pages, primary }: { cycleId: string; pages: CyclePage[]; primary?: CyclePage }) {
  return pages.map((page) => (
    <ButtonLink key={page} to={PAGES[page].to(cycleId)} variant={page === primary ? "primary" : "secondary"}>
      {PAGES[page].label}
    </ButtonLink>
  ));
}
