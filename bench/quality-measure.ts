// Child process of bench/quality.ts: times qualityFigures (what GET /api/quality runs after the session check)
// for the demo shop as its lead sees it. Run with `node --conditions=react-server --import tsx`, the condition
// under which the app's server code runs ("server-only" is an empty module there).
import { sql } from "drizzle-orm";
import { qualityFigures } from "@/db/queries/quality";
import { db } from "@/lib/db";
import { defaultRange } from "@/lib/quality/schema";

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  const m = s.length >> 1;
  return s.length % 2 ? s[m]! : (s[m - 1]! + s[m]!) / 2;
}

async function main() {
  const runs = Number(process.env.BENCH_RUNS ?? 15);
  const slug = process.env.BENCH_SHOP ?? "iron-gully";
  const shop = await db().execute<{ id: string }>(sql`select id from shop where slug = ${slug}`);
  const shopId = shop.rows[0]!.id;
  const today = new Date().toISOString().slice(0, 10);
  const windows: Record<string, { from?: string; to?: string }> = { default: defaultRange(today), all: {} };
  const out: Record<string, { ms: number; inspected: number; points: number }> = {};
  for (const [name, range] of Object.entries(windows)) {
    const once = () => qualityFigures({ shopId, ...range });
    await once(); // plans, pool connections and JIT warm up here
    await once();
    const times: number[] = [];
    let last = await once();
    for (let i = 0; i < runs; i++) {
      const t0 = performance.now();
      last = await once();
      times.push(performance.now() - t0);
    }
    out[name] = { ms: median(times), inspected: last.firstPassYield.overall.inspected, points: last.heatInput.reduce((a, s) => a + s.points.length, 0) };
  }
  const jobs = await db().execute<{ n: number }>(sql`select count(*)::int as n from job where shop_id = ${shopId}`);
  process.stdout.write(`${JSON.stringify({ jobs: jobs.rows[0]!.n, ...out })}\n`);
  process.exit(0);
}

void main().catch((error) => {
  console.error(error);
  process.exit(1);
});
