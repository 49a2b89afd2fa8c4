import { sql } from "drizzle-orm";
import { check, index, integer, jsonb, pgEnum, pgTable, text, timestamp, uuid } from "drizzle-orm/pg-core";
import { analysisRuns } from "./analysis";
import { users } from "./people";

export const emailStatusEnum = pgEnum("email_status", ["queued", "sending", "sent", "failed"]);

/** Every e-mail goes through this table first, so a mail-server outage loses nothing. */
export const emailOutbox = pgTable(
  "email_outbox",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    toAddress: text("to_address").notNull(),
    subject: text("subject").notNull(),
    textBody: text("text_body").notNull(),
    htmlBody: text("html_body"),
    purpose: text("purpose").notNull(),
    newsletterId: uuid("newsletter_id"),
    status: emailStatusEnum("status").notNull().default("queued"),
    attempts: integer("attempts").notNull().default(0),
    lastError: text("last_error"),
    sendAfter: timestamp("send_after", { withTimezone: true }).notNull().defaultNow(),
    sentAt: timestamp("sent_at", { withTimezone: true }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("email_outbox_due_idx").on(t.status, t.sendAfter), check("email_outbox_attempts", sql`${t.attempts} >= 0`)],
);

export const newsletterStatusEnum = pgEnum("newsletter_status", ["draft", "queued", "sent"]);

export const newsletters = pgTable("newsletters", {
  id: uuid("id").primaryKey().defaultRandom(),
  title: text("title").notNull(),
  body: text("body").notNull(),
  analysisRunId: uuid("analysis_run_id").references(() => analysisRuns.id, { onDelete: "set null" }),
  createdById: uuid("created_by_id").references(() => users.id, { onDelete: "set null" }),
  status: newsletterStatusEnum("status").notNull().default("draft"),
  sentAt: timestamp("sent_at", { withTimezone: true }),
  createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
});

export const exportFormatEnum = pgEnum("export_format", ["darwin-core-archive", "occurrence-csv", "site-by-species-csv", "change-results-csv", "geojson"]);

/** Who took which data out, with the filters used: partners' exports are audited. */
export const exportLog = pgTable(
  "export_log",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    requestedById: uuid("requested_by_id").references(() => users.id, { onDelete: "set null" }),
    format: exportFormatEnum("format").notNull(),
    parameters: jsonb("parameters").notNull().default(sql`'{}'::jsonb`),
    rowCount: integer("row_count").notNull().default(0),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("export_log_requested_idx").on(t.requestedById, t.createdAt)],
);
