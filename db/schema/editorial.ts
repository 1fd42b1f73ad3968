import { relations, sql, type SQL } from "drizzle-orm";
import { index, integer, jsonb, pgEnum, pgTable, text, timestamp, uniqueIndex, uuid } from "drizzle-orm/pg-core";
import type { ReportEmbedSources } from "@/lib/report-embeds";
import type { InstrumentSnapshot, RunConditions, TestedUnit } from "./bench";
import { rowIdentity, tsvector } from "./columns";
import { users } from "./people";
import { reports } from "./reports";

export const revisionKindEnum = pgEnum("revision_kind", ["original", "correction", "amendment"]);
export const revisionStatusEnum = pgEnum("revision_status", ["pending", "scheduled", "published", "rejected"]);

/** A cited run as the report describes it: protocol version, supply and conditions, the unit and the instruments used. */
export type FrozenRun = {
  id: string;
  testedOn: string;
  labName: string;
  toolName: string;
  protocol: { name: string; version: number; summary: string; safetyCautions: string };
  conditions: RunConditions;
  unit: TestedUnit;
  instruments: InstrumentSnapshot[];
};

/**
 * What a published page shows, frozen at approval: the report's text around the body, and everything its figures are
 * drawn from (the exact results and display series of every cited analysis, the measurements and verdicts, the
 * tools' ratings, the images), so a later re-analysis or catalogue edit cannot change a published number.
 */
export type FrozenReportContent = ReportEmbedSources & {
  title: string;
  disclosure: string;
  author: { id: string; name: string };
  runs: FrozenRun[];
};

/**
 * A revision's MDX body as words a reader would search for: component tags, link targets and Markdown marks become
 * spaces. The search index and the search page's snippets both read the body through this, so a snippet shows the
 * words the index matched. It also drops the two private-use characters the snippets mark matches with.
 */
export function searchableBodyText(body: SQL): SQL {
  return sql`regexp_replace(regexp_replace(regexp_replace(regexp_replace(${body},
    '<[A-Za-z/][^>]*>', ' ', 'g'),
    '\\[([^]]*)\\]\\([^)]*\\)', '\\1', 'g'),
    '[#*_\`>~|\\uE000\\uE001]+', ' ', 'g'),
    '\\s+', ' ', 'g')`;
}

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
    /**
     * What full-text search matches: the frozen title (weight A), the tools' names (B) and the body (C), English
     * stemming. Every revision has one; the search query limits matches to each report's current published revision.
     */
    searchVector: tsvector("search_vector")
      .notNull()
      .generatedAlwaysAs(
        (): SQL => sql`setweight(to_tsvector('english'::regconfig, coalesce(content->>'title', '')), 'A')
          || setweight(to_tsvector('english'::regconfig, jsonb_path_query_array(content, '$.tools[*].name')), 'B')
          || setweight(to_tsvector('english'::regconfig, ${searchableBodyText(sql.raw("body_mdx"))}), 'C')`,
      ),
  },
  (table) => [
    uniqueIndex("report_revisions_number_unique").on(table.reportId, table.number),
    index("report_revisions_search_idx").using("gin", table.searchVector),
  ],
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
export type RevisionKind = (typeof revisionKindEnum.enumValues)[number];
export type RevisionStatus = (typeof revisionStatusEnum.enumValues)[number];
export type DecisionKind = (typeof decisionKindEnum.enumValues)[number];
