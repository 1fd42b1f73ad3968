import { customType, timestamp, uuid } from "drizzle-orm/pg-core";

// Every table carries the same identity and bookkeeping columns.
export const rowIdentity = {
  id: uuid("id").primaryKey().defaultRandom(),
  createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  updatedAt: timestamp("updated_at", { withTimezone: true })
    .notNull()
    .defaultNow()
    .$onUpdate(() => new Date()),
};

/** PostgreSQL's full-text document type; Drizzle has no builder of its own for it. Read back as its text form. */
export const tsvector = customType<{ data: string }>({
  dataType() {
    return "tsvector";
  },
});
