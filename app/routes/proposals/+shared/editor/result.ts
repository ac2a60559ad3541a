/** What the editor's action answers a card with: the intent it posted, the field errors, what was typed. */

export type Values = Record<string, string>;
export type ActionResult = { intent: string; values?: Values; errors: Record<string, string>; savedAt?: string };

/** The action's answer when it is meant for one of `intents`, else nothing. */
export function resultFor(result: ActionResult | undefined, ...intents: string[]) {
  return result && intents.includes(result.intent) ? result : undefined;
}
