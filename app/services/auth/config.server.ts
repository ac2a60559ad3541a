import * as v from "valibot";
import { env } from "~/env.server";
import { envPort } from "~/lib/env-values";

/**
 * Sign-in settings. Without OIDC_ISSUER the app uses the local fake identity provider that
 * `npm start`, `npm run dev` and the tests start on loopback (FAKE_IDP_PORT).
 */
const AuthEnvSchema = v.object({
  OIDC_ISSUER: v.optional(v.pipe(v.string(), v.url("must be a URL"))),
  OIDC_CLIENT_ID: v.optional(v.pipe(v.string(), v.minLength(1)), "fringe-docket"),
  OIDC_CLIENT_SECRET: v.optional(v.pipe(v.string(), v.minLength(1)), "fringe-docket-local-secret"),
  FAKE_IDP_PORT: envPort("9411"),
  /** Label of the sign-in button. */
  OIDC_PROVIDER_NAME: v.optional(v.string(), "Observatory single sign-on"),
});

export type AuthEnv = v.InferOutput<typeof AuthEnvSchema> & { issuer: string; usingFakeProvider: boolean };

export function parseAuthEnv(source: Record<string, string | undefined>): AuthEnv {
  const result = v.safeParse(AuthEnvSchema, source);
  if (!result.success) {
    const issue = result.issues[0];
    const key = issue.path?.map((p) => String(p.key)).join(".") ?? "?";
    throw new Error(`Invalid environment: ${key}: ${issue.message}`);
  }
  const out = result.output;
  const usingFakeProvider = !out.OIDC_ISSUER;
  return { ...out, issuer: out.OIDC_ISSUER ?? `http://127.0.0.1:${out.FAKE_IDP_PORT}`, usingFakeProvider };
}

export function authEnv(): AuthEnv {
  return parseAuthEnv(process.env);
}

/** What the sign-in page offers: the sign-on button's label, and whether the local stand-ins are in use. */
export function signInOptions() {
  const auth = authEnv();
  return {
    providerName: auth.OIDC_PROVIDER_NAME,
    usingFakeProvider: auth.usingFakeProvider,
    demoMode: env().DEMO_MODE === "1",
  };
}

export const SESSION_COOKIE = "fd_session";
/** Sessions last 30 days from the last use (sliding). */
export const SESSION_LIFETIME_MS = 30 * 24 * 3600 * 1000;
/** A session is pushed forward when less than this remains, so not every request writes. */
export const SESSION_RENEW_BEFORE_MS = 15 * 24 * 3600 * 1000;
export const EMAIL_LINK_LIFETIME_MS = 15 * 60 * 1000;
/**
 * A sign-in link is only worth sending while at least this much of its life is left (time to read
 * the message and press the button); later it is not sent at all and the person is asked to request
 * a new one.
 */
export const EMAIL_LINK_USEFUL_MS = 3 * 60 * 1000;

/** Sign-in attempts allowed per window, by client address and by e-mail address (the defaults). */
export const RATE_LIMITS = {
  windowMs: 15 * 60 * 1000,
  perAddress: 30,
  perEmail: 5,
} as const;

/** The limits in force: the per-address count from SIGN_IN_ATTEMPTS_PER_ADDRESS. */
export function signInRateLimits(): { windowMs: number; perAddress: number; perEmail: number } {
  return { ...RATE_LIMITS, perAddress: env().SIGN_IN_ATTEMPTS_PER_ADDRESS };
}
