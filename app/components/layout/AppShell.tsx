import { type ReactNode, useState } from "react";
import { href, Link, NavLink } from "react-router";
import type { Section } from "~/lib/permissions";
import { cx } from "../ui/cx";
import { Logo } from "./Logo";

export type ShellViewer = { name: string; email: string; roles: string[] } | null;

function navClass({ isActive }: { isActive: boolean }) {
  return cx(
    "block rounded-md px-3 py-2 text-sm font-medium",
    isActive ? "bg-night-700 text-white" : "text-night-100 hover:bg-night-800 hover:text-white",
  );
}

/** The viewer's sections as a list of navigation links (the desktop bar and the mobile menu). */
function SectionLinks({
  sections,
  className,
  onFollow,
}: {
  sections: Section[];
  className: string;
  onFollow?: () => void;
}) {
  return (
    <ul className={className}>
      {sections.map((s) => (
        <li key={s.to}>
          <NavLink to={s.to} className={navClass} onClick={onFollow}>
            {s.label}
          </NavLink>
        </li>
      ))}
    </ul>
  );
}

/** The viewer's name and the sign-in / account controls. */
function ViewerControls({
  viewer,
  account,
  className,
}: {
  viewer: ShellViewer;
  account?: ReactNode;
  className: string;
}) {
  return (
    <div className={className}>
      {viewer ? <span className="text-night-200">{viewer.name}</span> : null}
      {account}
    </div>
  );
}

const skipLinkClass =
  "sr-only focus:not-sr-only focus:absolute focus:left-2 focus:top-2 focus:z-50 focus:rounded focus:bg-white " +
  "focus:px-3 focus:py-2";

/** Header with the product name and the viewer's sections, a main column, and a footer. */
export function AppShell({
  sections,
  viewer,
  account,
  children,
}: {
  sections: Section[];
  viewer: ShellViewer;
  /** Sign-in / account controls at the right of the header. */
  account?: ReactNode;
  children: ReactNode;
}) {
  const [open, setOpen] = useState(false);
  return (
    <div className="flex min-h-screen flex-col">
      <a href="#main" className={skipLinkClass}>
        Skip to content
      </a>
      <header className="bg-night-900 text-white">
        <div className="mx-auto flex max-w-7xl items-center gap-3 px-4 py-3">
          <Link
            to={href("/")}
            className="flex items-center gap-2 rounded-md pr-2 text-lg font-semibold tracking-tight text-white"
          >
            <Logo />
            <span>Fringe Docket</span>
          </Link>
          <nav aria-label="Sections" className="ml-4 hidden flex-1 lg:block">
            <SectionLinks sections={sections} className="flex flex-wrap gap-1" />
          </nav>
          <ViewerControls
            viewer={viewer}
            account={account}
            className="ml-auto hidden items-center gap-3 text-sm lg:flex"
          />
          <button
            type="button"
            className="ml-auto rounded-md px-3 py-2 text-sm font-medium text-night-100 ring-1 ring-night-600 lg:hidden"
            aria-expanded={open}
            aria-controls="mobile-nav"
            onClick={() => setOpen((o) => !o)}
          >
            Menu
          </button>
        </div>
        {open ? (
          <nav id="mobile-nav" aria-label="Sections" className="border-t border-night-700 px-4 pb-3 lg:hidden">
            <SectionLinks sections={sections} className="mt-2 space-y-1" onFollow={() => setOpen(false)} />
            <ViewerControls viewer={viewer} account={account} className="mt-3 flex items-center gap-3 text-sm" />
          </nav>
        ) : null}
      </header>
      <main id="main" className="mx-auto w-full max-w-7xl flex-1 px-4 py-6 sm:py-8">
        {children}
      </main>
      <footer className="border-t border-night-200 bg-white">
        <div className="mx-auto max-w-7xl px-4 py-4 text-sm text-night-600">
          Fringe Docket — proposals, review and night plans for an interferometric array. Plans defer to the
          observatory's operating rules on Sun, wind and twilight limits.
        </div>
      </footer>
    </div>
  );
}
