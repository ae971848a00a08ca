// Quality figures at the demo's size and with 10,000 jobs. A throwaway PostgreSQL (own folder and port) gets
// the demo seed; the figures are timed; then 10,000 jobs are made from the demo shop's jobs with set-based
// SQL (each copy an older stretch of the shop's history, closed by now) and the figures timed again.
// Target: with 10,000 jobs, at most 3× the time at the demo's size (the screen's default 90-day window).
import { spawnSync } from "node:child_process";
import path from "node:path";
import { pathToFileURL } from "node:url";
import pg from "pg";
import { startStack } from "@/scripts/lib/stack";

const root = path.resolve(import.meta.dirname, "..");
const TARGET_JOBS = 10_000;
/** Each copy of the demo's jobs is this much older than the one before: about 48 jobs a week. */
const HOURS_APART = 28;

type Measured = { jobs: number; default: { ms: number; inspected: number; points: number }; all: { ms: number; inspected: number; points: number } };

function measure(env: NodeJS.ProcessEnv): Measured {
  const r = spawnSync(process.execPath, ["--conditions=react-server", "--import", "tsx", path.join(root, "bench/quality-measure.ts")], {
    cwd: root,
    env,
    encoding: "utf8",
  });
  if (r.status !== 0) throw new Error(`measuring failed: ${r.stderr || r.stdout}`);
  return JSON.parse(r.stdout.trim().split("\n").at(-1)!) as Measured;
}

// Cloned tables in foreign-key order. Ids that point at cloned rows are mapped (md5 of id and copy number);
// times move back by the copy's age; open jobs of the demo become closed history.
const TABLES = ["job", "job_step", "job_assignment", "nonconformance", "sign_off", "nonconformance_disposition", "weld_pass", "weld_inspection", "job_activity"];
const MAPPED_IDS = new Set(["id", "job_id", "step_id", "sign_off_id", "nonconformance_id", "amends_sign_off_id"]);

async function generateJobs(url: string, shopSlug: string) {
  const client = new pg.Client({ connectionString: url });
  await client.connect();
  try {
    const shop = await client.query<{ id: string }>("select id from shop where slug = $1", [shopSlug]);
    const shopId = shop.rows[0]!.id;
    const demoJobs = await client.query<{ n: number }>("select count(*)::int as n from job where shop_id = $1", [shopId]);
    const copies = Math.ceil((TARGET_JOBS - demoJobs.rows[0]!.n) / demoJobs.rows[0]!.n);
    await client.query("begin");
    for (const table of TABLES) {
      const cols = await client.query<{ column_name: string; data_type: string }>(
        "select column_name, data_type from information_schema.columns where table_schema = 'public' and table_name = $1 and is_generated = 'NEVER' order by ordinal_position",
        [table],
      );
      const names: string[] = [];
      const exprs: string[] = [];
      for (const { column_name: c, data_type: t } of cols.rows) {
        const q = `t."${c}"`;
        let e = q;
        if (MAPPED_IDS.has(c) && t === "uuid") e = `md5(${q}::text || ':' || k)::uuid`;
        else if (t === "timestamp with time zone") e = `${q} - k * interval '${HOURS_APART} hours'`;
        else if (t === "date") e = `${q} - (k * ${HOURS_APART} / 24)`;
        if (table === "job" && c === "number") e = `${q} || '-B' || k`;
        if (table === "job" && c === "status") e = `case when ${q} in ('released', 'void') then ${q} else 'released' end`;
        if (table === "job" && c === "released_at") e = `coalesce(${q}, t.updated_at) - k * interval '${HOURS_APART} hours'`;
        if (table === "job" && c === "open_nonconformances") e = "0";
        if (table === "weld_pass" && c === "client_key") e = `${q} || '-B' || k`;
        names.push(`"${c}"`);
        exprs.push(e);
      }
      // Only the demo's own rows are read: each table's copies are inserted after it is read.
      await client.query(
        `insert into ${table} (${names.join(", ")}) select ${exprs.join(", ")} from ${table} t cross join generate_series(1, $2::int) k where t.shop_id = $1`,
        [shopId, copies],
      );
    }
    await client.query("commit");
    await client.query("analyze");
    const jobs = await client.query<{ n: number }>("select count(*)::int as n from job where shop_id = $1", [shopId]);
    return jobs.rows[0]!.n;
  } finally {
    await client.end();
  }
}

export async function benchQuality(): Promise<{ name: string; ms: number; detail?: string; targetMs?: number }[]> {
  const dataDir = path.join(root, ".data", `bench-quality-${process.pid}`);
  const stack = await startStack({
    root,
    dataDir,
    pgPort: Number(process.env.BENCH_PGPORT ?? 54359),
    smtpPort: Number(process.env.BENCH_SMTP_PORT ?? 2549),
    s3Port: Number(process.env.BENCH_S3_PORT ?? 4589),
    appPort: 0,
    https: null,
    secretFile: path.join(dataDir, "auth-secret"),
  });
  try {
    const demo = measure(stack.env);
    const jobs = await generateJobs(stack.env.DATABASE_URL!, "iron-gully");
    const big = measure(stack.env);
    const ratio = big.default.ms / demo.default.ms;
    console.log(`  quality: demo ${demo.jobs} jobs ${demo.default.ms.toFixed(2)} ms; ${jobs} jobs ${big.default.ms.toFixed(2)} ms; ratio ${ratio.toFixed(2)} (target ≤ 3)`);
    return [
      { name: `quality figures, demo shop (${demo.jobs} jobs), last 90 days`, ms: demo.default.ms, detail: `${demo.default.inspected} joints inspected, ${demo.default.points} heat-input points; median of 15 runs` },
      {
        name: `quality figures, ${big.jobs} jobs, last 90 days`,
        ms: big.default.ms,
        detail: `${big.default.inspected} joints inspected, ${big.default.points} heat-input points; ${ratio.toFixed(2)}× the demo's time`,
        targetMs: 3 * demo.default.ms,
      },
      { name: `quality figures, ${big.jobs} jobs, all time (no target)`, ms: big.all.ms, detail: `${big.all.inspected} joints inspected, ${big.all.points} heat-input points (latest 500 per WPS)` },
    ];
  } finally {
    await stack.stop();
    spawnSync("rm", ["-rf", dataDir]);
  }
}

if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) {
  for (const r of await benchQuality()) console.log(`${r.name}: ${r.ms.toFixed(2)} ms (${r.detail ?? ""})${r.targetMs ? ` target ${r.targetMs.toFixed(2)} ms` : ""}`);
}
