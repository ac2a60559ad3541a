import { useEffect, useState } from "react";
import { cx } from "./cx";

export type FlashMessage = { kind: "success" | "error" | "info"; text: string };

const styles: Record<FlashMessage["kind"], string> = {
  success: "border-ok-700/30 bg-ok-50 text-ok-700",
  error: "border-danger-700/30 bg-danger-50 text-danger-700",
  info: "border-info-700/30 bg-info-50 text-info-700",
};

/**
 * The flash message of the last action, announced politely and dismissible. It sits at the bottom of the
 * window, clear of the navigation and of the page's heading and first actions.
 */
export function Toast({ flash }: { flash: FlashMessage | null }) {
  const [visible, setVisible] = useState<FlashMessage | null>(flash);
  useEffect(() => setVisible(flash), [flash]);
  if (!visible) return null;
  return (
    <div className="pointer-events-none fixed inset-x-0 bottom-4 z-50 flex justify-center px-3 sm:justify-end sm:px-6">
      <div
        role={visible.kind === "error" ? "alert" : "status"}
        className={cx(
          "pointer-events-auto flex max-w-lg items-start gap-3 rounded-lg border px-4 py-3 shadow-lg",
          styles[visible.kind],
        )}
      >
        <p className="text-sm font-medium">{visible.text}</p>
        <button
          type="button"
          onClick={() => setVisible(null)}
          className="rounded px-1 text-sm font-semibold"
          aria-label="Dismiss message"
        >
          ×
        </button>
      </div>
    </div>
  );
}
