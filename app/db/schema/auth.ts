import { index, jsonb, pgTable, serial, text, timestamp, uniqueIndex } from "drizzle-orm/pg-core";
import { optionalRefTo, refTo } from "./columns";
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
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    expiresAt: timestamp("expires_at", { withTimezone: true }).notNull(),
    lastSeenAt: timestamp("last_seen_at", { withTimezone: true }).notNull().defaultNow(),
    /** How the session began: "sso" or "email-link". */
    method: text("method").notNull(),
    userAgent: text("user_agent").notNull().default(""),
    ipAddress: text("ip_address").notNull().default(""),
  },
  (t) => [index("sessions_user_idx").on(t.userId)],
);

export const emailSignInTokens = pgTable(
  "email_sign_in_tokens",
  {
    id: serial("id").primaryKey(),
    email: text("email").notNull(),
    tokenHash: text("token_hash").notNull(),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    expiresAt: timestamp("expires_at", { withTimezone: true }).notNull(),
    usedAt: timestamp("used_at", { withTimezone: true }),
  },
  (t) => [uniqueIndex("email_sign_in_tokens_hash_key").on(t.tokenHash)],
);

export const apiTokens = pgTable(
  "api_tokens",
  {
    id: serial("id").primaryKey(),
    userId: refTo(() => users.id),
    name: text("name").notNull(),
    tokenHash: text("token_hash").notNull(),
    /** First characters of the token, shown so a person can tell tokens apart. */
    prefix: text("prefix").notNull(),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    lastUsedAt: timestamp("last_used_at", { withTimezone: true }),
    revokedAt: timestamp("revoked_at", { withTimezone: true }),
  },
  (t) => [uniqueIndex("api_tokens_hash_key").on(t.tokenHash), index("api_tokens_user_idx").on(t.userId)],
);

/** One row per sign-in attempt, for rate limiting by address and by e-mail. */
export const signInAttempts = pgTable(
  "sign_in_attempts",
  {
    id: serial("id").primaryKey(),
    /** "ip:<address>" or "email:<lower-case address>". */
    key: text("key").notNull(),
    attemptedAt: timestamp("attempted_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("sign_in_attempts_key_time_idx").on(t.key, t.attemptedAt)],
);

/** Who changed what about whom, and when: role grants, revocations, deactivations. */
export const auditLog = pgTable(
  "audit_log",
  {
    id: serial("id").primaryKey(),
    actorId: optionalRefTo(() => users.id),
    action: text("action").notNull(),
    targetUserId: optionalRefTo(() => users.id),
    detail: jsonb("detail").$type<Record<string, unknown>>().notNull().default({}),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("audit_log_created_idx").on(t.createdAt)],
);
