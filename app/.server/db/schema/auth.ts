import {
  boolean,
  char,
  index,
  json,
  mysqlEnum,
  mysqlTable,
  timestamp,
  uniqueIndex,
  varchar,
} from "drizzle-orm/mysql-core";
import { API_SCOPES, type ApiScope } from "../../../utils/api-scopes";
import { OUTPUT_SYSTEMS } from "../../../core/units/output";
import { ROLES } from "../../../utils/permissions";
import { createdAt, id, ref, updatedAt } from "./columns";

// Roles and scopes are declared once in app/utils (schema files import only drizzle-orm and relative paths).
export { API_SCOPES, ROLES };
export type { ApiScope } from "../../../utils/api-scopes";
export type { Role } from "../../../utils/permissions";

// The unit systems a person may choose, declared once in app/core/units/output.ts.
export const UNIT_SYSTEMS = OUTPUT_SYSTEMS;

export const users = mysqlTable(
  "users",
  {
    id: id(),
    email: varchar("email", { length: 254 }).notNull(),
    name: varchar("name", { length: 120 }).notNull(),
    role: mysqlEnum("role", ROLES).notNull().default("viewer"),
    passwordHash: varchar("password_hash", { length: 255 }),
    unitSystem: mysqlEnum("unit_system", UNIT_SYSTEMS)
      .notNull()
      .default("field"),
    disabledAt: timestamp("disabled_at", { fsp: 3, mode: "date" }),
    /** When the owner was last told that their account is under attack (at most one message per window). */
    signInAlertAt: timestamp("sign_in_alert_at", { fsp: 3, mode: "date" }),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [uniqueIndex("users_email_unique").on(t.email)],
);

/** A signed-in browser. `id` is hex(SHA-256(token)); the token itself lives only in the cookie. */
export const sessions = mysqlTable(
  "sessions",
  {
    id: char("id", { length: 64 }).primaryKey(),
    userId: ref("user_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    expiresAt: timestamp("expires_at", { fsp: 3, mode: "date" }).notNull(),
    createdAt: createdAt(),
    ipAddress: varchar("ip_address", { length: 64 }),
    userAgent: varchar("user_agent", { length: 255 }),
  },
  (t) => [
    index("sessions_user_id_idx").on(t.userId),
    index("sessions_expires_at_idx").on(t.expiresAt),
  ],
);

/** A token for simulators and scripts. `id` is the JWT's `jti`; the JWT itself is shown once and never stored. */
export const apiTokens = mysqlTable(
  "api_tokens",
  {
    id: char("id", { length: 36 }).primaryKey(),
    userId: ref("user_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    name: varchar("name", { length: 120 }).notNull(),
    scopes: json("scopes").$type<ApiScope[]>().notNull(),
    /** Optional restriction: only these fields and/or samples; null = everything the owner may read. */
    restriction: json("restriction").$type<{
      fieldIds?: number[];
      sampleIds?: number[];
    } | null>(),
    expiresAt: timestamp("expires_at", { fsp: 3, mode: "date" }).notNull(),
    lastUsedAt: timestamp("last_used_at", { fsp: 3, mode: "date" }),
    revokedAt: timestamp("revoked_at", { fsp: 3, mode: "date" }),
    revokedBy: ref("revoked_by").references(() => users.id, {
      onDelete: "set null",
    }),
    createdAt: createdAt(),
  },
  (t) => [index("api_tokens_user_id_idx").on(t.userId)],
);

/** Append-only record of who did what. */
export const auditLog = mysqlTable(
  "audit_log",
  {
    id: id(),
    createdAt: createdAt(),
    userId: ref("user_id").references(() => users.id, { onDelete: "set null" }),
    apiTokenId: char("api_token_id", { length: 36 }),
    action: varchar("action", { length: 64 }).notNull(),
    entityType: varchar("entity_type", { length: 40 }),
    entityId: varchar("entity_id", { length: 64 }),
    details: json("details").$type<Record<string, unknown>>(),
    ipAddress: varchar("ip_address", { length: 64 }),
  },
  (t) => [
    index("audit_log_created_at_idx").on(t.createdAt),
    index("audit_log_user_id_idx").on(t.userId),
  ],
);

export type User = typeof users.$inferSelect;
export type NewUser = typeof users.$inferInsert;
export type Session = typeof sessions.$inferSelect;
export type ApiToken = typeof apiTokens.$inferSelect;
export type AuditLogEntry = typeof auditLog.$inferSelect;

export const LINK_TOKEN_KINDS = ["invitation", "password_reset"] as const;
export type LinkTokenKind = (typeof LINK_TOKEN_KINDS)[number];

/** Single-use links sent by e-mail. Only the SHA-256 of the token is stored; a used or expired link is dead. */
export const linkTokens = mysqlTable(
  "link_tokens",
  {
    id: id(),
    kind: mysqlEnum("kind", LINK_TOKEN_KINDS).notNull(),
    tokenHash: char("token_hash", { length: 64 }).notNull(),
    email: varchar("email", { length: 254 }).notNull(),
    /** Role offered by an invitation. */
    role: mysqlEnum("role", ROLES),
    /** Account whose password a reset link changes. */
    userId: ref("user_id").references(() => users.id, { onDelete: "cascade" }),
    createdBy: ref("created_by").references(() => users.id, {
      onDelete: "set null",
    }),
    expiresAt: timestamp("expires_at", { fsp: 3, mode: "date" }).notNull(),
    usedAt: timestamp("used_at", { fsp: 3, mode: "date" }),
    createdAt: createdAt(),
  },
  (t) => [
    uniqueIndex("link_tokens_token_hash_unique").on(t.tokenHash),
    index("link_tokens_email_idx").on(t.email),
  ],
);

/**
 * Every sign-in attempt, for throttling and for the audit trail. A row is written (as a failure) before the
 * password is checked, so concurrent guesses see each other; a success then flips it.
 */
export const signInAttempts = mysqlTable(
  "sign_in_attempts",
  {
    id: id(),
    email: varchar("email", { length: 254 }).notNull(),
    ipAddress: varchar("ip_address", { length: 64 }).notNull(),
    succeeded: boolean("succeeded").notNull(),
    createdAt: createdAt(),
  },
  (t) => [
    index("sign_in_attempts_email_created_at_idx").on(t.email, t.createdAt),
    index("sign_in_attempts_ip_address_created_at_idx").on(
      t.ipAddress,
      t.createdAt,
    ),
    index("sign_in_attempts_email_ip_address_created_at_idx").on(
      t.email,
      t.ipAddress,
      t.createdAt,
    ),
  ],
);

/** Every "forgot password" request, known address or not, for the quiet per-address and per-client limits. */
export const passwordResetRequests = mysqlTable(
  "password_reset_requests",
  {
    id: id(),
    email: varchar("email", { length: 254 }).notNull(),
    ipAddress: varchar("ip_address", { length: 64 }).notNull(),
    /** Whether a message went out (a known, enabled account within the limits). */
    sent: boolean("sent").notNull(),
    createdAt: createdAt(),
  },
  (t) => [
    index("password_reset_requests_email_created_at_idx").on(
      t.email,
      t.createdAt,
    ),
    index("password_reset_requests_ip_address_created_at_idx").on(
      t.ipAddress,
      t.createdAt,
    ),
  ],
);

export type LinkToken = typeof linkTokens.$inferSelect;
