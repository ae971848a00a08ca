// The database itself refuses changes to published and retired versions, whoever connects: the app's own
// role and the superuser alike (db/sql/010-procedures.sql).
import { beforeAll, describe, expect, it } from "vitest";
import type pg from "pg";
import { api, session, withDb, type Session } from "./support";

const ADMIN = process.env.ADMIN_DATABASE_URL || undefined;
let lead: Session;

async function publishedProcedure(): Promise<string> {
  const r = await api("/api/procedures", {
    session: lead,
    body: { title: `SQL guard ${Date.now()}-${Math.random().toString(36).slice(2, 7)}`, content: { sections: [{ key: "m", title: "M", steps: [{ key: "c", kind: "caution", title: "PPE", hazards: ["ppe"], acknowledgement: "PPE on." }] }] } },
  });
  const id = r.json.procedure.id as string;
  const p = await api(`/api/procedures/${id}/versions/1/publish`, { session: lead, body: { changeNote: "First issue." } });
  expect(p.status).toBe(200);
  return id;
}

async function refusal(client: pg.Client, sql: string, params: unknown[]) {
  try {
    await client.query(sql, params);
  } catch (error) {
    return error as { code: string; message: string };
  }
  return null;
}

beforeAll(async () => {
  lead = await session("lead@irongully.example");
});

describe.each([
  ["the superuser", ADMIN, true],
  ["the app's role", process.env.DATABASE_URL, false],
])("as %s, directly in SQL", (_who, url, superuser) => {
  it(superuser ? "connects as a superuser" : "connects as the app's ordinary role", async () => {
    expect(url).toBeTruthy();
    const row = await withDb(async (c) => (await c.query("select rolsuper from pg_roles where rolname = current_user")).rows[0], url);
    expect(row.rolsuper).toBe(superuser);
  });

  it("a published version's content, title, hash or note cannot be updated", async () => {
    const id = await publishedProcedure();
    await withDb(async (c) => {
      for (const set of ["content = '{\"sections\":[]}'::jsonb", "title = 'Changed'", "content_hash = repeat('0', 64)", "change_note = 'rewritten'", "status = 'draft', published_at = null, publisher_id = null"]) {
        const e = await refusal(c, `update procedure_version set ${set} where procedure_id = $1 and number = 1`, [id]);
        expect(e?.code, set).toBe("23001");
        expect(e?.message).toMatch(/never changes|identity never changes/);
      }
      const row = (await c.query("select status, title from procedure_version where procedure_id = $1", [id])).rows[0];
      expect(row).toEqual({ status: "published", title: expect.stringMatching(/^SQL guard/) });
    }, url);
  });

  it("published → retired is allowed with status and retired_at only; nothing changes after that", async () => {
    const id = await publishedProcedure();
    await withDb(async (c) => {
      const sneaky = await refusal(c, "update procedure_version set status = 'retired', retired_at = now(), change_note = 'also this' where procedure_id = $1", [id]);
      expect(sneaky?.code).toBe("23001");
      expect(sneaky?.message).toMatch(/only status and retired_at/);
      await c.query("update procedure_version set status = 'retired', retired_at = now() where procedure_id = $1", [id]);
      const back = await refusal(c, "update procedure_version set status = 'published', retired_at = null where procedure_id = $1", [id]);
      expect(back?.code).toBe("23001");
      const touch = await refusal(c, "update procedure_version set retired_at = now() + interval '1 day' where procedure_id = $1", [id]);
      expect(touch?.code).toBe("23001");
    }, url);
  });

  it("a published or retired version cannot be deleted; a draft can", async () => {
    const id = await publishedProcedure();
    await withDb(async (c) => {
      const e = await refusal(c, "delete from procedure_version where procedure_id = $1", [id]);
      expect(e?.code).toBe("23001");
      expect(e?.message).toMatch(/can never be deleted/);
    }, url);
    const next = await api(`/api/procedures/${id}/versions`, { session: lead, body: {} });
    expect(next.json.version.number).toBe(2);
    await withDb(async (c) => {
      const r = await c.query("delete from procedure_version where procedure_id = $1 and number = 2", [id]);
      expect(r.rowCount).toBe(1);
    }, url);
  });

  it("a version cannot be inserted as published without its hash, note and publisher", async () => {
    const id = await publishedProcedure();
    await withDb(async (c) => {
      const { shop_id, author_id } = (await c.query("select shop_id, author_id from procedure_version where procedure_id = $1", [id])).rows[0];
      const e = await refusal(
        c,
        "insert into procedure_version (shop_id, procedure_id, number, status, content, author_id) values ($1, $2, 5, 'published', '{\"sections\":[]}', $3)",
        [shop_id, id, author_id],
      );
      expect(e?.code).toBe("23514");
      expect(e?.message).toMatch(/SHA-256 content hash/);
    }, url);
  });

  it("the table cannot be truncated while it holds published versions", async () => {
    await withDb(async (c) => {
      const e = await refusal(c, "truncate procedure_version cascade", []);
      expect(e?.code).toBe("23001");
    }, url);
  });
});
