import { relations } from "drizzle-orm";
import { index, integer, pgEnum, pgTable, primaryKey, text, timestamp, uniqueIndex, uuid } from "drizzle-orm/pg-core";
import { analyses } from "./bench";
import { tools } from "./catalogue";
import { rowIdentity } from "./columns";
import { users } from "./people";

export const reportStatusEnum = pgEnum("report_status", ["draft", "submitted", "changes_requested", "published", "retracted"]);

export const reports = pgTable(
  "reports",
  {
    ...rowIdentity,
    slug: text("slug").notNull(),
    title: text("title").notNull(),
    authorId: uuid("author_id")
      .notNull()
      .references(() => users.id, { onDelete: "restrict" }),
    status: reportStatusEnum("status").notNull().default("draft"),
    bodyMdx: text("body_mdx").notNull().default(""),
    disclosure: text("disclosure").notNull().default(""),
    submittedAt: timestamp("submitted_at", { withTimezone: true }),
    /** The revision readers see; set by the editorial desk on approval. Not a foreign key: revisions reference reports. */
    publishedRevisionId: uuid("published_revision_id"),
    firstPublishedAt: timestamp("first_published_at", { withTimezone: true }),
    retractedAt: timestamp("retracted_at", { withTimezone: true }),
    retractionReason: text("retraction_reason"),
  },
  (table) => [uniqueIndex("reports_slug_unique").on(table.slug), index("reports_author_idx").on(table.authorId)],
);

/** One tool, or two for a head-to-head; position orders them on the page. */
export const reportTools = pgTable(
  "report_tools",
  {
    reportId: uuid("report_id")
      .notNull()
      .references(() => reports.id, { onDelete: "cascade" }),
    toolId: uuid("tool_id")
      .notNull()
      .references(() => tools.id, { onDelete: "restrict" }),
    position: integer("position").notNull(),
  },
  (table) => [primaryKey({ columns: [table.reportId, table.toolId] })],
);

/** The exact analyses a report cites: a later re-analysis changes nothing here until the reviewer repoints it. */
export const reportAnalyses = pgTable(
  "report_analyses",
  {
    reportId: uuid("report_id")
      .notNull()
      .references(() => reports.id, { onDelete: "cascade" }),
    analysisId: uuid("analysis_id")
      .notNull()
      .references(() => analyses.id, { onDelete: "restrict" }),
    /** The short name the MDX body uses to embed this analysis's figures. */
    label: text("label").notNull(),
  },
  (table) => [primaryKey({ columns: [table.reportId, table.analysisId] }), uniqueIndex("report_analyses_label_unique").on(table.reportId, table.label)],
);

export const reportImages = pgTable(
  "report_images",
  {
    ...rowIdentity,
    reportId: uuid("report_id")
      .notNull()
      .references(() => reports.id, { onDelete: "cascade" }),
    /** What the MDX body calls it: <Figure image="name" />. */
    name: text("name").notNull(),
    objectKey: text("object_key").notNull(),
    altText: text("alt_text").notNull(),
    width: integer("width").notNull(),
    height: integer("height").notNull(),
  },
  (table) => [
    uniqueIndex("report_images_object_key_unique").on(table.objectKey),
    uniqueIndex("report_images_name_unique").on(table.reportId, table.name),
  ],
);

export const reportsRelations = relations(reports, ({ one, many }) => ({
  author: one(users, { fields: [reports.authorId], references: [users.id] }),
  tools: many(reportTools),
  analyses: many(reportAnalyses),
  images: many(reportImages),
}));

export const reportToolsRelations = relations(reportTools, ({ one }) => ({
  report: one(reports, { fields: [reportTools.reportId], references: [reports.id] }),
  tool: one(tools, { fields: [reportTools.toolId], references: [tools.id] }),
}));

export const reportAnalysesRelations = relations(reportAnalyses, ({ one }) => ({
  report: one(reports, { fields: [reportAnalyses.reportId], references: [reports.id] }),
  analysis: one(analyses, { fields: [reportAnalyses.analysisId], references: [analyses.id] }),
}));

export const reportImagesRelations = relations(reportImages, ({ one }) => ({
  report: one(reports, { fields: [reportImages.reportId], references: [reports.id] }),
}));

export type Report = typeof reports.$inferSelect;
export type NewReport = typeof reports.$inferInsert;
export type ReportStatus = (typeof reportStatusEnum.enumValues)[number];
export type ReportImage = typeof reportImages.$inferSelect;
