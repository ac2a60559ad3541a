/** A bad command-line request: the message is one line `field: reason` (exit status 2). */
export class CliRequestError extends Error {}
