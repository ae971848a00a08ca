import { describe, expect, it } from "vitest";
import { addMonthsClamped, continuity } from "@/lib/welding";

describe("welder continuity — ASME IX QW-322.1 (6 months or more)", () => {
  it("worked: last use 2025-01-10 → expired on 2025-07-10 (REFERENCES calc)", () => {
    expect(continuity("asme-ix", "2025-01-10", "2025-07-10")).toMatchObject({
      status: "lapsed",
      expiresOn: "2025-07-10",
      daysLeft: 0,
    });
  });
  it("the day before, 2025-07-09, is still good but lapsing", () => {
    expect(continuity("asme-ix", "2025-01-10", "2025-07-09")).toMatchObject({ status: "lapsing", daysLeft: 1 });
  });
  it("lapsing window is 30 days: 2025-06-10 lapsing (30 left), 2025-06-09 current (31 left)", () => {
    expect(continuity("asme-ix", "2025-01-10", "2025-06-10")).toMatchObject({ status: "lapsing", daysLeft: 30 });
    expect(continuity("asme-ix", "2025-01-10", "2025-06-09")).toMatchObject({ status: "current", daysLeft: 31 });
  });
  it("well after: negative daysLeft", () => {
    expect(continuity("asme-ix", "2025-01-10", "2025-08-09")).toMatchObject({ status: "lapsed", daysLeft: -30 });
  });
});

describe("welder continuity — AWS D1.1 (exceeding six months)", () => {
  it("worked: last use 2025-01-10 → expired from 2025-07-11 (REFERENCES calc)", () => {
    expect(continuity("aws-d1.1", "2025-01-10", "2025-07-11")).toMatchObject({
      status: "lapsed",
      expiresOn: "2025-07-11",
      daysLeft: 0,
    });
  });
  it("on 2025-07-10 (exactly six months) it is still valid under D1.1", () => {
    const r = continuity("aws-d1.1", "2025-01-10", "2025-07-10");
    expect(r.status).toBe("lapsing");
    expect(r.daysLeft).toBe(1);
    expect(r.lastValidOn).toBe("2025-07-10");
  });
});

describe("month-end clamping (documented choice: clamp to the last day of a shorter month)", () => {
  it("2025-08-31 + 6 months = 2026-02-28; ASME lapsed that day, D1.1 from 2026-03-01", () => {
    expect(addMonthsClamped("2025-08-31", 6)).toBe("2026-02-28");
    expect(continuity("asme-ix", "2025-08-31", "2026-01-01").expiresOn).toBe("2026-02-28");
    expect(continuity("aws-d1.1", "2025-08-31", "2026-01-01").expiresOn).toBe("2026-03-01");
  });
  it("leap year: 2023-08-31 + 6 months = 2024-02-29; D1.1 lapsed from 2024-03-01", () => {
    expect(continuity("asme-ix", "2023-08-31", "2024-01-01").expiresOn).toBe("2024-02-29");
    expect(continuity("aws-d1.1", "2023-08-31", "2024-01-01").expiresOn).toBe("2024-03-01");
  });
  it("2025-03-31 → 2025-09-30; year roll 2025-12-15 → 2026-06-15", () => {
    expect(addMonthsClamped("2025-03-31", 6)).toBe("2025-09-30");
    expect(addMonthsClamped("2025-12-15", 6)).toBe("2026-06-15");
  });
});

describe("date input", () => {
  it("rejects non-dates, impossible dates and a last use after today", () => {
    expect(() => continuity("asme-ix", "2025-02-30", "2025-03-01")).toThrow(/calendar date/);
    expect(() => continuity("asme-ix", "10/01/2025", "2025-03-01")).toThrow(/YYYY-MM-DD/);
    expect(() => continuity("asme-ix", "2025-01-10T00:00:00Z", "2025-03-01")).toThrow(RangeError);
    expect(() => continuity("aws-d1.1", "2025-03-02", "2025-03-01")).toThrow(/after today/);
  });
});
