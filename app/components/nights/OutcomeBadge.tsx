/** The outcome of a block of a night plan as a badge: its own colour and words for each outcome. */
import { Badge } from "~/components/ui";
import type { BlockOutcome } from "~/db/schema/nights";

const OUTCOME = {
  planned: { tone: "info", words: "planned" },
  executed: { tone: "ok", words: "executed" },
  weather: { tone: "caution", words: "lost to weather" },
  technical: { tone: "danger", words: "lost to a technical fault" },
} as const satisfies Record<BlockOutcome, { tone: string; words: string }>;

export function OutcomeBadge({ outcome }: { outcome: BlockOutcome }) {
  return <Badge tone={OUTCOME[outcome].tone}>{OUTCOME[outcome].words}</Badge>;
}

/** The words of an outcome, for sorting and export. */
export const outcomeWords = (outcome: BlockOutcome) => OUTCOME[outcome].words;
