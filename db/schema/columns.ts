import { timestamp, uuid } from "drizzle-orm/pg-core";

// Every table carries the same identity and bookkeeping columns.
export const rowIdentity = {
  id: uuid("id").primaryKey().defaultRandom(),
  createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  updatedAt: timestamp("updated_at", { withTimezone: true })
    .notNull()
    .defaultNow()
    .$onUpdate(() => new Date()),
};
