import { drizzle } from "drizzle-orm/node-postgres";
import pg from "pg";
import * as schema from "@/db/schema";
import { env } from "@/lib/env";

export type Db = ReturnType<typeof createDb>;

export function createDb(url: string) {
  const pool = new pg.Pool({ connectionString: url, max: 10 });
  pool.on("error", (error) => console.error("[db] idle client error", error.message));
  return drizzle(pool, { schema });
}

const globalForDb = globalThis as unknown as { gussetDb?: Db };

// One pool per process, kept across hot reloads.
export function db(): Db {
  globalForDb.gussetDb ??= createDb(env().DATABASE_URL);
  return globalForDb.gussetDb;
}

export { schema };
