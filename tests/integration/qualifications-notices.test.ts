import { spawnSync } from "node:child_process";
import { randomBytes } from "node:crypto";
import path from "node:path";
import { simpleParser } from "mailparser";
import { describe, expect, it } from "vitest";
import { noticeStage } from "@/lib/welding/qualification-schema";
import { addDays, addMonthsClamped, continuity } from "@/lib/welding";
import { api, BASE_URL, session, waitFor, withDb } from "./support";

const root = path.resolve(import.meta.dirname, "../..");
const today = new Date().toISOString().slice(0, 10);

async function mailsAbout(name: string) {
  return withDb(async (c) => (await c.query("select subject, to_address, raw from caught_mail where subject like $1 order by received_at", [`${name}%`])).rows);
}

function runJob(secret?: string) {
  return fetch(`${BASE_URL}/api/internal/qualification-notices`, { method: "POST", headers: secret ? { "x-gusset-secret": secret } : {} });
}

function runScript(args: string[] = []) {
  return spawnSync(path.join(root, "node_modules/.bin/tsx"), ["scripts/qualification-notices.ts", ...args], {
    cwd: root,
    // Only what the script needs: it must run with DATABASE_URL alone (SMTP_URL points it at the catcher).
    env: { NODE_ENV: "test", PATH: process.env.PATH, DATABASE_URL: process.env.DATABASE_URL, SMTP_URL: process.env.SMTP_URL, APP_URL: process.env.APP_URL },
    encoding: "utf8",
    timeout: 60_000,
  });
}

describe("lapsing-qualification mail to the lead", () => {
  it("the daily job mails each lead once per qualification and day, with text and HTML parts; a second run and the script send nothing new", async () => {
    // A welder whose GTAW test was a little under six months ago: under AWS D1.1 (Iron Gully's code;
    // 6.2.3.1, clause number from memory) it lapses in 11 to 14 days, the 14-day stage.
    const name = `Nia Notice-${randomBytes(3).toString("hex")}`;
    const welderId = randomBytes(16).toString("hex");
    const testDate = addDays(addMonthsClamped(today, -6), 10);
    const expected = continuity("aws-d1.1", testDate, today);
    expect(expected.status).toBe("lapsing");
    expect(noticeStage(expected.daysLeft)).toBe(14);
    await withDb(async (c) => {
      const shop = (await c.query("select id from shop where slug = 'iron-gully'")).rows[0].id;
      await c.query("update shop set continuity_code = 'aws-d1.1' where id = $1", [shop]);
      await c.query(`insert into "user" (id, name, email, email_verified, created_at, updated_at) values ($1, $2, $3, true, now(), now())`, [welderId, name, `${welderId.slice(0, 8)}@test.example`]);
      await c.query("insert into membership (shop_id, user_id, roles) values ($1, $2, '{welder}')", [shop, welderId]);
    });
    const lead = await session("lead@irongully.example");
    const q = await api("/api/qualifications", {
      session: lead,
      body: { welderUserId: welderId, process: "GTAW", positions: ["2F"], thicknessMinMm: 2, fillerFNumber: 6, testDate },
    });
    expect(q.status, q.text).toBe(201);

    expect((await runJob()).status).toBe(404);
    expect((await runJob("not-the-secret")).status).toBe(404);
    const first = await runJob(process.env.BETTER_AUTH_SECRET);
    expect(first.status).toBe(200);
    const result = await first.json();
    expect(result.today).toBe(today);
    expect(result.sent).toBeGreaterThanOrEqual(1);

    const [mail] = await waitFor(async () => {
      const rows = await mailsAbout(name);
      return rows.length ? rows : null;
    });
    expect(mail.to_address).toContain("lead@irongully.example");
    const parsed = await simpleParser(mail.raw);
    expect(parsed.subject).toBe(`${name}'s GTAW qualification lapses on ${expected.expiresOn} (in ${expected.daysLeft} days)`);
    expect(parsed.text).toContain(`lapses on ${expected.expiresOn}, in ${expected.daysLeft} days`);
    expect(parsed.text).toContain(`GTAW was last used on ${testDate}`);
    expect(parsed.text).toContain("/qualifications?status=lapsing");
    expect(typeof parsed.html).toBe("string");
    expect(parsed.html as string).toContain(expected.expiresOn);
    expect(parsed.html as string).toContain("Open the qualifications");

    const again = await (await runJob(process.env.BETTER_AUTH_SECRET)).json();
    expect(again.alreadyNoticed).toBeGreaterThanOrEqual(1);
    const script = runScript();
    expect(script.status, script.stderr).toBe(0);
    expect(script.stdout).toMatch(/already noticed/);
    await new Promise((r) => setTimeout(r, 1500));
    expect(await mailsAbout(name)).toHaveLength(1);
    const notices = await withDb(async (c) =>
      (await c.query("select notice_on::text, expires_on::text, stage, mail_id is not null as mailed from qualification_notice where qualification_id = $1", [q.json.qualification.id])).rows,
    );
    expect(notices).toEqual([{ notice_on: today, expires_on: expected.expiresOn, stage: 14, mailed: true }]);

    // Run by hand as of the day it reaches the next stage (7 days left): one more mail, and only one.
    const nextStageDay = addDays(expected.expiresOn, -7);
    const later = runScript([`--today=${nextStageDay}`]);
    expect(later.status, later.stderr).toBe(0);
    const both = await waitFor(async () => {
      const rows = await mailsAbout(name);
      return rows.length >= 2 ? rows : null;
    });
    expect((await simpleParser(both[1].raw)).subject).toContain("(in 7 days)");
    expect(runScript([`--today=${nextStageDay}`]).status).toBe(0);
    await new Promise((r) => setTimeout(r, 1500));
    expect(await mailsAbout(name)).toHaveLength(2);
    expect(runScript(["--today=2025-02-30"]).status).toBe(1);
  });
});
