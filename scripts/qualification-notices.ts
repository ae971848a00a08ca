// The daily lapsing-notice job, by hand or from cron: `npx tsx scripts/qualification-notices.ts`
// (DATABASE_URL names the database; SMTP_URL the mail server, else the local catcher's default).
// `--today=YYYY-MM-DD` runs it as of another day. Running it twice in a day mails nothing new.
import { spawnSync } from "node:child_process";
import { randomBytes } from "node:crypto";

// The query and mail modules are server-only; outside Next.js that needs the react-server condition,
// so the script starts itself again with it (the heavy imports below are dynamic for that reason).
const REACT_SERVER = "--conditions=react-server";
const underReactServer = process.execArgv.includes(REACT_SERVER) || (process.env.NODE_OPTIONS ?? "").includes("react-server");

async function main() {
  if (!process.env.DATABASE_URL) {
    console.error("Set DATABASE_URL to the database whose shops should be checked.");
    process.exit(1);
  }
  const todayArg = process.argv.find((a) => a.startsWith("--today="))?.slice("--today=".length);
  const { parseIsoDate } = await import("../lib/welding/continuity");
  if (todayArg !== undefined) {
    try {
      parseIsoDate(todayArg);
    } catch {
      console.error(`--today must be a calendar date YYYY-MM-DD, not "${todayArg}".`);
      process.exit(1);
    }
  }
  // The settings schema insists on an auth secret the job never uses (it signs nothing); a throwaway one
  // lets the script run with only DATABASE_URL.
  process.env.BETTER_AUTH_SECRET ??= randomBytes(32).toString("base64url");
  const { runQualificationNotices } = await import("../app/api/internal/qualification-notices/run");
  const { db } = await import("../lib/db");
  try {
    const r = await runQualificationNotices(todayArg ? { today: todayArg } : {});
    console.log(
      `qualification notices for ${r.today}: ${r.lapsing} lapsing within 30 days; ${r.sent} mailed, ${r.queued} left in the outbox for retry, ${r.alreadyNoticed} already noticed`,
    );
  } finally {
    await db().$client.end();
  }
}

if (!underReactServer) {
  const r = spawnSync(process.execPath, [REACT_SERVER, ...process.execArgv, ...process.argv.slice(1)], { stdio: "inherit", env: process.env });
  process.exit(r.status ?? 1);
} else {
  main().catch((error) => {
    console.error(error instanceof Error ? `${error.message}${error.cause ? `\n${String((error.cause as Error).message ?? error.cause)}` : ""}` : error);
    process.exit(1);
  });
}
