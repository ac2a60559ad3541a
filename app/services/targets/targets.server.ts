/**
 * "My targets" as other features use it: the Sketchpad lists them, proposals take the band names.
 * Queries and commands live in queries.server.ts and commands.server.ts.
 */
export { createTarget, deleteTarget, importTargets, updateTarget } from "./commands.server";
export { bandNames, getTarget, listTargets, nameTaken, targetsByName } from "./queries.server";
