import { sql } from "drizzle-orm";
import { index, jsonb, pgTable, text, uniqueIndex } from "drizzle-orm/pg-core";
import { instant, optionalRefTo, refTo, serialId } from "./columns";
import { users } from "./users";

/**
 * Sign-in state. Secrets (session tokens, e-mail link tokens, API tokens) are never stored: only
 * their SHA-256, hex-encoded.
 */
export const sessions = pgTable(
  "sessions",
  {
    /** SHA-256 of the cookie token, hex. */
    id: text("id").primaryKey(),
    userId: refTo(() => users.id),
    createdAt: instant("created_at").notNull().defaultNow(),
    expiresAt: instant("expires_at").notNull(),
    lastSeenAt: instant("last_seen_at").notNull().defaultNow(),
    /** How the session began: "sso" or "email-link". */
    method: text("method").notNull(),
    userAgent: text("user_agent").notNull().default(""),
    /** The client's address when the session began (the socket's peer, or what a trusted proxy forwarded). */
    ipAddress: text("ip_address").notNull().default(""),
  },
  (t) => [index("sessions_user_idx").on(t.userId)],
);

export const emailSignInTokens = pgTable(
  "email_sign_in_tokens",
  {
    id: serialId(),
    email: text("email").notNull(),
    tokenHash: text("token_hash").notNull(),
    createdAt: instant("created_at").notNull().defaultNow(),
    expiresAt: instant("expires_at").notNull(),
    usedAt: instant("used_at"),
  },
  (t) => [uniqueIndex("email_sign_in_tokens_hash_key").on(t.tokenHash)],
);

export const apiTokens = pgTable(
  "api_tokens",
  {
    id: serialId(),
    userId: refTo(() => users.id),
    name: text("name").notNull(),
    tokenHash: text("token_hash").notNull(),
    /** First characters of the token, shown so a person can tell tokens apart. */
    prefix: text("prefix").notNull(),
    createdAt: instant("created_at").notNull().defaultNow(),
    /**
     * What the token may do (app/lib/permissions.ts TOKEN_SCOPES): "computations:read",
     * "proposals:read", "proposals:write". A token opens the JSON API only, never a page.
     */
    scopes: text("scopes").array().$type<string[]>().notNull().default(sql`'{}'::text[]`),
    /** After this instant the token is refused (90 days after creation unless chosen otherwise). */
    expiresAt: instant("expires_at").notNull().default(sql`now() + interval '90 days'`),
    lastUsedAt: instant("last_used_at"),
    revokedAt: instant("revoked_at"),
  },
  (t) => [uniqueIndex("api_tokens_hash_key").on(t.tokenHash), index("api_tokens_user_idx").on(t.userId)],
);

/** One row per sign-in attempt, for rate limiting by address and by e-mail. */
export const signInAttempts = pgTable(
  "sign_in_attempts",
  {
    id: serialId(),
    /** "ip:<address>" or "email:<lower-case address>". */
    key: text("key").notNull(),
    attemptedAt: instant("attempted_at").notNull().defaultNow(),
  },
  (t) => [index("sign_in_attempts_key_time_idx").on(t.key, t.attemptedAt)],
);

/** Who changed what about whom, and when: role grants, revocations, deactivations. */
export const auditLog = pgTable(
  "audit_log",
  {
    id: serialId(),
    actorId: optionalRefTo(() => users.id),
    action: text("action").notNull(),
    targetUserId: optionalRefTo(() => users.id),
    detail: jsonb("detail").$type<Record<string, unknown>>().notNull().default({}),
    createdAt: instant("created_at").notNull().defaultNow(),
  },
  (t) => [index("audit_log_created_idx").on(t.createdAt)],
);
