import type { ReactNode } from "react";
import type { LinkProps } from "react-router";
import { ButtonLink, type ButtonVariant } from "./Button";
import { cx } from "./cx";

/** The white, rounded, shadowed surface of a card, for elements that are cards without `<Card>`. */
export function cardClass(extra?: string) {
  return cx("rounded-[var(--radius-card)] bg-white shadow-[var(--shadow-card)] ring-1 ring-night-200", extra);
}

export function Card({
  title,
  actions,
  children,
  className,
  id,
}: {
  title?: ReactNode;
  actions?: ReactNode;
  children: ReactNode;
  className?: string;
  /** Makes the card a region named by its title (the heading's id is `${id}-title`). */
  id?: string;
}) {
  const titleId = id && title ? `${id}-title` : undefined;
  return (
    <section id={id} aria-labelledby={titleId} className={cardClass(cx("p-5", className))}>
      {title || actions ? (
        <header className="mb-3 flex flex-wrap items-center justify-between gap-2">
          {title ? (
            <h2 id={titleId} className="text-lg font-semibold">
              {title}
            </h2>
          ) : (
            <span />
          )}
          {actions ? <div className="flex gap-2">{actions}</div> : null}
        </header>
      ) : null}
      {children}
    </section>
  );
}

export function EmptyState({ title, children, action }: { title: string; children?: ReactNode; action?: ReactNode }) {
  return (
    <div className="rounded-[var(--radius-card)] border border-dashed border-night-300 bg-white/60 px-6 py-10 text-center">
      <svg aria-hidden="true" viewBox="0 0 48 48" className="mx-auto mb-3 h-10 w-10 text-night-300">
        <circle cx="12" cy="24" r="5" fill="currentColor" />
        <circle cx="36" cy="24" r="5" fill="currentColor" />
        <path d="M17 24h14" stroke="currentColor" strokeWidth="2" strokeDasharray="2 3" />
      </svg>
      <p className="font-semibold text-night-800">{title}</p>
      {children ? <div className="mt-1 text-sm text-night-600">{children}</div> : null}
      {action ? <div className="mt-4">{action}</div> : null}
    </div>
  );
}

/** Where a page's "Back to …" button leads: the page above it. */
export type BackLink = { to: LinkProps["to"]; label: string; variant?: ButtonVariant };

export function PageHeader({
  title,
  lead,
  actions,
  back,
}: {
  title: string;
  lead?: ReactNode;
  actions?: ReactNode;
  /** A "Back to …" button before the actions (secondary unless told). */
  back?: BackLink;
}) {
  return (
    <div className="mb-6 flex flex-wrap items-end justify-between gap-3">
      <div>
        <h1 className="text-2xl font-semibold sm:text-3xl">{title}</h1>
        {lead ? <p className="mt-1 max-w-3xl text-night-600">{lead}</p> : null}
      </div>
      {actions || back ? (
        <div className="flex flex-wrap gap-2">
          {back ? (
            <ButtonLink to={back.to} variant={back.variant ?? "secondary"}>
              {back.label}
            </ButtonLink>
          ) : null}
          {actions}
        </div>
      ) : null}
    </div>
  );
}

export type BadgeTone = "neutral" | "ok" | "caution" | "danger" | "info" | "accent";

const tones: Record<BadgeTone, string> = {
  neutral: "bg-night-100 text-night-700",
  ok: "bg-ok-50 text-ok-700 ring-1 ring-ok-700/20",
  caution: "bg-caution-50 text-caution-700 ring-1 ring-caution-700/20",
  danger: "bg-danger-50 text-danger-700 ring-1 ring-danger-700/20",
  info: "bg-info-50 text-info-700 ring-1 ring-info-700/20",
  accent: "bg-ember-50 text-ember-800 ring-1 ring-ember-700/20",
};

export function Badge({ tone = "neutral", children }: { tone?: BadgeTone; children: ReactNode }) {
  return (
    <span className={cx("inline-flex items-center rounded-full px-2 py-0.5 text-xs font-medium", tones[tone])}>
      {children}
    </span>
  );
}
