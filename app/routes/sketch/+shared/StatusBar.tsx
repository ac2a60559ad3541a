/**
 * The strip above the results of the Sketchpad and the Triangle finder: whether an answer is being
 * computed and what is shown, and a copy-link button for the page header.
 */
import { type ReactNode, useState } from "react";
import { Button, cx } from "~/components/ui";
import { formatDeclination, formatRightAscension } from "~/lib/coordinates";
import type { CoverageBody } from "~/services/sketch/request";

export function CopyLinkButton() {
  const [status, setStatus] = useState<string>("");
  return (
    <div className="flex items-center gap-2">
      <Button
        variant="secondary"
        onClick={async () => {
          try {
            await navigator.clipboard.writeText(window.location.href);
            setStatus("Link copied.");
          } catch {
            setStatus("Copying was refused: copy the address bar instead.");
          }
        }}
      >
        Copy link
      </Button>
      <span role="status" aria-live="polite" className="text-sm text-night-600">
        {status}
      </span>
    </div>
  );
}

export function Busy({ busy, text, problem = false }: { busy: boolean; text: string; problem?: boolean }) {
  return (
    <span
      role="status"
      aria-live="polite"
      data-sketch-status="true"
      className="inline-flex items-center gap-2 text-sm text-night-700"
    >
      <span
        aria-hidden="true"
        className={cx(
          "inline-block h-3 w-3 rounded-full",
          busy ? "animate-pulse bg-ember-500" : problem ? "bg-danger-700" : "bg-ok-700",
        )}
      />
      {text}
    </span>
  );
}

/** The status line (`Busy`) with what the results show on its right. */
export function StatusBar({
  children,
  ...busy
}: {
  busy: boolean;
  text: string;
  problem?: boolean;
  children?: ReactNode;
}) {
  return (
    <div className="flex flex-wrap items-center justify-between gap-2 rounded-lg bg-white px-4 py-2 ring-1 ring-night-200">
      <Busy {...busy} />
      {children}
    </div>
  );
}

/** What the panels show: the target, its coordinates (degrees in the tooltip), the stations and the night. */
export function ShownTarget({ body }: { body: CoverageBody }) {
  const { target } = body;
  return (
    <span className="text-sm text-night-600">
      {target.name ? `${target.name}: ` : ""}
      <abbr
        className="num no-underline"
        title={`RA ${target.raDeg.toFixed(4)}°, Dec ${target.decDeg >= 0 ? "+" : ""}${target.decDeg.toFixed(4)}° (J2000)`}
      >
        {formatRightAscension(target.raDeg, 1)} {formatDeclination(target.decDeg, 0)}
      </abbr>{" "}
      · {body.stations.map((s) => s.name).join(" ")} · {body.night ? `night of ${body.night.date}` : "hour angles"}
    </span>
  );
}
