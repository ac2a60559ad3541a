import { expect } from "vitest";

/** Expects every one of `parts` to stand in `text`; each is checked, and reported, on its own. */
export function expectContainsAll(text: string, parts: string[]) {
  for (const part of parts) expect(text).toContain(part);
}
