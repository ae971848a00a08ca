// Brings up everything the app needs on this machine: PostgreSQL (unless DATABASE_URL points elsewhere),
// the mail catcher (unless SMTP_URL is set), the object store (unless S3_ENDPOINT is set), migrations, seed.
import { spawn, type ChildProcess } from "node:child_process";
import { randomBytes } from "node:crypto";
import fs from "node:fs";
import path from "node:path";
import { runMigrations } from "../migrate";
import { seed } from "../../db/seed";
import { seedStorageFromEnv } from "../../db/seed/photos";
import { log } from "./log";
import { startLocalPostgres } from "./postgres";
import { startMailCatcher, startObjectStore } from "./services";

// The S3 SDK is pinned to a release that supports Node 20 (see STACK.md); its notice about later releases is noise here.
process.env.AWS_SDK_JS_NODE_VERSION_SUPPORT_WARNING_DISABLED ??= "true";

export type StackOptions = {
  root: string;
  dataDir: string;
  pgPort: number;
  smtpPort: number;
  s3Port: number;
  appPort: number;
  secretFile: string;
};

export type Stack = { env: NodeJS.ProcessEnv; adminDatabaseUrl: string | null; stop: () => Promise<void> };

export async function startStack(o: StackOptions): Promise<Stack> {
  const stops: (() => Promise<void> | void)[] = [];
  const stop = async () => {
    for (const s of stops.reverse()) {
      try {
        await s();
      } catch (error) {
        log("app", `while stopping: ${(error as Error).message}`);
      }
    }
  };
  try {
    const env: NodeJS.ProcessEnv = { ...process.env };
    fs.mkdirSync(o.dataDir, { recursive: true });
    let adminDatabaseUrl: string | null = null;
    if (!process.env.DATABASE_URL) {
      const pgServer = await startLocalPostgres({
        dataDir: path.join(o.dataDir, "postgres"),
        port: o.pgPort,
        database: "gusset",
        user: "gusset",
        password: "gusset-local",
      });
      stops.push(pgServer.stop);
      env.DATABASE_URL = pgServer.url;
      adminDatabaseUrl = pgServer.adminUrl;
    } else {
      log("db", "DATABASE_URL is set: using that server, no local PostgreSQL started");
    }
    await runMigrations(env.DATABASE_URL!);
    log("db", "migrations applied");

    if (!process.env.SMTP_URL) {
      const mail = await startMailCatcher({ port: o.smtpPort, databaseUrl: env.DATABASE_URL! });
      stops.push(mail.stop);
      env.SMTP_URL = mail.url;
      env.LOCAL_MAILBOX = "on";
    }
    if (!process.env.S3_ENDPOINT) {
      const s3 = await startObjectStore({ port: o.s3Port, directory: path.join(o.dataDir, "s3"), bucket: process.env.S3_BUCKET ?? "gusset-photos" });
      stops.push(s3.stop);
      env.S3_ENDPOINT = s3.endpoint;
      env.S3_ACCESS_KEY_ID = s3.accessKeyId;
      env.S3_SECRET_ACCESS_KEY = s3.secretAccessKey;
    }
    // After the object store: the demo jobs carry photos.
    const seeded = await seed(env.DATABASE_URL!, seedStorageFromEnv(env));
    log("db", seeded.created.length ? `demo data seeded (${seeded.created.length} records)` : "demo data already present; nothing changed");
    if (!env.BETTER_AUTH_SECRET) {
      if (!fs.existsSync(o.secretFile)) fs.writeFileSync(o.secretFile, randomBytes(32).toString("base64url"), { mode: 0o600 });
      env.BETTER_AUTH_SECRET = fs.readFileSync(o.secretFile, "utf8").trim();
    }
    env.APP_URL ??= `http://127.0.0.1:${o.appPort}`;
    (env as Record<string, string>).NODE_ENV = "production";
    return { env, adminDatabaseUrl, stop };
  } catch (error) {
    await stop();
    throw error;
  }
}

export function startNext(root: string, env: NodeJS.ProcessEnv, distDir: string, port: number, mode: "start" | "dev" = "start"): ChildProcess {
  const child = spawn(path.join(root, "node_modules/.bin/next"), [mode, "-H", "127.0.0.1", "-p", String(port)], {
    cwd: root,
    env: { ...env, NEXT_DIST_DIR: distDir, NEXT_TELEMETRY_DISABLED: "1", ...(mode === "dev" ? { NODE_ENV: "development" } : {}) },
    stdio: ["ignore", "inherit", "inherit"],
  });
  return child;
}

export async function waitForHttp(url: string, timeoutMs = 60_000) {
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    try {
      const res = await fetch(url);
      if (res.status < 500) return;
    } catch {
      // not up yet
    }
    await new Promise((r) => setTimeout(r, 300));
  }
  throw new Error(`${url} did not answer within ${timeoutMs / 1000} s`);
}
