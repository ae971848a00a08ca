// The backup drill: `npm run backup` of the running test installation, `npm run restore` into a fresh
// PostgreSQL cluster and a fresh bucket, then every job's record verifies intact with the same seal.
import { spawnSync } from "node:child_process";
import { createHash } from "node:crypto";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { GetObjectCommand, ListObjectsV2Command, S3Client } from "@aws-sdk/client-s3";
import { drizzle } from "drizzle-orm/node-postgres";
import pg from "pg";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as schema from "@/db/schema";
import { verifyJobRecord } from "@/db/queries/records";
import { startLocalPostgres, type LocalPostgres } from "../../scripts/lib/postgres";
import { withDb } from "./support";

const root = path.resolve(import.meta.dirname, "../..");
// A cluster of its own on a port of its own, so the drill never touches the test database.
const RESTORE_PGPORT = Number(process.env.RESTORE_TEST_PGPORT ?? 54363);
const work = fs.mkdtempSync(path.join(os.tmpdir(), "gusset-drill-"));
const bucket = `restore-drill-${Date.now()}`;
let fresh: LocalPostgres;

function npm(script: string, args: string[], env: Record<string, string>) {
  const r = spawnSync("npx", ["tsx", path.join(root, "scripts", `${script}.ts`), ...args], { cwd: root, env: { ...process.env, ...env }, encoding: "utf8", timeout: 120_000 });
  return { status: r.status, out: `${r.stdout}\n${r.stderr}` };
}

async function seals(url: string) {
  const pool = new pg.Pool({ connectionString: url, max: 2 });
  try {
    const runner = drizzle(pool, { schema });
    const jobs = await pool.query<{ id: string }>("select id from job order by id");
    const out: Record<string, { intact: boolean; entries: number; seal: string | null }> = {};
    for (const j of jobs.rows) {
      const v = await verifyJobRecord(j.id, runner);
      out[j.id] = { intact: v.intact, entries: v.entries, seal: v.seal };
    }
    return out;
  } finally {
    await pool.end();
  }
}

async function objectSums(bucketName: string) {
  const s3 = new S3Client({ endpoint: process.env.S3_ENDPOINT, region: "us-east-1", forcePathStyle: true, credentials: { accessKeyId: process.env.S3_ACCESS_KEY_ID ?? "S3RVER", secretAccessKey: process.env.S3_SECRET_ACCESS_KEY ?? "S3RVER" } });
  const sums: Record<string, string> = {};
  try {
    const page = await s3.send(new ListObjectsV2Command({ Bucket: bucketName }));
    for (const o of page.Contents ?? []) {
      const got = await s3.send(new GetObjectCommand({ Bucket: bucketName, Key: o.Key! }));
      sums[o.Key!] = createHash("sha256").update(await got.Body!.transformToByteArray()).digest("hex");
    }
  } finally {
    s3.destroy();
  }
  return sums;
}

beforeAll(async () => {
  fresh = await startLocalPostgres({ dataDir: path.join(work, "pg"), port: RESTORE_PGPORT, database: "gusset", user: "gusset", password: "gusset-local" });
}, 90_000);

afterAll(() => {
  fresh?.stop();
  fs.rmSync(work, { recursive: true, force: true });
});

describe("npm run backup / npm run restore", () => {
  it("are scripts of the project", () => {
    const scripts = JSON.parse(fs.readFileSync(path.join(root, "package.json"), "utf8")).scripts;
    expect(scripts.backup).toBe("tsx scripts/backup.ts");
    expect(scripts.restore).toBe("tsx scripts/restore.ts");
  });

  it("restores into a fresh cluster where every job verifies intact with the same seal, and refuses a non-empty database without --force", async () => {
    const before = await seals(process.env.DATABASE_URL!);
    // Other tests tamper with some records on purpose; the intact ones must come back intact with the same seal.
    const sealed = Object.values(before).filter((s) => s.entries > 0 && s.intact);
    expect(sealed.length).toBeGreaterThan(0);
    const objectsBefore = await objectSums(process.env.S3_BUCKET ?? "gusset-photos");
    expect(Object.keys(objectsBefore).length).toBeGreaterThan(0);

    const made = npm("backup", [work], {});
    expect(made.status, made.out).toBe(0);
    const archive = fs.readdirSync(work).find((f) => /^gusset-backup-\d{8}-\d{6}\.tar\.gz$/.test(f));
    expect(archive, made.out).toBeDefined();
    const listing = spawnSync("tar", ["-tzf", path.join(work, archive!)], { encoding: "utf8" }).stdout;
    expect(listing).toMatch(/manifest\.json/);
    expect(listing).toMatch(/database\.dump/);

    const target = { DATABASE_URL: fresh.url, S3_BUCKET: bucket };
    const restored = npm("restore", [path.join(work, archive!)], target);
    expect(restored.status, restored.out).toBe(0);

    const after = await seals(fresh.url);
    expect(Object.keys(after).sort()).toEqual(Object.keys(before).sort());
    for (const [jobId, s] of Object.entries(before)) {
      expect(after[jobId], jobId).toEqual(s);
      if (s.intact) expect(after[jobId]!.seal, jobId).toBe(s.seal);
    }
    expect(await objectSums(bucket)).toEqual(objectsBefore);

    // A second restore would overwrite what is now there: refused unless asked for.
    const again = npm("restore", [path.join(work, archive!)], target);
    expect(again.status).not.toBe(0);
    expect(again.out).toMatch(/not empty.*--force/);
    const forced = npm("restore", [path.join(work, archive!), "--force"], target);
    expect(forced.status, forced.out).toBe(0);
    expect(await seals(fresh.url)).toEqual(after);
    // The source is untouched by all this.
    expect(await withDb(async (c) => (await c.query("select count(*)::int as n from job")).rows[0].n)).toBe(Object.keys(before).length);
  }, 240_000);
});
