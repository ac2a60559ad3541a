/** A bad request to a command: the message is `<field>: <reason>`; the CLI prints it and exits 2. */
export class CliRequestError extends Error {}
