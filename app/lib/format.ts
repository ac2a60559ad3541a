/**
 * Formatting shared by server and browser, so both render the same text: instants in UTC with the
 * zone shown, 24-hour clock; byte sizes; counted nouns.
 */

/** "1 triangle", "3 triangles", "0 samples"; `many` for irregular plurals. */
export function plural(n: number, one: string, many = `${one}s`): string {
  return `${n} ${n === 1 ? one : many}`;
}

/** "2027-01-15 12:00 UTC" */
export function formatUtc(d: Date): string {
  return `${d.toISOString().slice(0, 16).replace("T", " ")} UTC`;
}

/** `formatUtc`, or null for no instant. */
export function utcText(at: Date | null): string | null {
  return at ? formatUtc(at) : null;
}

/** `Date` → the `datetime-local` input value in UTC ("2027-01-15T12:00"). */
export function toUtcInput(d: Date): string {
  return d.toISOString().slice(0, 16);
}

/** "812 B", "14.2 KB", "3.4 MB" (1 KB = 1024 B). */
export function formatBytes(n: number): string {
  if (n < 1024) return `${n} B`;
  if (n < 1024 * 1024) return `${(n / 1024).toFixed(1)} KB`;
  return `${(n / (1024 * 1024)).toFixed(1)} MB`;
}
