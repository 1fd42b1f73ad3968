import { drizzle } from "drizzle-orm/postgres-js";
import { migrate } from "drizzle-orm/postgres-js/migrator";
import postgres from "postgres";
import { serverEnv } from "@/lib/env";

const sql = postgres(serverEnv().DATABASE_URL, { max: 1, onnotice: () => {} });
try {
  await migrate(drizzle(sql), { migrationsFolder: new URL("./migrations", import.meta.url).pathname });
  console.log("migrations applied");
} finally {
  await sql.end();
}
