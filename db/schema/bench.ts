import { relations } from "drizzle-orm";
import { date, index, integer, jsonb, pgEnum, pgTable, primaryKey, real, text, timestamp, uniqueIndex, uuid } from "drizzle-orm/pg-core";
import { instrumentKinds, type AccuracyQuantity } from "../../lib/instrument-kinds";
import { measurementKinds } from "../../lib/measurement-kinds";
import { tools } from "./catalogue";
import { rowIdentity } from "./columns";
import { labs, users } from "./people";

export const instrumentKindEnum = pgEnum("instrument_kind", instrumentKinds);

/** One accuracy line of an instrument's datasheet: ±(percentOfReading % of reading + offset) on a range. */
export type AccuracyRange = {
  quantity: AccuracyQuantity;
  unit: string;
  rangeMax: number;
  percentOfReading: number;
  offset: number;
};

export const instruments = pgTable(
  "instruments",
  {
    ...rowIdentity,
    labId: uuid("lab_id").references(() => labs.id, { onDelete: "set null" }),
    kind: instrumentKindEnum("kind").notNull(),
    maker: text("maker").notNull(),
    model: text("model").notNull(),
    serialNumber: text("serial_number").notNull(),
    accuracy: jsonb("accuracy").$type<AccuracyRange[]>().notNull(),
    calibratedOn: date("calibrated_on", { mode: "string" }).notNull(),
    calibrationDueOn: date("calibration_due_on", { mode: "string" }).notNull(),
    createdById: uuid("created_by_id").references(() => users.id, { onDelete: "set null" }),
  },
  (table) => [uniqueIndex("instruments_serial_unique").on(table.maker, table.model, table.serialNumber)],
);

export const measurementKindEnum = pgEnum("measurement_kind", measurementKinds);

export type ProtocolConditions = {
  supplyVoltage: number;
  supplyFrequencyHz: number;
  ambientC: number;
  nozzle: string | null;
  airflowSetpoint: string | null;
  temperatureSetpointC: number | null;
  measuringDistanceMm: number | null;
  warmUpMinutes: number;
};

/** Tolerances a protocol sets for ratings IEC 60335-1 does not cover (airflow, heat-up time, temperature). */
export type ProtocolTolerance = { kind: "percent" | "absolute"; plus: number; minus: number; source: string };

export const protocols = pgTable(
  "protocols",
  {
    ...rowIdentity,
    slug: text("slug").notNull(),
    name: text("name").notNull(),
    createdById: uuid("created_by_id").references(() => users.id, { onDelete: "set null" }),
  },
  (table) => [uniqueIndex("protocols_slug_unique").on(table.slug)],
);

/** Never updated once written: an edit appends a new version, so a run's protocol cannot change under it. */
export const protocolVersions = pgTable(
  "protocol_versions",
  {
    ...rowIdentity,
    protocolId: uuid("protocol_id")
      .notNull()
      .references(() => protocols.id, { onDelete: "restrict" }),
    version: integer("version").notNull(),
    summary: text("summary").notNull(),
    conditions: jsonb("conditions").$type<ProtocolConditions>().notNull(),
    requiredMeasurements: measurementKindEnum("required_measurements").array().notNull(),
    repeats: integer("repeats").notNull(),
    tolerances: jsonb("tolerances").$type<Partial<Record<"airflow" | "heat_up_time" | "temperature_vs_setpoint", ProtocolTolerance>>>().notNull().default({}),
    stepsMdx: text("steps_mdx").notNull(),
    safetyCautions: text("safety_cautions").notNull(),
    createdById: uuid("created_by_id").references(() => users.id, { onDelete: "set null" }),
  },
  (table) => [uniqueIndex("protocol_versions_number_unique").on(table.protocolId, table.version)],
);

export type TestedUnit = {
  serialNumber: string;
  firmware: string | null;
  voltageVariant: string;
  source: "bought" | "loaned" | "given";
  sourceNote: string | null;
};

export type RunConditions = ProtocolConditions & { measuredSupplyVoltage: number | null };

export const testRuns = pgTable(
  "test_runs",
  {
    ...rowIdentity,
    toolId: uuid("tool_id")
      .notNull()
      .references(() => tools.id, { onDelete: "restrict" }),
    protocolVersionId: uuid("protocol_version_id")
      .notNull()
      .references(() => protocolVersions.id, { onDelete: "restrict" }),
    labId: uuid("lab_id")
      .notNull()
      .references(() => labs.id, { onDelete: "restrict" }),
    reviewerId: uuid("reviewer_id")
      .notNull()
      .references(() => users.id, { onDelete: "restrict" }),
    testedOn: date("tested_on", { mode: "string" }).notNull(),
    unit: jsonb("unit").$type<TestedUnit>().notNull(),
    conditions: jsonb("conditions").$type<RunConditions>().notNull(),
    notes: text("notes").notNull().default(""),
  },
  (table) => [index("test_runs_tool_idx").on(table.toolId), index("test_runs_reviewer_idx").on(table.reviewerId)],
);

