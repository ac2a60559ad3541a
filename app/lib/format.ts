/**
 * Formatting shared by server and browser, so both render the same text: instants in UTC with the
 * zone shown, 24-hour clock; byte sizes.
 */

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
