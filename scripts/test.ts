// `npm test`: typecheck, lint, unit tests, then integration and browser tests against a throwaway
// PostgreSQL cluster, mail catcher and object store (own folder and ports, removed afterwards).
import { spawn, spawnSync } from "node:child_process";
import fs from "node:fs";
import path from "node:path";
import { buildIfStale } from "./lib/build";
import { log } from "./lib/log";
import { aptInstall } from "./lib/postgres";
import { stopChild } from "./lib/processes";
import { startNext, startStack, waitForHttp } from "./lib/stack";

const root = path.resolve(import.meta.dirname, "..");
const bin = (name: string) => path.join(root, "node_modules/.bin", name);
// `npm test -- e2e` runs one stage after the static checks; a path among the arguments
// (`npm test -- e2e tests/e2e/weight.spec.ts`) narrows the stage's runner to the files it names.
const args = process.argv.slice(2);
const only = args.filter((a) => !a.includes("/"));
const files = args.filter((a) => a.includes("/"));
const runStage = (name: string) => only.length === 0 || only.includes(name);
const filesFor = (dir: string) => files.filter((f) => f.includes(dir));

type Count = { passed: number; failed: number; skipped: number };
const totals: Record<string, Count> = {};
const failures: string[] = [];

function run(name: string, cmd: string, args: string[], env: NodeJS.ProcessEnv = process.env): Promise<number> {
  log("test", `${name}: ${path.basename(cmd)} ${args.join(" ")}`);
  return new Promise((resolve) => {
    const child = spawn(cmd, args, { cwd: root, env, stdio: "inherit" });
    child.on("exit", (code) => resolve(code ?? 1));
  });
}

function readVitest(file: string, stage: string) {
  if (!fs.existsSync(file)) return;
  const r = JSON.parse(fs.readFileSync(file, "utf8"));
  totals[stage] = { passed: r.numPassedTests ?? 0, failed: r.numFailedTests ?? 0, skipped: (r.numPendingTests ?? 0) + (r.numTodoTests ?? 0) };
}

function readPlaywright(file: string) {
  if (!fs.existsSync(file)) return;
  const r = JSON.parse(fs.readFileSync(file, "utf8"));
  const s = r.stats ?? {};
  totals.e2e = { passed: (s.expected ?? 0) + (s.flaky ?? 0), failed: s.unexpected ?? 0, skipped: s.skipped ?? 0 };
}

function ensureChromium() {
  if (fs.existsSync("/usr/bin/chromium")) return;
  if (process.getuid?.() !== 0) {
    throw new Error("Chromium not found at /usr/bin/chromium. Install the Debian package `chromium` (sudo apt-get install -y chromium).");
  }
  log("test", "installing Debian's `chromium` package for the browser tests…");
  aptInstall(["chromium"]);
}

async function main() {
  const started = Date.now();
  const reports = path.join(root, ".data", "test-reports");
  fs.rmSync(reports, { recursive: true, force: true });
  fs.mkdirSync(reports, { recursive: true });

  if (runStage("static")) {
    if ((await run("typecheck", bin("tsc"), ["--noEmit", "-p", "."])) !== 0) failures.push("typecheck");
    if ((await run("lint", bin("eslint"), ["--max-warnings=0", "."])) !== 0) failures.push("lint");
  }
  if (runStage("unit")) {
    const unitJson = path.join(reports, "unit.json");
    const code = await run("unit", bin("vitest"), ["run", "--project", "unit", "--reporter=default", "--reporter=json", `--outputFile.json=${unitJson}`, ...filesFor("tests/unit")]);
    readVitest(unitJson, "unit");
    if (code !== 0) failures.push("unit tests");
  }

  if (runStage("integration") || runStage("e2e")) {
    const dataDir = path.join(root, ".data", `test-${process.pid}`);
    const appPort = Number(process.env.TEST_APP_PORT ?? 3100);
    const httpsPort = Number(process.env.TEST_HTTPS_PORT ?? 3543);
    process.env.PG_FSYNC = "off"; // a throwaway cluster need not survive a power cut
    const stack = await startStack({
      root,
      dataDir,
      pgPort: Number(process.env.TEST_PGPORT ?? 54339),
      smtpPort: Number(process.env.TEST_SMTP_PORT ?? 2526),
      s3Port: Number(process.env.TEST_S3_PORT ?? 4570),
      appPort,
      secretFile: path.join(dataDir, "auth-secret"),
      // A made-up LAN name the browser tests map to 127.0.0.1, as a tablet would reach the shop computer.
      https: { port: httpsPort, extraNames: ["shop-pc.test"] },
    });
    const testEnv: NodeJS.ProcessEnv = {
      ...stack.env,
      APP_URL: `http://127.0.0.1:${appPort}`,
      BIND_ADDRESS: "127.0.0.1",
      GUSSET_TEST_URL: `http://127.0.0.1:${appPort}`,
      GUSSET_TEST_HTTPS_URL: `https://shop-pc.test:${httpsPort}`,
      LAN_URL: `https://shop-pc.test:${httpsPort}`,
      ADMIN_DATABASE_URL: stack.adminDatabaseUrl ?? "",
    };
    let app: ReturnType<typeof startNext> | undefined;
    try {
      const distDir = process.env.TEST_DIST_DIR ?? ".next-test";
      buildIfStale(root, distDir, testEnv);
      app = startNext(root, testEnv, distDir, appPort);
      await waitForHttp(`${testEnv.GUSSET_TEST_URL}/api/health`, 90_000);
      if (runStage("integration")) {
        const json = path.join(reports, "integration.json");
        const code = await run("integration", bin("vitest"), ["run", "--project", "integration", "--reporter=default", "--reporter=json", `--outputFile.json=${json}`, ...filesFor("tests/integration")], testEnv);
        readVitest(json, "integration");
        if (code !== 0) failures.push("integration tests");
      }
      if (runStage("e2e")) {
        ensureChromium();
        const json = path.join(reports, "e2e.json");
        const code = await run("e2e", bin("playwright"), ["test", ...filesFor("tests/e2e")], { ...testEnv, PLAYWRIGHT_JSON_OUTPUT_NAME: json });
        readPlaywright(json);
        if (code !== 0) failures.push("browser tests");
      }
    } catch (error) {
      failures.push(`test stack: ${(error as Error).message}`);
    } finally {
      await stopChild(app);
      await stack.stop();
      if (!process.env.KEEP_TEST_DATA) spawnSync("rm", ["-rf", dataDir]);
    }
  }

  const sum = Object.values(totals).reduce((a, c) => ({ passed: a.passed + c.passed, failed: a.failed + c.failed, skipped: a.skipped + c.skipped }), { passed: 0, failed: 0, skipped: 0 });
  const seconds = ((Date.now() - started) / 1000).toFixed(0);
  console.log("");
  for (const [stage, c] of Object.entries(totals)) console.log(`  ${stage.padEnd(12)} ${c.passed} passed, ${c.failed} failed${c.skipped ? `, ${c.skipped} skipped` : ""}`);
  if (failures.length) console.log(`  failed stages: ${failures.join(", ")}`);
  console.log(`  (${seconds} s)`);
  console.log(`${sum.passed} passed, ${sum.failed + (failures.length && sum.failed === 0 ? failures.length : 0)} failed${sum.skipped ? `, ${sum.skipped} skipped` : ""}`);
  process.exit(failures.length ? 1 : 0);
}

main().catch((error) => {
  console.error(error);
  console.log("0 passed, 1 failed");
  process.exit(1);
});
