import { sql } from "drizzle-orm";
import { boolean, index, jsonb, pgEnum, pgTable, text, timestamp, uniqueIndex, uuid, integer, check } from "drizzle-orm/pg-core";
import { RECORD_LICENCES } from "../../lib/agreement/licences";
import { DEFAULT_WALK_RULES, type WalkRules } from "../../lib/review/walk-rules";
import { DEFAULT_WARNING_RULES, type WarningRules } from "../../lib/review/warning-rules";
import { DEFAULT_SEASON_GRACE_DAYS, SEASON_GRACE_DAYS } from "../../lib/limits/seasons";
import { literal } from "./check-sql";

export const roleEnum = pgEnum("role", ["volunteer", "coordinator", "organiser", "partner"]);
export type Role = (typeof roleEnum.enumValues)[number];

export const users = pgTable(
  "users",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    email: text("email").notNull(),
    name: text("name").notNull(),
    // Every role the person holds: never empty, no repeats, in the order of lib/auth/roles.ts.
    roles: roleEnum("roles").array().notNull().default(sql`'{volunteer}'::role[]`),
    passwordHash: text("password_hash"),
    active: boolean("active").notNull().default(true),
    invitedById: uuid("invited_by_id"),
    acceptedSafetyAt: timestamp("accepted_safety_at", { withTimezone: true }),
    lastSignInAt: timestamp("last_sign_in_at", { withTimezone: true }),
    // Random, unique and kept forever: the person in published data, and everywhere once erased.
    pseudonym: text("pseudonym").notNull().default(sql`'Recorder ' || upper(left(gen_random_uuid()::text, 8))`),
    // The recorder agreement's answers as they stand (each acceptance: agreement_acceptances).
    publishName: boolean("publish_name").notNull().default(false),
    // Also set by the newsletter's one-click unsubscribe: the latest choice wins.
    newsletter: boolean("newsletter").notNull().default(false),
    erasedAt: timestamp("erased_at", { withTimezone: true }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    // E-mail addresses are compared case-insensitively everywhere.
    uniqueIndex("users_email_lower_idx").on(sql`lower(${t.email})`),
    uniqueIndex("users_pseudonym_idx").on(t.pseudonym),
    index("users_roles_idx").using("gin", t.roles),
    check("users_email_shape", sql`${t.email} ~ '^[^@\\s]+@[^@\\s]+$'`),
    check("users_roles_present", sql`cardinality(${t.roles}) > 0`),
  ],
);

export const invitations = pgTable(
  "invitations",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    email: text("email").notNull(),
    name: text("name").notNull(),
    roles: roleEnum("roles").array().notNull(),
    // Only a hash of the token is kept, so a database leak does not hand out accounts.
    tokenHash: text("token_hash").notNull(),
    invitedById: uuid("invited_by_id").notNull().references(() => users.id, { onDelete: "restrict" }),
    expiresAt: timestamp("expires_at", { withTimezone: true }).notNull(),
    acceptedAt: timestamp("accepted_at", { withTimezone: true }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    uniqueIndex("invitations_token_hash_idx").on(t.tokenHash),
    index("invitations_email_idx").on(sql`lower(${t.email})`),
    check("invitations_roles_present", sql`cardinality(${t.roles}) > 0`),
  ],
);

/** Licences a network may publish its records under (SPDX identifiers: lib/agreement/licences.ts). */
export const recordLicenceEnum = pgEnum("record_licence", RECORD_LICENCES);

/** The recorder agreement, written by an organiser; every change is a new version, never an edit. */
export const recorderAgreements = pgTable(
  "recorder_agreements",
  {
    version: integer("version").primaryKey(),
    body: text("body").notNull(),
    licence: recordLicenceEnum("licence").notNull(),
    createdById: uuid("created_by_id").references(() => users.id, { onDelete: "set null" }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [check("recorder_agreements_version_positive", sql`${t.version} >= 1`)],
);

/** Each time a recorder accepts a version, with their answers then. */
export const agreementAcceptances = pgTable(
  "agreement_acceptances",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    userId: uuid("user_id").notNull().references(() => users.id, { onDelete: "cascade" }),
    version: integer("version").notNull().references(() => recorderAgreements.version, { onDelete: "restrict" }),
    publishName: boolean("publish_name").notNull(),
    newsletter: boolean("newsletter").notNull(),
    acceptedAt: timestamp("accepted_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("agreement_acceptances_user_idx").on(t.userId, t.version)],
);

/**
 * Sign-in attempts for the limits in lib/auth/rate-limit.ts, by e-mail, by address and by the pair.
 * A row is written as a failure before the password is checked and marked a success afterwards.
 */
export const signInAttempts = pgTable(
  "sign_in_attempts",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    emailKey: text("email_key").notNull(),
    ipKey: text("ip_key").notNull(),
    succeeded: boolean("succeeded").notNull(),
    attemptedAt: timestamp("attempted_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    index("sign_in_attempts_email_idx").on(t.emailKey, t.attemptedAt),
    index("sign_in_attempts_ip_idx").on(t.ipKey, t.attemptedAt),
    index("sign_in_attempts_pair_idx").on(t.emailKey, t.ipKey, t.attemptedAt),
    // Old rows are deleted on every attempt.
    index("sign_in_attempts_attempted_at_idx").on(t.attemptedAt),
  ],
);

/** Invitation tokens that matched no open invitation, by address (lib/auth/invitation-limit.ts). */
export const invitationTokenFailures = pgTable(
  "invitation_token_failures",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    ipKey: text("ip_key").notNull(),
    attemptedAt: timestamp("attempted_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("invitation_token_failures_ip_idx").on(t.ipKey, t.attemptedAt), index("invitation_token_failures_attempted_at_idx").on(t.attemptedAt)],
);

/** One deployment serves one network: a single settings row (id = 1). */
export const networkSettings = pgTable(
  "network_settings",
  {
    id: integer("id").primaryKey().default(1),
    name: text("name").notNull(),
    taxonGroup: text("taxon_group").notNull(),
    // The walk rules (lib/review/walk-rules.ts): breaking one warns the volunteer and marks the
    // walk for reviewers, never refuses it. Validated by its zod schema on every write.
    walkRules: jsonb("walk_rules").$type<WalkRules>().notNull().default(DEFAULT_WALK_RULES),
    // Thresholds of the sightings' warnings (lib/review/warning-rules.ts).
    warningRules: jsonb("warning_rules").$type<WarningRules>().notNull().default(DEFAULT_WARNING_RULES),
    contactEmail: text("contact_email"),
    // Days after a season closes during which walks may still be entered and checked.
    seasonGraceDays: integer("season_grace_days").notNull().default(DEFAULT_SEASON_GRACE_DAYS),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    check("network_settings_singleton", sql`${t.id} = 1`),
    check("network_settings_grace_days", sql`${t.seasonGraceDays} between ${literal(SEASON_GRACE_DAYS.min)} and ${literal(SEASON_GRACE_DAYS.max)}`),
  ],
);
