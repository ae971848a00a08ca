// `npm start`: PostgreSQL, mail catcher and object store on loopback, migrations, demo seed, build when
// stale, then the app on http://127.0.0.1:3000. Ctrl-C stops everything it started.
import path from "node:path";
import { parseEnv } from "../lib/env";
import { buildIfStale } from "./lib/build";
import { log } from "./lib/log";
import { startNext, startStack, waitForHttp } from "./lib/stack";
import { DEMO_PASSWORD, DEMO_PIN, DEMO_SHOPS } from "../db/seed/demo";

const root = path.resolve(import.meta.dirname, "..");
const dev = process.argv.includes("--dev");
const appPort = Number(process.env.PORT ?? 3000);

async function main() {
  const stack = await startStack({
    root,
    dataDir: path.join(root, ".data"),
    pgPort: Number(process.env.PGPORT ?? 54329),
    smtpPort: Number(process.env.SMTP_PORT ?? 2525),
    s3Port: Number(process.env.S3_PORT ?? 4569),
    appPort,
    secretFile: path.join(root, ".data", "auth-secret"),
  });
  let stopping = false;
  const shutdown = async (code: number) => {
    if (stopping) return;
    stopping = true;
    log("app", "stopping…");
    if (app && app.exitCode === null) {
      app.kill("SIGTERM");
      await new Promise((r) => app!.once("exit", r));
    }
    await stack.stop();
    process.exit(code);
  };
  process.on("SIGINT", () => void shutdown(0));
  process.on("SIGTERM", () => void shutdown(0));
  let app: ReturnType<typeof startNext> | undefined;
  try {
    parseEnv(stack.env); // refuse to start with settings that do not validate
    if (!dev) buildIfStale(root, ".next", stack.env);
    app = startNext(root, stack.env, ".next", appPort, dev ? "dev" : "start");
    app.once("exit", (code) => {
      if (!stopping) {
        log("app", `the app exited (code ${code})`);
        void shutdown(code ?? 1);
      }
    });
    await waitForHttp(`http://127.0.0.1:${appPort}/api/health`, 120_000);
  } catch (error) {
    log("app", (error as Error).message);
    await shutdown(1);
    return;
  }
  const url = stack.env.APP_URL!;
  const accounts = DEMO_SHOPS.flatMap((s) => s.people.map((p) => `    ${p.email.padEnd(30)} ${p.roles.join(", ").padEnd(20)} ${s.name}`));
  console.log(`\nGusset is running at ${url}\n\n  Demo accounts (password ${DEMO_PASSWORD}, signing PIN ${DEMO_PIN}; demo only):\n${accounts.join("\n")}\n\n  Local mailbox: ${url}/mailbox (lead). Press Ctrl-C to stop.\n`);
  // Mails that could not be sent are retried every minute; qualification notices go out once a day
  // (the job is idempotent per qualification and day, so a restart or a second instance sends nothing twice).
  const internal = (path: string) =>
    fetch(`${url}${path}`, { method: "POST", headers: { "x-gusset-secret": stack.env.BETTER_AUTH_SECRET! } }).catch(() => {});
  setInterval(() => void internal("/api/internal/outbox"), 60_000).unref();
  void internal("/api/internal/qualification-notices");
  setInterval(() => void internal("/api/internal/qualification-notices"), 6 * 3600_000).unref();
}

main().catch((error) => {
  console.error(error);
  process.exit(1);
});
