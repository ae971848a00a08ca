// Builds the Next.js app only when its sources changed since the last build in that folder.
import { spawnSync } from "node:child_process";
import { createHash } from "node:crypto";
import fs from "node:fs";
import path from "node:path";
import { log } from "./log";

const SOURCES = ["app", "components", "lib", "db", "public", "templates"];
const FILES = ["next.config.mjs", "proxy.ts", "tailwind.config.ts", "postcss.config.mjs", "tsconfig.json", "package-lock.json"];

function walk(dir: string, out: string[]) {
  if (!fs.existsSync(dir)) return;
  for (const entry of fs.readdirSync(dir, { withFileTypes: true })) {
    const full = path.join(dir, entry.name);
    if (entry.isDirectory()) walk(full, out);
    else out.push(full);
  }
}

function sourceHash(root: string): string {
  const files: string[] = [];
  for (const d of SOURCES) walk(path.join(root, d), files);
  for (const f of FILES) if (fs.existsSync(path.join(root, f))) files.push(path.join(root, f));
  const hash = createHash("sha256");
  for (const f of files.sort()) {
    hash.update(path.relative(root, f));
    hash.update(fs.readFileSync(f));
  }
  return hash.digest("hex");
}

export function buildIfStale(root: string, distDir: string, env: NodeJS.ProcessEnv) {
  const stampFile = path.join(root, distDir, "gusset-build-stamp");
  const hash = sourceHash(root);
  const stamp = fs.existsSync(stampFile) ? fs.readFileSync(stampFile, "utf8") : "";
  if (stamp === hash && fs.existsSync(path.join(root, distDir, "BUILD_ID"))) {
    log("build", `build in ${distDir} is current`);
    return;
  }
  log("build", `building the app into ${distDir} (about a minute the first time)…`);
  const started = Date.now();
  const r = spawnSync(path.join(root, "node_modules/.bin/next"), ["build"], {
    cwd: root,
    stdio: "inherit",
    env: { ...env, NEXT_DIST_DIR: distDir, NEXT_TELEMETRY_DISABLED: "1" },
  });
  if (r.status !== 0) throw new Error(`next build failed (exit ${r.status})`);
  fs.writeFileSync(stampFile, hash);
  log("build", `built in ${((Date.now() - started) / 1000).toFixed(0)} s`);
}
