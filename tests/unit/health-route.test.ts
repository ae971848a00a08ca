// The health answer a load balancer or the start script reads: 200 when the database answers, 503 with a
// Retry-After when it does not.
import { describe, expect, it, vi } from "vitest";

const state = { up: true };
vi.mock("@/db/queries/health", () => ({ databaseIsUp: async () => state.up }));

const { GET } = await import("@/app/api/health/route");

describe("GET /api/health", () => {
  it("answers ok while the database is up", async () => {
    state.up = true;
    const res = await GET();
    expect(res.status).toBe(200);
    expect(await res.json()).toEqual({ ok: true, db: "up" });
    expect(res.headers.get("retry-after")).toBeNull();
  });
  it("answers 503 with Retry-After while it is down", async () => {
    state.up = false;
    const res = await GET();
    expect(res.status).toBe(503);
    expect(await res.json()).toEqual({ ok: false, db: "down" });
    expect(Number(res.headers.get("retry-after"))).toBeGreaterThan(0);
  });
});
