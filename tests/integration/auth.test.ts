import { describe, expect, it } from "vitest";
import { api, BASE_URL, freshIp, session, signIn } from "./support";

describe("health", () => {
  it("reports the database up", async () => {
    const r = await api("/api/health");
    expect(r.status).toBe(200);
    expect(r.json).toEqual({ ok: true, db: "up" });
  });
});

describe("sign-in", () => {
  const demo = [
    ["lead@irongully.example", ["lead"]],
    ["welder@irongully.example", ["welder"]],
    ["welder2@irongully.example", ["welder", "inspector"]],
    ["inspector@irongully.example", ["inspector"]],
    ["auditor@irongully.example", ["auditor"]],
  ] as const;

  it.each(demo)("%s signs in and /api/me tells their shop and roles", async (email, roles) => {
    const s = await session(email);
    const me = await api("/api/me", { session: s });
    expect(me.status).toBe(200);
    expect(me.json.user.email).toBe(email);
    expect(me.json.shop.name).toBe("Iron Gully 4x4 Fabrication");
    expect([...me.json.roles].sort()).toEqual([...roles].sort());
    expect(me.json.user).not.toHaveProperty("password");
  });

  it("sets the session cookie HttpOnly and SameSite; plain (no Secure) only over http to this computer", async () => {
    const { res, setCookies } = await signIn("lead@irongully.example");
    expect(res.status).toBe(200);
    const sessionCookie = setCookies.find((c) => c.includes("session_token"));
    expect(sessionCookie).toBeDefined();
    expect(sessionCookie).toMatch(/HttpOnly/i);
    expect(sessionCookie).toMatch(/SameSite=Lax/i);
    // Safari drops Secure cookies on http://127.0.0.1; HTTPS gets Secure ones (tests/integration/devices.test.ts).
    expect(sessionCookie).not.toMatch(/;\s*Secure/i);
    expect(sessionCookie).not.toMatch(/^__Secure-/);
  });

  it("refuses a wrong password with 401 and no session", async () => {
    const { res, setCookies } = await signIn("lead@irongully.example", "not-the-password");
    expect(res.status).toBe(401);
    expect(setCookies.some((c) => c.includes("session_token=") && !c.includes("session_token=;"))).toBe(false);
  });

  it("rate-limits repeated wrong passwords with 429 and a clear message", async () => {
    const ip = freshIp();
    const statuses: number[] = [];
    for (let i = 0; i < 7; i++) {
      const { res } = await signIn("welder@irongully.example", `wrong-${i}`, ip);
      statuses.push(res.status);
      if (res.status === 429) {
        const body = await res.json();
        expect(body.message).toMatch(/too many failed sign-ins/i);
      }
    }
    expect(statuses.slice(0, 5)).toEqual([401, 401, 401, 401, 401]);
    expect(statuses.at(-1)).toBe(429);
    // Even the right password is refused from that address while the window lasts.
    const { res } = await signIn("welder@irongully.example", undefined, ip);
    expect(res.status).toBe(429);
    // The counters live in PostgreSQL (shared by every app instance), not in one process's memory.
  });

  it("keeps rate-limit counters in the database", async () => {
    const { withDb } = await import("./support");
    const rows = await withDb((c) => c.query("select key, count from rate_limit where key like '%sign-in%'"));
    expect(rows.rowCount).toBeGreaterThan(0);
  });
});

describe("signed out", () => {
  it("/api/me answers 401 with the error shape", async () => {
    const r = await api("/api/me");
    expect(r.status).toBe(401);
    expect(r.json.error.code).toBe("unauthenticated");
    expect(typeof r.json.error.message).toBe("string");
  });

  it("shop pages send a signed-out visitor to sign-in", async () => {
    const res = await fetch(`${BASE_URL}/people`, { redirect: "manual" });
    expect([303, 307, 308]).toContain(res.status);
    expect(res.headers.get("location")).toContain("/sign-in");
  });
});

describe("several shops", () => {
  it("a person in two shops works in one at a time; the header or cookie picks which", async () => {
    const s = await session("auditor@irongully.example");
    const first = await api("/api/me", { session: s });
    expect(first.json.shops.map((x: { name: string }) => x.name).sort()).toEqual(["Iron Gully 4x4 Fabrication", "Saltpan Chassis & Axle"]);
    const other = first.json.shops.find((x: { id: string }) => x.id !== first.json.shop.id);
    const switched = await api("/api/me", { session: s, headers: { "x-gusset-shop": other.id } });
    expect(switched.json.shop.id).toBe(other.id);
    expect(switched.json.roles).toEqual(["auditor"]);
    // A shop the person does not belong to is never selected.
    const foreign = await api("/api/me", { session: s, headers: { "x-gusset-shop": "00000000-0000-4000-8000-000000000000" } });
    expect(foreign.json.shop.id).toBe(first.json.shop.id);
  });
});
