import "server-only";
import { sql } from "drizzle-orm";
import { db } from "@/lib/db";

export async function databaseIsUp(timeoutMs = 2000): Promise<boolean> {
  try {
    const probe = db().execute(sql`select 1`);
    const timeout = new Promise<never>((_, reject) => setTimeout(() => reject(new Error("timeout")), timeoutMs));
    await Promise.race([probe, timeout]);
    return true;
  } catch (error) {
    console.error("[health] database check failed:", (error as Error).message);
    return false;
  }
}
