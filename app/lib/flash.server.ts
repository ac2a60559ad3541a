import { createCookie, data, redirect } from "react-router";
import * as v from "valibot";
import type { FlashMessage } from "~/components/ui/Toast";
import { env } from "~/env.server";

const FlashSchema = v.object({
  kind: v.picklist(["success", "error", "info"]),
  text: v.pipe(v.string(), v.maxLength(500)),
});

function flashCookie() {
  return createCookie("fd_flash", {
    httpOnly: true,
    sameSite: "lax",
    path: "/",
    secure: env().NODE_ENV === "production" && env().APP_ORIGIN.startsWith("https:"),
    secrets: [env().COOKIE_SECRET],
    maxAge: 60,
  });
}

/** Redirects and shows `message` on the next page (one time only). */
export async function redirectWithFlash(to: string, message: FlashMessage, init: ResponseInit = {}) {
  const headers = new Headers(init.headers);
  headers.append("Set-Cookie", await flashCookie().serialize(message));
  return redirect(to, { ...init, headers });
}

/** Reads the pending flash message (if any) and the header that clears it. */
export async function readFlash(request: Request): Promise<{ flash: FlashMessage | null; headers: Headers }> {
  const headers = new Headers();
  const raw = await flashCookie().parse(request.headers.get("Cookie"));
  if (raw == null) return { flash: null, headers };
  headers.append("Set-Cookie", await flashCookie().serialize("", { maxAge: 0 }));
  const parsed = v.safeParse(FlashSchema, raw);
  return { flash: parsed.success ? parsed.output : null, headers };
}

export { data };
