/**
 * A local OpenID Connect identity provider for development and tests, on loopback only.
 * Discovery, authorization (a page to pick or type an identity), token (authorization code + PKCE
 * S256, client secret by HTTP Basic or form) and JWKS endpoints; ID tokens signed with RS256.
 * The subject (`sub`) is derived from the e-mail address unless the authorization post names one
 * (`sub`, for tests); `email_verified` is true unless the post says `email_verified=0` (the typed
 * identity's "not verified" choice).
 *
 * Standalone: `node --import tsx scripts/fakes/identity-provider.ts` (FAKE_IDP_PORT, default 9411).
 */
import { createHash, randomBytes } from "node:crypto";
import { createServer, type IncomingMessage, type ServerResponse } from "node:http";
import type { AddressInfo } from "node:net";
import { exportJWK, generateKeyPair, type JWK, SignJWT } from "jose";

export type FakeIdentity = {
  email: string;
  name: string;
  institute?: string;
  /** The `sub` claim; derived from the e-mail address when absent. */
  subject?: string;
  /** The `email_verified` claim; true when absent. */
  emailVerified?: boolean;
};
export type FakeClient = { clientId: string; clientSecret: string; redirectUris: string[] };

type PendingCode = {
  clientId: string;
  redirectUri: string;
  codeChallenge: string;
  nonce: string | null;
  identity: FakeIdentity;
  expiresAt: number;
};

export type FakeIdpOptions = {
  host?: string;
  port?: number;
  clients: FakeClient[];
  /** Identities offered as one-click choices on the sign-in page. */
  people?: FakeIdentity[];
  /** How long an authorization code stays valid, ms (default 60 s). */
  codeTtlMs?: number;
  idTokenTtlS?: number;
};

