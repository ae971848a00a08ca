// Applies the committed drizzle-kit migrations (db/migrations) to DATABASE_URL, then the database rules
// in db/sql (triggers that refuse changes to signed records), which are written to be re-run safely.
import fs from "node:fs";
import path from "node:path";
import { drizzle } from "drizzle-orm/node-postgres";
import { migrate } from "drizzle-orm/node-postgres/migrator";
import pg from "pg";

export async function runMigrations(databaseUrl: string) {
  const pool = new pg.Pool({ connectionString: databaseUrl, max: 1 });
  try {
    await migrate(drizzle(pool), { migrationsFolder: path.resolve(import.meta.dirname, "../db/migrations") });
    const sqlDir = path.resolve(import.meta.dirname, "../db/sql");
    for (const file of fs.readdirSync(sqlDir).filter((f) => f.endsWith(".sql")).sort()) {
      await pool.query(fs.readFileSync(path.join(sqlDir, file), "utf8"));
    }
  } finally {
    await pool.end();
  }
}

if (import.meta.url === `file://${process.argv[1]}`) {
  const url = process.env.DATABASE_URL;
  if (!url) {
    console.error("Set DATABASE_URL to the database to migrate.");
    process.exit(1);
  }
  runMigrations(url).then(
    () => console.log("migrations applied"),
    (error) => {
      console.error(error);
      process.exit(1);
    },
  );
}
