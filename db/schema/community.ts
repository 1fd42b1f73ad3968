import { randomBytes } from "node:crypto";
import { relations } from "drizzle-orm";
import { boolean, index, integer, pgEnum, pgTable, primaryKey, text, timestamp, uniqueIndex, uuid, type AnyPgColumn } from "drizzle-orm/pg-core";
import { requestStatuses } from "../../lib/request-statuses";
import { tools } from "./catalogue";
import { rowIdentity } from "./columns";
import { users } from "./people";
import { reports } from "./reports";

export const commentStatusEnum = pgEnum("comment_status", ["pending", "approved", "rejected", "spam"]);

export const comments = pgTable(
  "comments",
  {
    ...rowIdentity,
    reportId: uuid("report_id")
      .notNull()
      .references(() => reports.id, { onDelete: "cascade" }),
    /** Null once the author deleted their account: the comment stays, anonymised. */
    authorId: uuid("author_id").references(() => users.id, { onDelete: "set null" }),
    parentId: uuid("parent_id").references((): AnyPgColumn => comments.id, { onDelete: "cascade" }),
    body: text("body").notNull(),
    status: commentStatusEnum("status").notNull().default("pending"),
    moderatedById: uuid("moderated_by_id").references(() => users.id, { onDelete: "set null" }),
    moderatedAt: timestamp("moderated_at", { withTimezone: true }),
  },
  (table) => [index("comments_report_idx").on(table.reportId, table.status), index("comments_author_idx").on(table.authorId, table.createdAt)],
);

export const requestStatusEnum = pgEnum("request_status", requestStatuses);

export const measurementRequests = pgTable(
  "measurement_requests",
  {
    ...rowIdentity,
    /** A catalogued tool, or null with proposedToolName for one not in the catalogue yet. */
    toolId: uuid("tool_id").references(() => tools.id, { onDelete: "set null" }),
    proposedToolName: text("proposed_tool_name"),
    whatToMeasure: text("what_to_measure").notNull(),
    why: text("why").notNull(),
    requesterId: uuid("requester_id").references(() => users.id, { onDelete: "set null" }),
    status: requestStatusEnum("status").notNull().default("open"),
    declineReason: text("decline_reason"),
    answeredByReportId: uuid("answered_by_report_id").references(() => reports.id, { onDelete: "set null" }),
    mergedIntoId: uuid("merged_into_id").references((): AnyPgColumn => measurementRequests.id, { onDelete: "set null" }),
    voteCount: integer("vote_count").notNull().default(0),
  },
  (table) => [index("measurement_requests_status_idx").on(table.status, table.voteCount)],
);

export const requestVotes = pgTable(
  "request_votes",
  {
    requestId: uuid("request_id")
      .notNull()
      .references(() => measurementRequests.id, { onDelete: "cascade" }),
    userId: uuid("user_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (table) => [primaryKey({ columns: [table.requestId, table.userId] })],
);

export const notificationPreferences = pgTable("notification_preferences", {
  userId: uuid("user_id")
    .primaryKey()
    .references(() => users.id, { onDelete: "cascade" }),
  submissions: boolean("submissions").notNull().default(true),
  decisions: boolean("decisions").notNull().default(true),
  moderation: boolean("moderation").notNull().default(true),
  requestUpdates: boolean("request_updates").notNull().default(true),
  /** Lets the link in a notification switch a topic off without signing in, so it must not be guessable. */
  unsubscribeToken: text("unsubscribe_token")
    .notNull()
    .$defaultFn(() => randomBytes(24).toString("base64url")),
  updatedAt: timestamp("updated_at", { withTimezone: true })
    .notNull()
    .defaultNow()
    .$onUpdate(() => new Date()),
});

export const outboxStatusEnum = pgEnum("outbox_status", ["pending", "sent", "failed", "suppressed"]);

/** Mail is written here in the same transaction as the change it reports, then sent by a job: nothing is lost while mail is down. */
export const outboxMessages = pgTable(
  "outbox_messages",
  {
    ...rowIdentity,
    /** One message per event and recipient, however often the job that sends it is retried. */
    dedupeKey: text("dedupe_key").notNull(),
    topic: text("topic").notNull(),
    recipientId: uuid("recipient_id").references(() => users.id, { onDelete: "set null" }),
    toAddress: text("to_address").notNull(),
    subject: text("subject").notNull(),
    text: text("text").notNull(),
    status: outboxStatusEnum("status").notNull().default("pending"),
    attempts: integer("attempts").notNull().default(0),
    lastError: text("last_error"),
    sentAt: timestamp("sent_at", { withTimezone: true }),
  },
  (table) => [uniqueIndex("outbox_messages_dedupe_unique").on(table.dedupeKey), index("outbox_messages_status_idx").on(table.status, table.createdAt)],
);

export const commentsRelations = relations(comments, ({ one }) => ({
  report: one(reports, { fields: [comments.reportId], references: [reports.id] }),
  author: one(users, { fields: [comments.authorId], references: [users.id] }),
}));

export const measurementRequestsRelations = relations(measurementRequests, ({ one, many }) => ({
  tool: one(tools, { fields: [measurementRequests.toolId], references: [tools.id] }),
  requester: one(users, { fields: [measurementRequests.requesterId], references: [users.id] }),
  votes: many(requestVotes),
}));

export const requestVotesRelations = relations(requestVotes, ({ one }) => ({
  request: one(measurementRequests, { fields: [requestVotes.requestId], references: [measurementRequests.id] }),
  user: one(users, { fields: [requestVotes.userId], references: [users.id] }),
}));

export type Comment = typeof comments.$inferSelect;
export type CommentStatus = (typeof commentStatusEnum.enumValues)[number];
export type MeasurementRequest = typeof measurementRequests.$inferSelect;
export type RequestStatus = (typeof requestStatusEnum.enumValues)[number];
export type OutboxMessage = typeof outboxMessages.$inferSelect;
export type NewOutboxMessage = typeof outboxMessages.$inferInsert;
