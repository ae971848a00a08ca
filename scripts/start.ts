// `npm start`: PostgreSQL, mail catcher and object store on loopback, migrations, demo seed, build when
// stale, then the app: http://127.0.0.1:3000 for this computer and HTTPS with the shop's own certificate for
// tablets and phones on the shop's network. Ctrl-C, or the crash of any part, stops everything it started.
import path from "node:path";
import QRCode from "qrcode";
import { parseEnv } from "../lib/env";
import { buildIfStale } from "./lib/build";
import { log } from "./lib/log";
import { postmasterPid } from "./lib/postgres";
import { stopChild } from "./lib/processes";
import { startNext, startStack, waitForHttp } from "./lib/stack";
import { DEMO_PASSWORD, DEMO_PIN, DEMO_SHOPS } from "../db/seed/demo";

const root = path.resolve(import.meta.dirname, "..");
const dev = process.argv.includes("--dev");
const appPort = Number(process.env.PORT ?? 3000);
const httpsPort = Number(process.env.HTTPS_PORT ?? 3443);
// An https APP_URL means a proxy of the shop's own terminates TLS: no certificate of ours then.
const behindProxy = /^https:/i.test(process.env.APP_URL ?? "");
// Whatever happens, the whole stop is over in this time.
const STOP_DEADLINE_MS = 30_000;

async function main() {
  let app: ReturnType<typeof startNext> | undefined;
  const started: { stack?: Awaited<ReturnType<typeof startStack>> } = {};
  let stopping = false;
  const shutdown = async (code: number) => {
    if (stopping) return;
    stopping = true;
    log("app", "stopping…");
    setTimeout(() => {
      log("app", `still stopping after ${STOP_DEADLINE_MS / 1000} s; leaving now`);
      app?.kill("SIGKILL");
      process.exit(code || 1);
    }, STOP_DEADLINE_MS);
    await stopChild(app);
    await started.stack?.stop();
    process.exit(code);
  };
  process.on("SIGINT", () => void shutdown(0));
  process.on("SIGTERM", () => void shutdown(0));
  // The mail catcher and object store run in this process: an error of theirs must not leave the app and
  // PostgreSQL running without them.
  process.on("uncaughtException", (error) => {
    log("app", `stopping after an error: ${error.message}`);
    void shutdown(1);
  });
  process.on("unhandledRejection", (error) => {
    log("app", `stopping after an error: ${(error as Error)?.message ?? String(error)}`);
    void shutdown(1);
  });

  const stack = await startStack({
    root,
    dataDir: path.join(root, ".data"),
    pgPort: Number(process.env.PGPORT ?? 54329),
    smtpPort: Number(process.env.SMTP_PORT ?? 2525),
    s3Port: Number(process.env.S3_PORT ?? 4569),
    appPort,
    secretFile: path.join(root, ".data", "auth-secret"),
    https: behindProxy ? null : { port: httpsPort },
  });
  started.stack = stack;
  // Tablets reach the app over the network; behind a proxy of the shop's own, only that proxy needs to.
  stack.env.BIND_ADDRESS ??= behindProxy ? "127.0.0.1" : "::";
  try {
    parseEnv(stack.env); // refuse to start with settings that do not validate
    if (!dev) buildIfStale(root, ".next", stack.env);
    app = startNext(root, stack.env, ".next", appPort, dev ? "dev" : "start");
    app.once("exit", (code, signal) => {
      if (!stopping) {
        log("app", `the app exited (${signal ?? `code ${code}`})`);
        void shutdown(code || 1);
      }
    });
    await waitForHttp(`http://127.0.0.1:${appPort}/api/health`, 120_000);
  } catch (error) {
    log("app", (error as Error).message);
    await shutdown(1);
    return;
  }
  const pgDir = stack.postgresDataDir;
  if (pgDir) {
    setInterval(() => {
      if (!stopping && postmasterPid(pgDir) === null) {
        log("db", "PostgreSQL is no longer running");
        void shutdown(1);
      }
    }, 3_000).unref();
  }

  const url = stack.env.APP_URL!;
  const lan = stack.env.LAN_URL;
  const accounts = DEMO_SHOPS.flatMap((s) => s.people.map((p) => `    ${p.email.padEnd(30)} ${p.roles.join(", ").padEnd(20)} ${s.name}`));
  let devices = "";
  if (lan && stack.certificate) {
    const qr = await QRCode.toString(lan, { type: "terminal", small: true });
    devices =
      `\n  Tablets and phones on this network: ${lan}\n` +
      `${qr.replace(/^/gm, "    ")}\n` +
      `  Install the shop certificate on each device once (a lead's Devices page shows how): ${url}/devices\n` +
      `  Its SHA-256 fingerprint: ${stack.certificate.caFingerprint}\n`;
  }
  console.log(`\nGusset is running at ${url}\n${devices}\n  Demo accounts (password ${DEMO_PASSWORD}, signing PIN ${DEMO_PIN}; demo only):\n${accounts.join("\n")}\n\n  Local mailbox: ${url}/mailbox (lead). Press Ctrl-C to stop.\n`);
  // Mails that could not be sent are retried every minute; qualification notices go out once a day
  // (the job is idempotent per qualification and day, so a restart or a second instance sends nothing twice).
  const internal = (p: string) =>
    fetch(`http://127.0.0.1:${appPort}${p}`, { method: "POST", headers: { "x-gusset-secret": stack.env.BETTER_AUTH_SECRET! } }).catch(() => {});
  setInterval(() => void internal("/api/internal/outbox"), 60_000).unref();
  void internal("/api/internal/qualification-notices");
  setInterval(() => void internal("/api/internal/qualification-notices"), 6 * 3600_000).unref();
}

main().catch((error) => {
  console.error(error);
  process.exit(1);
});
