/**
 * The shapes the catalogue's resource routes answer, shared by the server and the browser components
 * (types only). The contract responses themselves (`resolve`, `calibrators`) are the engine's types.
 */
import type { ResolveResponse } from "~/engine";

/** One suggestion while typing: the star's display name, another designation to tell it by, V. */
export type StarSuggestion = { hip: number; name: string; also: string | null; vMag: number };

/** The answer of `GET /api/stars?q=…`: the star the text names (if any), and names to offer. */
export type StarSuggestions = {
  query: string;
  /** The star the text resolves to, typos forgiven; null when it names none. */
  star: ResolveResponse | null;
  /** Why the text names no star (null when it does, or when the text is empty). */
  message: string | null;
  suggestions: StarSuggestion[];
};
