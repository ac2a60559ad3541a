/** Longest search text of the Mailbox, characters (stated beside the search box; also read by the page). */
export const MAILBOX_QUERY_MAX = 200;
