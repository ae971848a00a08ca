// `npm run weight`: how much JavaScript each page makes the browser download, against an app already running
// (it builds nothing). Each page opens in a fresh Chromium context (empty cache), waits for the network to go
// quiet (so prefetches and lazy chunks the page pulls by itself are counted), and sums the bytes received on
// the wire (gzip as the server sent them) for every script response.
//
//   GUSSET_URL=http://127.0.0.1:3000 DATABASE_URL=postgres://… npm run weight
//
// DATABASE_URL is read only to find the verify token of a released job whose traveller was printed; the
// script prints that traveller through the API first so a token exists.
import { chromium, type Browser, type BrowserContext, type Page } from "@playwright/test";
import pg from "pg";

/** Gzip JS transferred on first load, in KB (1 KB = 1,000 bytes): the targets. */
export const BUDGET_KB = { runner: 170, verify: 150 } as const;
/** What the runner is held to until it meets its target: no heavier than it is now, so nothing creeps back. */
export const RUNNER_CEILING_KB = 200;

const LAUNCH = {
  executablePath: "/usr/bin/chromium",
  args: ["--no-sandbox", "--disable-gpu", "--disable-quic", "--no-first-run", "--disable-background-networking", "--disable-component-update", "--disable-sync"],
};

export type Weight = { page: string; url: string; scripts: number; encodedBytes: number; decodedBytes: number; files: { url: string; encoded: number }[] };

/** Loads `url` in `context` and sums the script responses it received until the network was idle. */
export async function measureScripts(context: BrowserContext, label: string, url: string): Promise<Weight> {
  const page: Page = await context.newPage();
  const pending: Promise<{ url: string; encoded: number; decoded: number }>[] = [];
  page.on("requestfinished", (request) => {
    if (request.resourceType() !== "script") return;
    pending.push(
      (async () => {
        const sizes = await request.sizes();
        const response = await request.response();
        const body = response ? await response.body().catch(() => Buffer.alloc(0)) : Buffer.alloc(0);
        return { url: request.url(), encoded: sizes.responseBodySize, decoded: body.length };
      })(),
    );
  });
  const response = await page.goto(url, { waitUntil: "networkidle" });
  if (!response || response.status() >= 400) throw new Error(`${url} answered ${response?.status() ?? "nothing"}`);
  // A moment more for chunks requested on idle (link prefetch runs after load).
  await page.waitForTimeout(1500);
  await page.waitForLoadState("networkidle");
  const all = await Promise.all(pending);
  await page.close();
  return {
    page: label,
    url,
    scripts: all.length,
    encodedBytes: all.reduce((a, s) => a + s.encoded, 0),
    decodedBytes: all.reduce((a, s) => a + s.decoded, 0),
    files: all.map((s) => ({ url: s.url, encoded: s.encoded })).sort((a, b) => b.encoded - a.encoded),
  };
}

/** A context signed in as `email` (through better-auth's own endpoint, so the cookie is the real one). */
export async function signedInContext(browser: Browser, base: string, email: string, password: string): Promise<BrowserContext> {
  const context = await browser.newContext({ baseURL: base, viewport: { width: 1024, height: 768 } });
  const r = await context.request.post("/api/auth/sign-in/email", { data: { email, password }, headers: { origin: base } });
  if (r.status() !== 200) throw new Error(`signing in as ${email} answered ${r.status()}`);
  return context;
}

type JobRow = { id: string; number: string; status: string };

/** The pages to weigh: a job in progress in the runner, a released job's verify page, sign-in and the jobs list. */
export async function pagesToWeigh(browser: Browser, base: string, opts: { leadEmail: string; password: string; databaseUrl: string }) {
  const lead = await signedInContext(browser, base, opts.leadEmail, opts.password);
  const list = async (status: string) => ((await (await lead.request.get(`/api/jobs?status=${status}&sort=number`)).json()) as { jobs: JobRow[] }).jobs;
  const running = (await list("in_progress"))[0];
  const released = (await list("released"))[0];
  if (!running || !released) throw new Error("needs a job in progress and a released job (the demo seed has both)");
  const printed = await lead.request.get(`/api/jobs/${released.id}/traveller`);
  if (printed.status() !== 200) throw new Error(`printing the traveller answered ${printed.status()}`);
  await lead.close();
  const db = new pg.Client({ connectionString: opts.databaseUrl });
  await db.connect();
  try {
    const token = (await db.query<{ token: string }>("select token from job_token where job_id = $1", [released.id])).rows[0]?.token;
    if (!token) throw new Error(`no verify token for ${released.number}`);
    return { runner: `/run/${running.id}`, verify: `/verify/${token}`, runnerJob: running.number, releasedJob: released.number };
  } finally {
    await db.end();
  }
}

const kb = (bytes: number) => (bytes / 1000).toFixed(1);

async function main() {
  const base = (process.env.GUSSET_URL ?? process.env.GUSSET_TEST_URL ?? `http://127.0.0.1:${process.env.PORT ?? 3000}`).replace(/\/$/, "");
  const databaseUrl = process.env.DATABASE_URL;
  if (!databaseUrl) throw new Error("DATABASE_URL is needed to find a verify token");
  const password = process.env.WEIGHT_PASSWORD ?? "demo-gusset-2026";
  const leadEmail = process.env.WEIGHT_LEAD_EMAIL ?? "lead@irongully.example";
  const welderEmail = process.env.WEIGHT_WELDER_EMAIL ?? "welder@irongully.example";
  const browser = await chromium.launch(LAUNCH);
  let over = 0;
  try {
    const paths = await pagesToWeigh(browser, base, { leadEmail, password, databaseUrl });
    const anonymous = await browser.newContext({ baseURL: base });
    const welder = await signedInContext(browser, base, welderEmail, password);
    const rows: Weight[] = [];
    rows.push(await measureScripts(await browser.newContext({ baseURL: base }), "sign-in", "/sign-in"));
    rows.push(await measureScripts(anonymous, "verify", paths.verify));
    rows.push(await measureScripts(welder, "runner", paths.runner));
    rows.push(await measureScripts(await signedInContext(browser, base, leadEmail, password), "jobs", "/jobs"));
    console.log(`JS transferred on first load (gzip as sent), ${base}; runner ${paths.runnerJob}, verify ${paths.releasedJob}`);
    for (const r of rows) {
      const budget = BUDGET_KB[r.page as keyof typeof BUDGET_KB];
      const verdict = budget === undefined ? "" : r.encodedBytes > budget * 1000 ? `  ✕ over the ${budget} KB budget` : `  ● within ${budget} KB`;
      if (budget !== undefined && r.encodedBytes > budget * 1000) over++;
      console.log(`- ${r.page.padEnd(8)} ${kb(r.encodedBytes).padStart(7)} KB gzip (${kb(r.decodedBytes)} KB unpacked, ${r.scripts} scripts)${verdict}`);
      // WEIGHT_DETAIL=1 lists each script, largest first, to see what to cut.
      if (process.env.WEIGHT_DETAIL) for (const f of r.files) console.log(`    ${kb(f.encoded).padStart(7)} KB  ${new URL(f.url).pathname}`);
    }
  } finally {
    await browser.close();
  }
  process.exit(over ? 1 : 0);
}

if (import.meta.url === `file://${process.argv[1]}`) {
  main().catch((error) => {
    console.error(error);
    process.exit(1);
  });
}
