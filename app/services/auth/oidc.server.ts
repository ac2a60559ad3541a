/**
 * Single sign-on over OpenID Connect: authorization code flow with PKCE (arctic), state and nonce
 * kept in a short-lived signed cookie, ID token verified against the provider's JWKS (jose).
 */
import {
  ArcticFetchError,
  CodeChallengeMethod,
  generateCodeVerifier,
  generateState,
  OAuth2Client,
  OAuth2RequestError,
} from "arctic";
import { createRemoteJWKSet, type JWTVerifyGetKey, jwtVerify } from "jose";
import { createCookie } from "react-router";
import * as v from "valibot";
import { env } from "~/env.server";
import { authEnv } from "./config.server";
import { safeNext } from "./next.server";
import { cookieIsSecure } from "./sessions.server";

export { safeNext };

const DiscoverySchema = v.object({
  issuer: v.string(),
  authorization_endpoint: v.pipe(v.string(), v.url()),
  token_endpoint: v.pipe(v.string(), v.url()),
  jwks_uri: v.pipe(v.string(), v.url()),
});
type Discovery = v.InferOutput<typeof DiscoverySchema>;

const FlowSchema = v.object({
  state: v.string(),
  codeVerifier: v.string(),
  nonce: v.string(),
  next: v.string(),
});

const ClaimsSchema = v.object({
  sub: v.pipe(v.string(), v.minLength(1)),
  email: v.pipe(v.string(), v.email()),
  /** OpenID Connect Core §5.1: true when the provider has checked the person owns `email`. */
  email_verified: v.optional(v.unknown()),
  name: v.optional(v.string()),
  institute: v.optional(v.string()),
});
export type SsoIdentity = {
  subject: string;
  email: string;
  emailVerified: boolean;
  name?: string;
  institute?: string;
};

export class SsoError extends Error {}

const discoveries = new Map<string, Promise<Discovery>>();
const keySets = new Map<string, JWTVerifyGetKey>();

async function discover(issuer: string): Promise<Discovery> {
  let pending = discoveries.get(issuer);
  if (!pending) {
    pending = (async () => {
      const res = await fetch(`${issuer.replace(/\/$/, "")}/.well-known/openid-configuration`, {
        signal: AbortSignal.timeout(5000),
      });
      if (!res.ok) throw new SsoError(`the sign-on service answered ${res.status} to discovery`);
      const parsed = v.safeParse(DiscoverySchema, await res.json());
      if (!parsed.success) throw new SsoError("the sign-on service's discovery document is incomplete");
      return parsed.output;
    })();
    discoveries.set(issuer, pending);
    pending.catch(() => discoveries.delete(issuer));
  }
  return pending;
}

function client() {
  const cfg = authEnv();
  return new OAuth2Client(cfg.OIDC_CLIENT_ID, cfg.OIDC_CLIENT_SECRET, `${env().APP_ORIGIN}/auth/sso/callback`);
}

function flowCookie() {
  return createCookie("fd_oidc", {
    httpOnly: true,
    sameSite: "lax",
    path: "/auth/sso",
    secure: cookieIsSecure(),
    secrets: [env().COOKIE_SECRET],
    maxAge: 600,
  });
}

/** The provider's authorization URL and the cookie that remembers state, verifier and nonce. */
export async function beginSso(next: string) {
  const cfg = authEnv();
  const discovery = await discover(cfg.issuer);
  const state = generateState();
  const codeVerifier = generateCodeVerifier();
  const nonce = generateState();
  const url = client().createAuthorizationURLWithPKCE(
    discovery.authorization_endpoint,
    state,
    CodeChallengeMethod.S256,
    codeVerifier,
    ["openid", "email", "profile"],
  );
  url.searchParams.set("nonce", nonce);
  const cookie = await flowCookie().serialize({ state, codeVerifier, nonce, next: safeNext(next) });
  return { url: url.toString(), cookie };
}

/** Checks state, exchanges the code, verifies the ID token; the identity or an SsoError with a reason. */
export async function completeSso(
  request: Request,
): Promise<{ identity: SsoIdentity; next: string; clearCookie: string }> {
  const url = new URL(request.url);
  const clearCookie = await flowCookie().serialize("", { maxAge: 0 });
  const flow = v.safeParse(FlowSchema, await flowCookie().parse(request.headers.get("Cookie")));
  if (!flow.success)
    throw new SsoError("the sign-in took too long or was started in another browser; please try again");
  const providerError = url.searchParams.get("error");
  if (providerError) throw new SsoError(`the sign-on service refused: ${providerError}`);
  const code = url.searchParams.get("code");
  const state = url.searchParams.get("state");
  if (!code || !state) throw new SsoError("the sign-on service sent no authorization code");
  if (state !== flow.output.state) throw new SsoError("the sign-in state did not match (a forged or stale request)");

  const cfg = authEnv();
  const discovery = await discover(cfg.issuer);
  let idToken: string;
  try {
    const tokens = await client().validateAuthorizationCode(discovery.token_endpoint, code, flow.output.codeVerifier);
    idToken = tokens.idToken();
  } catch (e) {
    if (e instanceof OAuth2RequestError) throw new SsoError(`the sign-on service rejected the code (${e.code})`);
    if (e instanceof ArcticFetchError) throw new SsoError("the sign-on service could not be reached");
    throw new SsoError("the sign-on service gave no ID token");
  }

  let keys = keySets.get(discovery.jwks_uri);
  if (!keys) {
    keys = createRemoteJWKSet(new URL(discovery.jwks_uri));
    keySets.set(discovery.jwks_uri, keys);
  }
  let payload: Record<string, unknown>;
  try {
    ({ payload } = await jwtVerify(idToken, keys, { issuer: discovery.issuer, audience: cfg.OIDC_CLIENT_ID }));
  } catch {
    throw new SsoError("the ID token's signature, issuer, audience or expiry did not check out");
  }
  if (payload.nonce !== flow.output.nonce) throw new SsoError("the ID token's nonce did not match this sign-in");
  const claims = v.safeParse(ClaimsSchema, payload);
  if (!claims.success) throw new SsoError("the ID token carries no usable e-mail address");
  return {
    identity: {
      subject: `${discovery.issuer} ${claims.output.sub}`,
      email: claims.output.email,
      // Only a boolean true counts (some providers send the string "true": that counts too).
      emailVerified: claims.output.email_verified === true || claims.output.email_verified === "true",
      name: claims.output.name,
      institute: claims.output.institute,
    },
    next: flow.output.next,
    clearCookie,
  };
}
