import { Alert } from "~/components/ui";
import type { NightActionData } from "./intents.server";

/** The last answer of a fetcher of the night page: its sentence, or its refusal. */
export function FetcherResult({ data, className }: { data: NightActionData | undefined; className?: string }) {
  if (!data) return <p role="status" className="sr-only" />;
  if (data.ok) {
    return (
      <p role="status" className={`text-sm font-medium text-ok-700 ${className ?? ""}`}>
        {data.message}
      </p>
    );
  }
  return <Alert className={className}>{data.error}</Alert>;
}