/** The instrument's spec and calibration as they were when the run was made. */
export type InstrumentSnapshot = {
  kind: string;
  maker: string;
  model: string;
  serialNumber: string;
  accuracy: AccuracyRange[];
  calibratedOn: string;
  calibrationDueOn: string;
};

export const runInstruments = pgTable(
  "run_instruments",
  {
    runId: uuid("run_id")
      .notNull()
      .references(() => testRuns.id, { onDelete: "cascade" }),
    instrumentId: uuid("instrument_id")
      .notNull()
      .references(() => instruments.id, { onDelete: "restrict" }),
    snapshot: jsonb("snapshot").$type<InstrumentSnapshot>().notNull(),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (table) => [primaryKey({ columns: [table.runId, table.instrumentId] })],
);

/** A reading taken by hand (a meter's display), one value per repeat. */
export const manualReadings = pgTable(
  "manual_readings",
  {
    ...rowIdentity,
    runId: uuid("run_id")
      .notNull()
      .references(() => testRuns.id, { onDelete: "cascade" }),
    kind: measurementKindEnum("kind").notNull(),
    values: real("values").array().notNull(),
    unit: text("unit").notNull(),
    instrumentId: uuid("instrument_id").references(() => instruments.id, { onDelete: "restrict" }),
    note: text("note").notNull().default(""),
  },
  (table) => [index("manual_readings_run_idx").on(table.runId)],
);

export const captureKindEnum = pgEnum("capture_kind", ["waveform", "heat_up_log"]);
export const captureStatusEnum = pgEnum("capture_status", ["awaiting_upload", "uploaded", "abandoned"]);

export const captures = pgTable(
  "captures",
  {
    ...rowIdentity,
    runId: uuid("run_id")
      .notNull()
      .references(() => testRuns.id, { onDelete: "cascade" }),
    kind: captureKindEnum("kind").notNull(),
    objectKey: text("object_key").notNull(),
    fileName: text("file_name").notNull(),
    declaredBytes: integer("declared_bytes").notNull(),
    status: captureStatusEnum("status").notNull().default("awaiting_upload"),
    uploadedAt: timestamp("uploaded_at", { withTimezone: true }),
    createdById: uuid("created_by_id").references(() => users.id, { onDelete: "set null" }),
  },
  (table) => [uniqueIndex("captures_object_key_unique").on(table.objectKey), index("captures_run_idx").on(table.runId)],
);

/** Downsampled series for charts, so pages never re-read a capture of millions of samples. */
export type DisplaySeries = {
  waveform?: { timeS: number[]; current: number[]; voltage: number[] | null };
  halfCycles?: { halfCycleSeconds: number; rmsCurrent: number[]; conducting: boolean[] };
  heatUp?: { timeS: number[]; temperatureC: number[]; setpointC: number | null };
};

export const analysisStatusEnum = pgEnum("analysis_status", ["queued", "running", "done", "failed"]);

/** One analysis of a capture under one mapping and one set of instrument specs; never rewritten once done. */
export const analyses = pgTable(
  "analyses",
  {
    ...rowIdentity,
    captureId: uuid("capture_id")
      .notNull()
      .references(() => captures.id, { onDelete: "cascade" }),
    options: jsonb("options").$type<Record<string, unknown>>().notNull(),
    instrumentSnapshots: jsonb("instrument_snapshots").$type<InstrumentSnapshot[]>().notNull(),
    status: analysisStatusEnum("status").notNull().default("queued"),
    analysisVersion: text("analysis_version"),
    result: jsonb("result").$type<Record<string, unknown>>(),
    displaySeries: jsonb("display_series").$type<DisplaySeries>(),
    error: jsonb("error").$type<{ message: string; line: number | null }>(),
    startedAt: timestamp("started_at", { withTimezone: true }),
    finishedAt: timestamp("finished_at", { withTimezone: true }),
    requestedById: uuid("requested_by_id").references(() => users.id, { onDelete: "set null" }),
  },
  (table) => [index("analyses_capture_idx").on(table.captureId)],
);

export const measurementSourceEnum = pgEnum("measurement_source", ["analysis", "manual"]);

/** One measured quantity of a run, with its expanded uncertainty (k = 2) and where it came from. */
export const measurements = pgTable(
  "measurements",
  {
    ...rowIdentity,
    runId: uuid("run_id")
      .notNull()
      .references(() => testRuns.id, { onDelete: "cascade" }),
    analysisId: uuid("analysis_id").references(() => analyses.id, { onDelete: "cascade" }),
    manualReadingId: uuid("manual_reading_id").references(() => manualReadings.id, { onDelete: "cascade" }),
    kind: measurementKindEnum("kind").notNull(),
    source: measurementSourceEnum("source").notNull(),
    value: real("value").notNull(),
    unit: text("unit").notNull(),
    expandedUncertainty: real("expanded_uncertainty"),
    verdict: jsonb("verdict").$type<Record<string, unknown>>(),
  },
  (table) => [index("measurements_run_idx").on(table.runId), index("measurements_analysis_idx").on(table.analysisId)],
);

export const toolPhotos = pgTable(
  "tool_photos",
  {
    ...rowIdentity,
    toolId: uuid("tool_id")
      .notNull()
      .references(() => tools.id, { onDelete: "cascade" }),
    /** Web sizes live at `${objectKeyPrefix}/${width}.webp`. */
    objectKeyPrefix: text("object_key_prefix").notNull(),
    widths: integer("widths").array().notNull(),
    /** Heights of the renditions, in the order of `widths`, so pages can reserve the space before the image loads. */
    heights: integer("heights").array().notNull().default([]),
    altText: text("alt_text").notNull(),
    uploadedById: uuid("uploaded_by_id").references(() => users.id, { onDelete: "set null" }),
  },
  (table) => [index("tool_photos_tool_idx").on(table.toolId)],
);

export const instrumentsRelations = relations(instruments, ({ one }) => ({
  lab: one(labs, { fields: [instruments.labId], references: [labs.id] }),
}));

export const protocolsRelations = relations(protocols, ({ many }) => ({
  versions: many(protocolVersions),
}));

export const protocolVersionsRelations = relations(protocolVersions, ({ one, many }) => ({
  protocol: one(protocols, { fields: [protocolVersions.protocolId], references: [protocols.id] }),
  runs: many(testRuns),
}));

export const testRunsRelations = relations(testRuns, ({ one, many }) => ({
  tool: one(tools, { fields: [testRuns.toolId], references: [tools.id] }),
  protocolVersion: one(protocolVersions, { fields: [testRuns.protocolVersionId], references: [protocolVersions.id] }),
  lab: one(labs, { fields: [testRuns.labId], references: [labs.id] }),
  reviewer: one(users, { fields: [testRuns.reviewerId], references: [users.id] }),
  instruments: many(runInstruments),
  manualReadings: many(manualReadings),
  captures: many(captures),
  measurements: many(measurements),
}));

export const runInstrumentsRelations = relations(runInstruments, ({ one }) => ({
  run: one(testRuns, { fields: [runInstruments.runId], references: [testRuns.id] }),
  instrument: one(instruments, { fields: [runInstruments.instrumentId], references: [instruments.id] }),
}));

export const manualReadingsRelations = relations(manualReadings, ({ one }) => ({
  run: one(testRuns, { fields: [manualReadings.runId], references: [testRuns.id] }),
  instrument: one(instruments, { fields: [manualReadings.instrumentId], references: [instruments.id] }),
}));

export const capturesRelations = relations(captures, ({ one, many }) => ({
  run: one(testRuns, { fields: [captures.runId], references: [testRuns.id] }),
  analyses: many(analyses),
}));

export const analysesRelations = relations(analyses, ({ one, many }) => ({
  capture: one(captures, { fields: [analyses.captureId], references: [captures.id] }),
  measurements: many(measurements),
}));

export const measurementsRelations = relations(measurements, ({ one }) => ({
  run: one(testRuns, { fields: [measurements.runId], references: [testRuns.id] }),
  analysis: one(analyses, { fields: [measurements.analysisId], references: [analyses.id] }),
}));

export const toolPhotosRelations = relations(toolPhotos, ({ one }) => ({
  tool: one(tools, { fields: [toolPhotos.toolId], references: [tools.id] }),
}));

export type Instrument = typeof instruments.$inferSelect;
export type NewInstrument = typeof instruments.$inferInsert;
export type Protocol = typeof protocols.$inferSelect;
export type ProtocolVersion = typeof protocolVersions.$inferSelect;
export type NewProtocolVersion = typeof protocolVersions.$inferInsert;
export type TestRun = typeof testRuns.$inferSelect;
export type NewTestRun = typeof testRuns.$inferInsert;
export type ManualReading = typeof manualReadings.$inferSelect;
export type Capture = typeof captures.$inferSelect;
export type Analysis = typeof analyses.$inferSelect;
export type Measurement = typeof measurements.$inferSelect;
export type ToolPhoto = typeof toolPhotos.$inferSelect;
export type MeasurementKind = (typeof measurementKindEnum.enumValues)[number];
export type InstrumentKind = (typeof instrumentKindEnum.enumValues)[number];
