/** A bad request to a CLI command: the message is one line `field: reason`; the CLI exits 2. */
export class CliRequestError extends Error {}
