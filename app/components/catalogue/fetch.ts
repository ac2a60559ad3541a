/**
 * Browser-side calls of the catalogue's resource routes (session cookie): a GET or a JSON POST, the
 * answer parsed, a refusal turned into an Error carrying the API's message and field.
 */

export class CatalogueApiError extends Error {
  constructor(
    readonly status: number,
    message: string,
    readonly field: string | null,
  ) {
    super(message);
    this.name = "CatalogueApiError";
  }
}

async function answer<T>(request: Promise<Response>): Promise<T> {
  let res: Response;
  try {
    res = await request;
  } catch {
    throw new CatalogueApiError(0, "The server could not be reached. Check the connection and try again.", null);
  }
  const body = (await res.json().catch(() => null)) as { error?: unknown; field?: unknown } | null;
  if (!res.ok) {
    const message =
      res.status === 401
        ? "Your session has ended: sign in again to continue."
        : typeof body?.error === "string"
          ? body.error
          : `The server answered ${res.status}.`;
    throw new CatalogueApiError(res.status, message, typeof body?.field === "string" ? body.field : null);
  }
  if (body === null) throw new CatalogueApiError(res.status, "The server's answer was not JSON.", null);
  return body as T;
}

/** GET a JSON resource (an SWR fetcher keyed by its URL). */
export function getJson<T>(url: string): Promise<T> {
  return answer<T>(fetch(url, { credentials: "same-origin", headers: { Accept: "application/json" } }));
}

/** POST a JSON body (an SWR fetcher keyed by [url, body text]). */
export function postJson<T>([url, body]: readonly [string, string]): Promise<T> {
  return answer<T>(
    fetch(url, {
      method: "POST",
      credentials: "same-origin",
      headers: { "Content-Type": "application/json", Accept: "application/json" },
      body,
    }),
  );
}

/** SWR options of the catalogue's panels: keep the last answer while the next loads, never retry a 400. */
export const SWR_OPTIONS = {
  keepPreviousData: true,
  revalidateOnFocus: false,
  revalidateOnReconnect: false,
  revalidateIfStale: false,
  shouldRetryOnError: false,
} as const;