const escapeHtml = (s: string) =>
  s.replace(/[&<>"']/g, (c) => ({ "&": "&amp;", "<": "&lt;", ">": "&gt;", '"': "&quot;", "'": "&#39;" })[c]!);

function subjectFor(email: string) {
  return createHash("sha256").update(email.trim().toLowerCase()).digest("hex").slice(0, 24);
}

async function readBody(req: IncomingMessage, limit = 64 * 1024): Promise<string> {
  let size = 0;
  const chunks: Buffer[] = [];
  for await (const chunk of req) {
    size += (chunk as Buffer).length;
    if (size > limit) throw new Error("body too large");
    chunks.push(chunk as Buffer);
  }
  return Buffer.concat(chunks).toString("utf8");
}

function json(res: ServerResponse, status: number, body: unknown) {
  res.writeHead(status, { "Content-Type": "application/json", "Cache-Control": "no-store" });
  res.end(JSON.stringify(body));
}

function page(res: ServerResponse, status: number, title: string, body: string) {
  res.writeHead(status, { "Content-Type": "text/html; charset=utf-8" });
  res.end(`<!doctype html><html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width,initial-scale=1">
<title>${escapeHtml(title)}</title>
<style>
 body{font-family:system-ui,sans-serif;background:#f4f6fa;color:#161c2d;margin:0}
 main{max-width:560px;margin:2rem auto;padding:1.5rem;background:#fff;border-radius:12px;box-shadow:0 1px 8px #0d122012}
 h1{font-size:1.3rem;margin:0 0 .25rem} p.note{color:#414c66;font-size:.9rem;margin:.25rem 0 1rem}
 button{font:inherit;cursor:pointer} .who{display:block;width:100%;text-align:left;margin:.35rem 0;padding:.6rem .8rem;border:1px solid #a5b0c8;border-radius:8px;background:#fff}
 .who:hover,.who:focus-visible{border-color:#a03611;outline:3px solid #e35a1a55}
 .who small{display:block;color:#414c66}
 label{display:block;margin:.6rem 0 .2rem;font-weight:600;font-size:.9rem}
 input,select{font:inherit;width:100%;box-sizing:border-box;padding:.5rem;border:1px solid #a5b0c8;border-radius:8px}
 .go{margin-top:1rem;background:#a03611;color:#fff;border:0;border-radius:8px;padding:.6rem 1rem}
 .err{color:#a3261c;font-weight:600}
</style></head><body><main>${body}</main></body></html>`);
}

/** The provider's 400 page for an authorization request it will not serve. */
function cannotSignIn(res: ServerResponse, error: string | undefined) {
  return page(res, 400, "Sign-on error", `<h1>Cannot sign in</h1><p class="err">${escapeHtml(error ?? "")}</p>`);
}

export async function startFakeIdentityProvider(options: FakeIdpOptions) {
  const host = options.host ?? "127.0.0.1";
  const codeTtlMs = options.codeTtlMs ?? 60_000;
  const idTokenTtlS = options.idTokenTtlS ?? 600;
  const { publicKey, privateKey } = await generateKeyPair("RS256");
  const kid = randomBytes(8).toString("hex");
  const publicJwk: JWK = { ...(await exportJWK(publicKey)), kid, alg: "RS256", use: "sig" };
  const codes = new Map<string, PendingCode>();
  let issuer = "";

  const findClient = (id: string | null) => options.clients.find((c) => c.clientId === id);

  /** Checks an authorization request; returns an error text or the parsed parameters. */
  function checkAuthorize(params: URLSearchParams) {
    const client = findClient(params.get("client_id"));
    if (!client) return { error: "unknown client_id" } as const;
    const redirectUri = params.get("redirect_uri") ?? "";
    if (!client.redirectUris.includes(redirectUri))
      return { error: `redirect_uri not registered for this client: ${redirectUri}` } as const;
    if (params.get("response_type") !== "code") return { error: "response_type must be code" } as const;
    const challenge = params.get("code_challenge");
    if (!challenge || params.get("code_challenge_method") !== "S256")
      return { error: "PKCE with S256 is required" } as const;
    if (!(params.get("scope") ?? "").split(" ").includes("openid"))
      return { error: "scope must include openid" } as const;
    return { client, redirectUri, challenge, state: params.get("state"), nonce: params.get("nonce") } as const;
  }

  function hiddenFields(params: URLSearchParams) {
    const keep = [
      "client_id",
      "redirect_uri",
      "response_type",
      "code_challenge",
      "code_challenge_method",
      "scope",
      "state",
      "nonce",
    ];
    return keep
      .filter((k) => params.has(k))
      .map((k) => `<input type="hidden" name="${k}" value="${escapeHtml(params.get(k) ?? "")}">`)
      .join("");
  }

  function signInPage(res: ServerResponse, params: URLSearchParams, error?: string) {
    const hidden = hiddenFields(params);
    const people = (options.people ?? [])
      .map(
        (p) => `<form method="post" action="/authorize">${hidden}
<input type="hidden" name="email" value="${escapeHtml(p.email)}"><input type="hidden" name="name" value="${escapeHtml(p.name)}">
<input type="hidden" name="institute" value="${escapeHtml(p.institute ?? "")}">
<button class="who" type="submit">${escapeHtml(p.name)}<small>${escapeHtml(p.email)} · ${escapeHtml(p.institute ?? "")}</small></button></form>`,
      )
      .join("");
    page(
      res,
      error ? 400 : 200,
      "Local sign-on",
      `<h1>Local sign-on service</h1><p class="note">A stand-in for the observatory's identity provider, for development and tests only. Pick an identity or type one.</p>
${error ? `<p class="err" role="alert">${escapeHtml(error)}</p>` : ""}
${people ? `<h2 style="font-size:1rem">Demo people</h2>${people}` : ""}
<h2 style="font-size:1rem;margin-top:1.5rem">Someone else</h2>
<form method="post" action="/authorize">${hidden}
<label for="name">Name</label><input id="name" name="name" required maxlength="200">
<label for="email">E-mail</label><input id="email" name="email" type="email" required maxlength="254">
<label for="institute">Institute</label><input id="institute" name="institute" maxlength="200">
<label for="email_verified">E-mail address</label><select id="email_verified" name="email_verified"><option value="1">verified by this service</option><option value="0">not verified</option></select>
<button class="go" type="submit">Sign in as this person</button></form>`,
    );
  }

  async function handleToken(req: IncomingMessage, res: ServerResponse) {
    const form = new URLSearchParams(await readBody(req));
    let clientId = form.get("client_id");
    let clientSecret = form.get("client_secret");
    const basic = req.headers.authorization;
    if (basic?.startsWith("Basic ")) {
      const decoded = Buffer.from(basic.slice(6), "base64").toString("utf8");
      const i = decoded.indexOf(":");
      clientId = decodeURIComponent(decoded.slice(0, i));
      clientSecret = decodeURIComponent(decoded.slice(i + 1));
    }
    const client = findClient(clientId);
    if (!client || client.clientSecret !== clientSecret) return json(res, 401, { error: "invalid_client" });
    if (form.get("grant_type") !== "authorization_code") return json(res, 400, { error: "unsupported_grant_type" });
    const code = form.get("code") ?? "";
    const pending = codes.get(code);
    codes.delete(code); // single use, whatever happens next
    if (!pending || pending.clientId !== client.clientId)
      return json(res, 400, { error: "invalid_grant", error_description: "unknown or used code" });
    if (Date.now() > pending.expiresAt)
      return json(res, 400, { error: "invalid_grant", error_description: "code expired" });
    if (form.get("redirect_uri") && form.get("redirect_uri") !== pending.redirectUri)
      return json(res, 400, { error: "invalid_grant", error_description: "redirect_uri mismatch" });
    const verifier = form.get("code_verifier") ?? "";
    const challenge = createHash("sha256").update(verifier).digest("base64url");
    if (challenge !== pending.codeChallenge)
      return json(res, 400, { error: "invalid_grant", error_description: "PKCE verification failed" });
    const now = Math.floor(Date.now() / 1000);
    const claims: Record<string, unknown> = {
      email: pending.identity.email,
      email_verified: pending.identity.emailVerified !== false,
      name: pending.identity.name,
      institute: pending.identity.institute ?? "",
    };
    if (pending.nonce) claims.nonce = pending.nonce;
    const idToken = await new SignJWT(claims)
      .setProtectedHeader({ alg: "RS256", kid })
      .setIssuer(issuer)
      .setSubject(pending.identity.subject ?? subjectFor(pending.identity.email))
      .setAudience(client.clientId)
      .setIssuedAt(now)
      .setExpirationTime(now + idTokenTtlS)
      .sign(privateKey);
    return json(res, 200, {
      access_token: randomBytes(24).toString("base64url"),
      token_type: "Bearer",
      expires_in: 600,
      id_token: idToken,
      scope: "openid email profile",
    });
  }

  async function handle(req: IncomingMessage, res: ServerResponse) {
    const url = new URL(req.url ?? "/", issuer);
    if (req.method === "GET" && url.pathname === "/.well-known/openid-configuration") {
      return json(res, 200, {
        issuer,
        authorization_endpoint: `${issuer}/authorize`,
        token_endpoint: `${issuer}/token`,
        jwks_uri: `${issuer}/jwks`,
        response_types_supported: ["code"],
        subject_types_supported: ["public"],
        id_token_signing_alg_values_supported: ["RS256"],
        code_challenge_methods_supported: ["S256"],
        token_endpoint_auth_methods_supported: ["client_secret_basic", "client_secret_post"],
        scopes_supported: ["openid", "email", "profile"],
      });
    }
    if (req.method === "GET" && url.pathname === "/jwks") return json(res, 200, { keys: [publicJwk] });
    if (req.method === "GET" && url.pathname === "/favicon.ico") {
      res.writeHead(204);
      return res.end();
    }
    if (url.pathname === "/authorize" && req.method === "GET") {
      const checked = checkAuthorize(url.searchParams);
      if ("error" in checked) return cannotSignIn(res, checked.error);
      return signInPage(res, url.searchParams);
    }
    if (url.pathname === "/authorize" && req.method === "POST") {
      const form = new URLSearchParams(await readBody(req));
      const checked = checkAuthorize(form);
      if ("error" in checked) return cannotSignIn(res, checked.error);
      const email = (form.get("email") ?? "").trim();
      const name = (form.get("name") ?? "").trim();
      if (!/^[^@\s]+@[^@\s]+\.[^@\s]+$/.test(email) || email.length > 254)
        return signInPage(res, form, "Please give a valid e-mail address.");
      if (!name) return signInPage(res, form, "Please give a name.");
      const code = randomBytes(24).toString("base64url");
      codes.set(code, {
        clientId: checked.client.clientId,
        redirectUri: checked.redirectUri,
        codeChallenge: checked.challenge,
        nonce: checked.nonce,
        identity: {
          email,
          name: name.slice(0, 200),
          institute: (form.get("institute") ?? "").slice(0, 200),
          subject: form.get("sub")?.trim().slice(0, 200) || undefined,
          emailVerified: form.get("email_verified") !== "0",
        },
        expiresAt: Date.now() + codeTtlMs,
      });
      const target = new URL(checked.redirectUri);
      target.searchParams.set("code", code);
      if (checked.state) target.searchParams.set("state", checked.state);
      res.writeHead(302, { Location: target.toString() });
      return res.end();
    }
    if (url.pathname === "/token" && req.method === "POST") return handleToken(req, res);
    return json(res, 404, { error: "not_found" });
  }

  const server = createServer((req, res) => {
    handle(req, res).catch((e: Error) => {
      if (!res.headersSent) json(res, 400, { error: "invalid_request", error_description: e.message });
      else res.end();
    });
  });
  await new Promise<void>((resolve, reject) => {
    server.once("error", reject);
    server.listen(options.port ?? 0, host, () => resolve());
  });
  const port = (server.address() as AddressInfo).port;
  issuer = `http://${host}:${port}`;
  return {
    issuer,
    port,
    stop: () =>
      new Promise<void>((resolve) => {
        server.closeAllConnections?.();
        server.close(() => resolve());
      }),
  };
}

// Standalone run.
if (import.meta.url === `file://${process.argv[1]}`) {
  const { DEMO_PEOPLE } = await import("../../app/db/seed/scenario");
  const origin = process.env.APP_ORIGIN ?? "http://localhost:3000";
  const idp = await startFakeIdentityProvider({
    port: Number(process.env.FAKE_IDP_PORT ?? 9411),
    clients: [
      {
        clientId: process.env.OIDC_CLIENT_ID ?? "fringe-docket",
        clientSecret: process.env.OIDC_CLIENT_SECRET ?? "fringe-docket-local-secret",
        redirectUris: [`${origin}/auth/sso/callback`],
      },
    ],
    people: DEMO_PEOPLE,
  });
  console.log(`[idp] local sign-on service on ${idp.issuer}`);
}
