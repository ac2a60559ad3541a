import { sql } from "drizzle-orm";
import { boolean, pgEnum, pgTable, primaryKey, text, uniqueIndex } from "drizzle-orm/pg-core";
import { instant, refTo, serialId, timestamps } from "./columns";

/** The roles of PRODUCT.md; one person may hold several. Keep in step with app/services/permissions.ts. */
export const ROLES = ["proposer", "reviewer", "chair", "scheduler", "admin"] as const;
export type Role = (typeof ROLES)[number];
export const roleEnum = pgEnum("role", ROLES);

export const users = pgTable(
  "users",
  {
    id: serialId(),
    email: text("email").notNull(),
    name: text("name").notNull(),
    institute: text("institute").notNull().default(""),
    active: boolean("active").notNull().default(true),
    /** "<issuer> <subject>" of the single sign-on identity linked to this account, if any. */
    ssoSubject: text("sso_subject"),
    lastSignInAt: instant("last_sign_in_at"),
    ...timestamps,
  },
  (t) => [
    uniqueIndex("users_email_key").on(sql`lower(${t.email})`),
    uniqueIndex("users_sso_subject_key").on(t.ssoSubject),
  ],
);

export const userRoles = pgTable(
  "user_roles",
  {
    userId: refTo(() => users.id),
    role: roleEnum("role").notNull(),
    grantedAt: instant("granted_at").notNull().defaultNow(),
  },
  (t) => [primaryKey({ columns: [t.userId, t.role] })],
);
