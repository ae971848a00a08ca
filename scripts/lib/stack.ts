// Brings up everything the app needs on this machine: PostgreSQL (unless DATABASE_URL points elsewhere),
// the mail catcher (unless SMTP_URL is set), the object store (unless S3_ENDPOINT is set), migrations, seed.
import { spawn, type ChildProcess } from "node:child_process";
import { randomBytes } from "node:crypto";
import fs from "node:fs";
import path from "node:path";
import { httpsOrigins } from "../../lib/net/addresses";
import { runMigrations } from "../migrate";
import { seed } from "../../db/seed";
import { seedStorageFromEnv } from "../../db/seed/photos";
import { ensureShopCertificate, lanAddress, machineNames, type ShopCertificate } from "./certs";
import { log } from "./log";
import { withTimeout } from "./processes";
import { startLocalPostgres } from "./postgres";
import { startMailCatcher, startObjectStore } from "./services";

// The S3 SDK is pinned to a release that supports Node 20 (see STACK.md); its notice about later releases is noise here.
process.env.AWS_SDK_JS_NODE_VERSION_SUPPORT_WARNING_DISABLED ??= "true";

type StackOptions = {
  root: string;
  dataDir: string;
  pgPort: number;
  smtpPort: number;
  s3Port: number;
  appPort: number;
  secretFile: string;
  // HTTPS with the shop certificate on this port; null when a proxy in front terminates TLS (APP_URL https).
  https: { port: number; extraNames?: string[] } | null;
};

type Stack = {
  env: NodeJS.ProcessEnv;
  adminDatabaseUrl: string | null;
  certificate: ShopCertificate | null;
  // The local PostgreSQL's data folder (null with DATABASE_URL), so its crash can be noticed.
  postgresDataDir: string | null;
  stop: () => Promise<void>;
};

const STOP_TIMEOUT_MS = 8_000;

export async function startStack(o: StackOptions): Promise<Stack> {
  const stops: (() => Promise<void> | void)[] = [];
  let stopped = false;
  const stop = async () => {
    if (stopped) return;
    stopped = true;
    // Each service gets a bounded time: one that hangs (a client that never hangs up) must not keep the
    // others listening.
    for (const s of stops.reverse()) {
      try {
        await withTimeout(Promise.resolve().then(s), STOP_TIMEOUT_MS);
      } catch (error) {
        log("app", `while stopping: ${(error as Error).message}`);
      }
    }
  };
  try {
    const env: NodeJS.ProcessEnv = { ...process.env };
    fs.mkdirSync(o.dataDir, { recursive: true });
    let adminDatabaseUrl: string | null = null;
    let postgresDataDir: string | null = null;
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
      if (pgServer.startedByUs) postgresDataDir = pgServer.dataDir;
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
    env.PORT = String(o.appPort);
    let certificate: ShopCertificate | null = null;
    if (o.https) {
      const extra = [...(o.https.extraNames ?? []), ...(process.env.HTTPS_NAMES ?? "").split(",")].map((n) => n.trim()).filter(Boolean);
      certificate = ensureShopCertificate({ dir: path.join(o.dataDir, "tls"), names: machineNames({ extra }) });
      if (certificate.created.ca) log("app", `created the shop's certificate authority in ${path.relative(o.root, path.dirname(certificate.files.caCert))}`);
      if (certificate.created.server) log("app", `issued the server certificate for ${certificate.names.join(", ")}`);
      const lan = lanAddress(certificate.names) ?? "localhost";
      env.HTTPS_PORT = String(o.https.port);
      env.TLS_CERT_FILE = certificate.files.cert;
      env.TLS_KEY_FILE = certificate.files.key;
      env.SHOP_CA_FILE = certificate.files.caCert;
      env.LAN_URL ??= httpsOrigins([lan], o.https.port)[0];
      // Sign-in is accepted from every address the certificate names, and from this computer over http.
      env.TRUSTED_ORIGINS = [
        ...httpsOrigins(certificate.names, o.https.port),
        `http://127.0.0.1:${o.appPort}`,
        `http://localhost:${o.appPort}`,
        ...(process.env.TRUSTED_ORIGINS ?? "").split(",").map((x) => x.trim()).filter(Boolean),
      ].join(",");
    }
    (env as Record<string, string>).NODE_ENV = "production";
    return { env, adminDatabaseUrl, certificate, postgresDataDir, stop };
  } catch (error) {
    await stop();
    throw error;
  }
}

// The app (scripts/serve.ts: Next's handler on http PORT and, with a certificate, HTTPS on HTTPS_PORT).
export function startNext(root: string, env: NodeJS.ProcessEnv, distDir: string, port: number, mode: "start" | "dev" = "start"): ChildProcess {
  // Node with tsx's loader in-process (not the tsx CLI, which would sit between us and the server's signals).
  const args = ["--import", "tsx", path.join(root, "scripts/serve.ts"), ...(mode === "dev" ? ["--dev"] : [])];
  const child = spawn(process.execPath, args, {
    cwd: root,
    env: { ...env, PORT: String(port), NEXT_DIST_DIR: distDir, NEXT_TELEMETRY_DISABLED: "1", ...(mode === "dev" ? { NODE_ENV: "development" } : {}) },
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
