import { relations } from "drizzle-orm";
import { boolean, index, integer, pgEnum, pgTable, primaryKey, text, timestamp, uniqueIndex, uuid } from "drizzle-orm/pg-core";
import { rowIdentity } from "./columns";

export const userRoleEnum = pgEnum("user_role", ["reader", "reviewer", "editor", "admin"]);

export const users = pgTable(
  "users",
  {
    ...rowIdentity,
    email: text("email").notNull(),
    name: text("name").notNull(),
    passwordHash: text("password_hash").notNull(),
    role: userRoleEnum("role").notNull().default("reader"),
    avatarKey: text("avatar_key"),
    /** Comments from trusted readers skip the moderation queue; editors grant it. */
    trustedCommenter: boolean("trusted_commenter").notNull().default(false),
  },
  (table) => [uniqueIndex("users_email_unique").on(table.email)],
);

export const labs = pgTable(
  "labs",
  {
    ...rowIdentity,
    slug: text("slug").notNull(),
    name: text("name").notNull(),
    city: text("city").notNull(),
    nominalVoltage: integer("nominal_voltage").notNull(),
    frequencyHz: integer("frequency_hz").notNull(),
  },
  (table) => [uniqueIndex("labs_slug_unique").on(table.slug)],
);

export const labMembers = pgTable(
  "lab_members",
  {
    labId: uuid("lab_id")
      .notNull()
      .references(() => labs.id, { onDelete: "cascade" }),
    userId: uuid("user_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (table) => [primaryKey({ columns: [table.labId, table.userId] })],
);

export const passwordResetTokens = pgTable(
  "password_reset_tokens",
  {
    ...rowIdentity,
    userId: uuid("user_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    tokenHash: text("token_hash").notNull(),
    expiresAt: timestamp("expires_at", { withTimezone: true }).notNull(),
    usedAt: timestamp("used_at", { withTimezone: true }),
  },
  (table) => [uniqueIndex("password_reset_tokens_hash_unique").on(table.tokenHash)],
);

export const signInAttempts = pgTable(
  "sign_in_attempts",
  {
    ...rowIdentity,
    email: text("email").notNull(),
    clientAddress: text("client_address").notNull(),
    succeeded: boolean("succeeded").notNull(),
  },
  (table) => [
    index("sign_in_attempts_email_idx").on(table.email, table.createdAt),
    index("sign_in_attempts_address_idx").on(table.clientAddress, table.createdAt),
  ],
);

export const usersRelations = relations(users, ({ many }) => ({
  labMemberships: many(labMembers),
}));

export const labsRelations = relations(labs, ({ many }) => ({
  members: many(labMembers),
}));

export const labMembersRelations = relations(labMembers, ({ one }) => ({
  lab: one(labs, { fields: [labMembers.labId], references: [labs.id] }),
  user: one(users, { fields: [labMembers.userId], references: [users.id] }),
}));

export type User = typeof users.$inferSelect;
export type NewUser = typeof users.$inferInsert;
export type UserRole = (typeof userRoleEnum.enumValues)[number];
export type Lab = typeof labs.$inferSelect;
export type NewLab = typeof labs.$inferInsert;
export type PasswordResetToken = typeof passwordResetTokens.$inferSelect;
