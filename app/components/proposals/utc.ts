import { formatUtc } from "~/lib/format";

/** An ISO instant from a loader as "2027-01-15 12:00 UTC"; "—" for none. */
export const shownUtc = (iso: string | null | undefined) => (iso ? formatUtc(new Date(iso)) : "—");
