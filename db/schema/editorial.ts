import { relations } from "drizzle-orm";
import { index, integer, jsonb, pgEnum, pgTable, text, timestamp, uniqueIndex, uuid } from "drizzle-orm/pg-core";
import { rowIdentity } from "./columns";
import { users } from "./people";
import { reports } from "./reports";

export const revisionKindEnum = pgEnum("revision_kind", ["original", "correction", "amendment"]);
export const revisionStatusEnum = pgEnum("revision_status", ["pending", "scheduled", "published", "rejected"]);

/** What a published page shows, frozen: the report's text and the exact figures of every analysis it cites. */
export type FrozenReportContent = {
  title: string;
  disclosure: string;
  tools: { toolId: string; slug: string; maker: string; model: string; position: number }[];
  analyses: { label: string; analysisId: string; result: Record<string, unknown>; displaySeries: Record<string, unknown> | null }[];
  measurements: Record<string, unknown>[];
  images: { id: string; objectKey: string; altText: string; width: number; height: number }[];
};

export const reportRevisions = pgTable(
  "report_revisions",
  {
    ...rowIdentity,
    reportId: uuid("report_id")
      .notNull()
      .references(() => reports.id, { onDelete: "cascade" }),
    number: integer("number").notNull(),
    kind: revisionKindEnum("kind").notNull(),
    status: revisionStatusEnum("status").notNull().default("pending"),
    changeNote: text("change_note").notNull(),
    bodyMdx: text("body_mdx").notNull(),
    content: jsonb("content").$type<FrozenReportContent>().notNull(),
    /** The MDX compiled once when the revision is approved; pages run this, never the compiler. */
    compiledMdx: text("compiled_mdx"),
    scheduledFor: timestamp("scheduled_for", { withTimezone: true }),
    publishedAt: timestamp("published_at", { withTimezone: true }),
    proposedById: uuid("proposed_by_id").references(() => users.id, { onDelete: "set null" }),
    approvedById: uuid("approved_by_id").references(() => users.id, { onDelete: "set null" }),
  },
  (table) => [uniqueIndex("report_revisions_number_unique").on(table.reportId, table.number)],
);

export const decisionKindEnum = pgEnum("decision_kind", ["approve", "schedule", "send_back", "reject_revision", "retract"]);

export const editorialDecisions = pgTable(
  "editorial_decisions",
  {
    ...rowIdentity,
    reportId: uuid("report_id")
      .notNull()
      .references(() => reports.id, { onDelete: "cascade" }),
    revisionId: uuid("revision_id").references(() => reportRevisions.id, { onDelete: "set null" }),
    editorId: uuid("editor_id").references(() => users.id, { onDelete: "set null" }),
    decision: decisionKindEnum("decision").notNull(),
    notes: text("notes").notNull().default(""),
  },
  (table) => [index("editorial_decisions_report_idx").on(table.reportId)],
);

export const makerReplies = pgTable(
  "maker_replies",
  {
    ...rowIdentity,
    reportId: uuid("report_id")
      .notNull()
      .references(() => reports.id, { onDelete: "cascade" }),
    makerName: text("maker_name").notNull(),
    body: text("body").notNull(),
    receivedOn: text("received_on").notNull(),
    attachedById: uuid("attached_by_id").references(() => users.id, { onDelete: "set null" }),
  },
  (table) => [index("maker_replies_report_idx").on(table.reportId)],
);

export const auditLog = pgTable(
  "audit_log",
  {
    ...rowIdentity,
    actorId: uuid("actor_id").references(() => users.id, { onDelete: "set null" }),
    action: text("action").notNull(),
    subjectType: text("subject_type").notNull(),
    subjectId: uuid("subject_id"),
    details: jsonb("details").$type<Record<string, unknown>>().notNull().default({}),
  },
  (table) => [index("audit_log_created_idx").on(table.createdAt), index("audit_log_subject_idx").on(table.subjectType, table.subjectId)],
);

export const reportRevisionsRelations = relations(reportRevisions, ({ one }) => ({
  report: one(reports, { fields: [reportRevisions.reportId], references: [reports.id] }),
}));

export const editorialDecisionsRelations = relations(editorialDecisions, ({ one }) => ({
  report: one(reports, { fields: [editorialDecisions.reportId], references: [reports.id] }),
  revision: one(reportRevisions, { fields: [editorialDecisions.revisionId], references: [reportRevisions.id] }),
  editor: one(users, { fields: [editorialDecisions.editorId], references: [users.id] }),
}));

export const makerRepliesRelations = relations(makerReplies, ({ one }) => ({
  report: one(reports, { fields: [makerReplies.reportId], references: [reports.id] }),
}));

export type ReportRevision = typeof reportRevisions.$inferSelect;
export type NewReportRevision = typeof reportRevisions.$inferInsert;
export type EditorialDecision = typeof editorialDecisions.$inferSelect;
export type MakerReply = typeof makerReplies.$inferSelect;
export type AuditEntry = typeof auditLog.$inferSelect;
