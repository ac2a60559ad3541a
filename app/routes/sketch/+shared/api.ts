/**
 * A small typed client for the computation API (POST /api/coverage, /api/ephemeris, /api/triangles),
 * authenticated by the session cookie, and an SWR hook keyed by the request body so an unchanged
 * sketch is never asked twice and the last answer stays on screen while the next one is computed.
 * A request the inputs have moved past is cancelled (its answer would only be thrown away).
 */
import { useCallback, useEffect, useRef } from "react";
import useSWR from "swr";

/** A refused or failed API call: the HTTP status, the API's message and the field it names (docs/cli.md). */
export class ApiError extends Error {
  constructor(
    readonly status: number,
    message: string,
    readonly field: string | null,
    /** Seconds the server asked to wait (Retry-After of a 429 or 503: the computation pool was full). */
    readonly retryAfterS: number | null = null,
  ) {
    super(message);
    this.name = "ApiError";
  }
}

export interface Timed<T> {
  result: T;
  /** Round trip in milliseconds, request to parsed answer. */
  elapsedMs: number;
  /** The JSON request text this answers (the panels read their inputs from it, not from the form). */
  request: string;
}

/** True for the rejection of a request that was cancelled because the inputs moved on. */
export function isCancelled(e: unknown): boolean {
  return e instanceof DOMException && e.name === "AbortError";
}

/** Posts JSON text to an API route and returns the parsed answer with its round-trip time. */
export async function postJson<T>(url: string, bodyText: string, signal?: AbortSignal): Promise<Timed<T>> {
  const started = performance.now();
  let res: Response;
  try {
    res = await fetch(url, {
      method: "POST",
      credentials: "same-origin",
      headers: { "Content-Type": "application/json", Accept: "application/json" },
      body: bodyText,
      signal,
    });
  } catch (e) {
    if (isCancelled(e)) throw e;
    throw new ApiError(0, "The server could not be reached. Check the connection and try again.", null);
  }
  const text = await res.text(); // rejects with AbortError when cancelled meanwhile
  let json: unknown = null;
  try {
    json = JSON.parse(text);
  } catch {
    // not JSON: handled below
  }
  if (!res.ok) {
    const body = (json ?? {}) as { error?: unknown; field?: unknown };
    const message =
      res.status === 401
        ? "Your session has ended: sign in again to continue."
        : typeof body.error === "string"
          ? body.error
          : `The server answered ${res.status}.`;
    const retryAfter = Number(res.headers.get("Retry-After"));
    throw new ApiError(
      res.status,
      message,
      typeof body.field === "string" ? body.field : null,
      (res.status === 429 || res.status === 503) && retryAfter > 0 ? retryAfter : null,
    );
  }
  if (json === null) throw new ApiError(res.status, "The server's answer was not JSON.", null);
  return { result: json as T, elapsedMs: performance.now() - started, request: bodyText };
}

type Key = readonly [string, string];

/** Times a request refused because the computation pool was full is asked again. */
const BUSY_RETRIES = 5;

/**
 * SWR over a POST route. `body` null means "nothing to ask" (no request). The previous answer is kept
 * while a new one loads; a refusal is not asked again (a 400 stays a 400 until the input changes),
 * except "busy, try again later" (429/503 with Retry-After), asked again after the time it names.
 * When the body changes, the request still under way for the old one is aborted (through the
 * fetcher's AbortController); a cancelled request leaves no error behind.
 */
export function useApi<T>(url: string, body: unknown | null) {
  const key: Key | null = body === null ? null : [url, JSON.stringify(body)];
  const keyText = key?.[1] ?? null;
  const inFlight = useRef<{ body: string; controller: AbortController } | null>(null);

  const fetcher = useCallback(async ([u, b]: Key) => {
    inFlight.current?.controller.abort();
    const controller = new AbortController();
    const mine = { body: b, controller };
    inFlight.current = mine;
    try {
      return await postJson<T>(u, b, controller.signal);
    } finally {
      if (inFlight.current === mine) inFlight.current = null;
    }
  }, []);

  // Inputs moved on (to an answer already at hand, or to nothing to ask): cancel what is under way.
  useEffect(() => {
    if (inFlight.current && inFlight.current.body !== keyText) {
      inFlight.current.controller.abort();
      inFlight.current = null;
    }
  }, [keyText]);

  const swr = useSWR<Timed<T>, ApiError | DOMException, Key | null>(key, fetcher, {
    keepPreviousData: true,
    revalidateOnFocus: false,
    revalidateOnReconnect: false,
    revalidateIfStale: false,
    shouldRetryOnError: (err) => err instanceof ApiError && err.retryAfterS !== null,
    onErrorRetry: (err, _key, _config, revalidate, { retryCount }) => {
      if (!(err instanceof ApiError) || err.retryAfterS === null || retryCount > BUSY_RETRIES) return;
      setTimeout(() => revalidate({ retryCount }), err.retryAfterS * 1000);
    },
    // A cancelled request must not be reused when its inputs come back a moment later.
    dedupingInterval: 0,
  });
  const error = swr.error instanceof ApiError ? swr.error : undefined;
  return {
    data: swr.data,
    error,
    isValidating: swr.isValidating,
    /** The answer (or refusal) at hand is for the body asked now. */
    current: keyText !== null && (swr.data?.request === keyText || (error !== undefined && !swr.isValidating)),
  };
}
