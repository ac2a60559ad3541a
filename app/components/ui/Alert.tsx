import type { ReactNode } from "react";
import { cx } from "./cx";

export type AlertTone = "danger" | "caution" | "ok" | "info";

const tones: Record<AlertTone, string> = {
  danger: "border-danger-700/30 bg-danger-50 text-danger-700",
  caution: "border-caution-700/30 bg-caution-50 text-caution-700",
  ok: "border-ok-700/30 bg-ok-50 text-ok-700",
  info: "border-info-700/30 bg-info-50 text-info-700",
};

/**
 * A boxed message announced at once (`role="alert"`): a refused action, a form-level error, a
 * warning. `className` adds spacing or weight (`mb-4`, `font-medium`); `as="div"` for block content.
 */
export function Alert({
  tone = "danger",
  as: Tag = "p",
  className,
  children,
}: {
  tone?: AlertTone;
  as?: "p" | "div";
  className?: string;
  children: ReactNode;
}) {
  return (
    <Tag role="alert" className={cx("rounded-lg border p-3 text-sm", tones[tone], className)}>
      {children}
    </Tag>
  );
}
