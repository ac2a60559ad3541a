/**
 * A small typed client for the computation API (POST /api/coverage, /api/ephemeris, /api/triangles),
 * authenticated by the session cookie, and an SWR hook keyed by the request body so an unchanged
 * sketch is never asked twice and the last answer stays on screen while the next one is computed.
 */
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

/** Posts JSON text to an API route and returns the parsed answer with its round-trip time. */
export async function postJson<T>(url: string, bodyText: string): Promise<Timed<T>> {
  const started = performance.now();
  let res: Response;
  try {
    res = await fetch(url, {
      method: "POST",
      credentials: "same-origin",
      headers: { "Content-Type": "application/json", Accept: "application/json" },
      body: bodyText,
    });
  } catch {
    throw new ApiError(0, "The server could not be reached. Check the connection and try again.", null);
  }
  const text = await res.text();
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

const fetcher = <T>([url, body]: Key) => postJson<T>(url, body);

/** Times a request refused because the computation pool was full is asked again. */
const BUSY_RETRIES = 5;

/**
 * SWR over a POST route. `body` null means "nothing to ask" (no request). The previous answer is kept
 * while a new one loads; a refusal is not asked again (a 400 stays a 400 until the input changes),
 * except "busy, try again later" (429/503 with Retry-After), asked again after the time it names.
 */
export function useApi<T>(url: string, body: unknown | null) {
  const key: Key | null = body === null ? null : [url, JSON.stringify(body)];
  return useSWR<Timed<T>, ApiError, Key | null>(key, fetcher<T>, {
    keepPreviousData: true,
    revalidateOnFocus: false,
    revalidateOnReconnect: false,
    revalidateIfStale: false,
    shouldRetryOnError: (err) => err instanceof ApiError && err.retryAfterS !== null,
    onErrorRetry: (err, _key, _config, revalidate, { retryCount }) => {
      if (!(err instanceof ApiError) || err.retryAfterS === null || retryCount > BUSY_RETRIES) return;
      setTimeout(() => revalidate({ retryCount }), err.retryAfterS * 1000);
    },
  });
}
