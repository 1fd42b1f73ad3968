import { drizzle } from "drizzle-orm/postgres-js";
import postgres from "postgres";
import { serverEnv } from "@/lib/env";
import * as schema from "./schema";

// Development reloads modules on every change; keeping the pool on globalThis stops each reload opening a new one.
const globalForDb = globalThis as unknown as { benchplateSql?: postgres.Sql };

// postgres() connects on the first query, so importing this during `next build` opens nothing.
const sql = globalForDb.benchplateSql ?? postgres(serverEnv().DATABASE_URL, { max: 10, onnotice: () => {} });
if (process.env.NODE_ENV !== "production") globalForDb.benchplateSql = sql;

export const db = drizzle(sql, { schema });

export type Database = typeof db;
export type Transaction = Parameters<Parameters<Database["transaction"]>[0]>[0];

export async function closeDatabase(): Promise<void> {
  await sql.end({ timeout: 5 });
}
