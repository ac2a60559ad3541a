import { afterEach, vi } from "vitest";

// House rule: a console.error during a test fails it.
const seen: unknown[][] = [];
const original = console.error;
console.error = (...args: unknown[]) => {
  seen.push(args);
  original(...args);
};

afterEach(() => {
  if (seen.length > 0) {
    const first = seen[0].map(String).join(" ");
    seen.length = 0;
    throw new Error(`console.error was called during the test: ${first}`);
  }
  vi.restoreAllMocks();
});
