import "server-only";
import { eq, getTableName, like, or, sql } from "drizzle-orm";
import type { PgColumn, PgTable } from "drizzle-orm/pg-core";
import type { Transaction } from "@/db";
import { firstFreeSlug } from "@/lib/slug";

/**
 * The first of `base`, `base-2`, … not yet used in `column`. Holds a transaction-long lock per table, so two rows named
 * alike at the same moment do not both pick the same slug; insert the row in the same transaction.
 */
export async function claimFreeSlug(tx: Transaction, { table, column, base }: { table: PgTable; column: PgColumn; base: string }) {
  await tx.execute(sql`select pg_advisory_xact_lock(hashtext(${`benchplate:slugs:${getTableName(table)}`}))`);
  const taken = await tx
    .select({ slug: column })
    .from(table)
    .where(or(eq(column, base), like(column, `${base}-%`)));
  return firstFreeSlug(base, new Set(taken.map((row) => String(row.slug))));
}
