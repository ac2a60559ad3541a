/** What a Night builder command answers: done (with a sentence for the person), or refused with a status. */
export type Refusal = { ok: false; status: 400 | 404 | 409 | 413 | 415; error: string; field?: string };
export type Done<T = null> = { ok: true; message: string; value: T };
export type CommandResult<T = null> = Done<T> | Refusal;

export const refuse = (status: Refusal["status"], error: string, field?: string): Refusal => ({
  ok: false,
  status,
  error,
  ...(field ? { field } : {}),
});

export const done = <T = null>(message: string, value: T = null as T): Done<T> => ({ ok: true, message, value });
