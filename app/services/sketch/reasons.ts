/**
 * Why a sample of a coverage answer is not observable, sorted into the rules of the computation
 * (docs/cli.md, "observable"): below the minimum elevation, the Sun above −18°, a delay line out of
 * range. The API gives one line per sample naming each failed rule ("elevation 12.0° below minimum
 * 30.0°; delay line out of range on 2 baselines (…)"); the figures mark each sample by the first rule
 * it fails in the order below and show the whole line on hover. Pure.
 */

export type BlockKind = "elevation" | "sun" | "delayLine" | "other";

/** The rules in the order a sample that fails several is marked by. */
export const BLOCK_KINDS: readonly BlockKind[] = ["elevation", "sun", "delayLine", "other"];

/** How the legend and the hover name each rule. */
export const BLOCK_LABELS: Record<BlockKind, string> = {
  elevation: "Below the minimum elevation",
  sun: "Sun above −18°",
  delayLine: "Delay line out of range",
  other: "Not observable",
};

function kindOf(part: string): BlockKind {
  if (/^elevation\b/i.test(part)) return "elevation";
  if (/^Sun\b/.test(part)) return "sun";
  if (/^delay line\b/i.test(part)) return "delayLine";
  return "other";
}

/** Every rule a sample's reason names, in the order of BLOCK_KINDS (empty for no reason). */
export function blockKinds(reason: string | null | undefined): BlockKind[] {
  if (!reason) return [];
  const found = new Set(
    reason
      .split(";")
      .map((p) => p.trim())
      .filter((p) => p !== "")
      .map(kindOf),
  );
  return BLOCK_KINDS.filter((k) => found.has(k));
}

/** The rule a sample is marked by: the first it fails (null when it names none). */
export function primaryBlock(reason: string | null | undefined): BlockKind | null {
  return blockKinds(reason)[0] ?? null;
}

/** The reason as hover text: each failed rule on a line of its own, starting with a capital. */
export function reasonLines(reason: string | null | undefined): string {
  if (!reason) return "";
  return reason
    .split(";")
    .map((p) => p.trim())
    .filter((p) => p !== "")
    .map((p) => p[0].toUpperCase() + p.slice(1))
    .join("<br>");
}
