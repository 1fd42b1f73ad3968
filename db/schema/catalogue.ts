import { relations } from "drizzle-orm";
import { boolean, index, integer, jsonb, pgEnum, pgTable, real, text, uniqueIndex, uuid } from "drizzle-orm/pg-core";
import { rowIdentity } from "./columns";

export const toolCategoryEnum = pgEnum("tool_category", [
  "hot_air_station",
  "soldering_station",
  "rework_station",
  "heat_gun",
]);

// IEC 60335-1 picks the power-input tolerance row by this classification.
export const applianceTypeEnum = pgEnum("appliance_type", ["heating", "motor", "combined"]);

export const makers = pgTable(
  "makers",
  {
    ...rowIdentity,
    slug: text("slug").notNull(),
    name: text("name").notNull(),
    country: text("country").notNull(),
  },
  (table) => [uniqueIndex("makers_slug_unique").on(table.slug)],
);

export type ToolAccessory = { kind: "nozzle" | "tip" | "stand" | "other"; name: string; size?: string };

export const tools = pgTable(
  "tools",
  {
    ...rowIdentity,
    slug: text("slug").notNull(),
    makerId: uuid("maker_id")
      .notNull()
      .references(() => makers.id, { onDelete: "restrict" }),
    model: text("model").notNull(),
    category: toolCategoryEnum("category").notNull(),
    applianceType: applianceTypeEnum("appliance_type").notNull().default("heating"),
    /** Combined appliances only: whether the motor takes more than half the rated power (picks the IEC 60335-1 row); null when not stated. */
    motorShareAboveHalf: boolean("motor_share_above_half"),
    ratedPowerW: real("rated_power_w").notNull(),
    ratedVoltageMin: real("rated_voltage_min").notNull(),
    ratedVoltageMax: real("rated_voltage_max").notNull(),
    ratedFrequenciesHz: integer("rated_frequencies_hz").array().notNull(),
    ratedAirflowLpm: real("rated_airflow_lpm"),
    temperatureMinC: real("temperature_min_c"),
    temperatureMaxC: real("temperature_max_c"),
    claimedHeatUpSeconds: real("claimed_heat_up_seconds"),
    priceMinor: integer("price_minor"),
    currency: text("currency"),
    accessories: jsonb("accessories").$type<ToolAccessory[]>().notNull().default([]),
    summary: text("summary").notNull().default(""),
  },
  (table) => [
    uniqueIndex("tools_slug_unique").on(table.slug),
    index("tools_maker_idx").on(table.makerId),
    index("tools_category_idx").on(table.category),
  ],
);

export const makersRelations = relations(makers, ({ many }) => ({
  tools: many(tools),
}));

export const toolsRelations = relations(tools, ({ one }) => ({
  maker: one(makers, { fields: [tools.makerId], references: [makers.id] }),
}));

export type Maker = typeof makers.$inferSelect;
export type NewMaker = typeof makers.$inferInsert;
export type Tool = typeof tools.$inferSelect;
export type NewTool = typeof tools.$inferInsert;
export type ToolCategory = (typeof toolCategoryEnum.enumValues)[number];
export type ApplianceType = (typeof applianceTypeEnum.enumValues)[number];
