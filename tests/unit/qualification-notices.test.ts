import { describe, expect, it } from "vitest";
import { NOTICE_STAGES, noticeStage } from "@/lib/welding/qualification-schema";
import { noticeMail } from "@/app/api/internal/qualification-notices/run";
import { continuity } from "@/lib/welding";

describe("lapsing-notice stages (a lead hears at 30, 14, 7 and 1 days ahead, never twice a day)", () => {
  it("maps every day of the 30-day window (lib/welding LAPSING_WINDOW_DAYS) to its stage", () => {
    const expected = (d: number) => (d <= 1 ? 1 : d <= 7 ? 7 : d <= 14 ? 14 : 30);
    for (let d = 1; d <= 30; d++) expect(noticeStage(d), `day ${d}`).toBe(expected(d));
  });

  it("is silent outside the window: lapsed (0 or fewer days left) or further off than 30 days", () => {
    for (const d of [-40, -1, 0, 31, 180]) expect(noticeStage(d), `day ${d}`).toBeNull();
    expect(noticeStage(2.5)).toBeNull();
    expect(NOTICE_STAGES).toEqual([30, 14, 7, 1]);
  });

  it("a daily run crossing the window changes stage only on 30, 14, 7 and 1 days left", () => {
    const changes: number[] = [];
    let last: number | null = null;
    for (let d = 45; d >= -2; d--) {
      const s = noticeStage(d);
      if (s !== null && s !== last) changes.push(d);
      last = s;
    }
    expect(changes).toEqual([30, 14, 7, 1]);
  });
});

describe("the lapsing-notice mail", () => {
  // The REFERENCES.md worked example under AWS D1.1 (6.2.3.1, clause from memory): last GTAW use 2025-01-10
  // lapses from 2025-07-11; on 2025-06-27 that is 14 days away.
  const c = continuity("aws-d1.1", "2025-01-10", "2025-06-27");
  const q = {
    qualificationId: "q1",
    shopId: "s1",
    shopName: "Iron Gully 4x4 Fabrication",
    code: "aws-d1.1" as const,
    welderName: "Priya Okafor",
    process: "GTAW" as const,
    positions: ["1F", "2F"] as ("1F" | "2F")[],
    lastUsedOn: "2025-01-10",
    expiresOn: c.expiresOn,
    daysLeft: c.daysLeft,
  };

  it("names the welder, the process, the date it lapses and the days left, in both parts", () => {
    expect(c.expiresOn).toBe("2025-07-11");
    expect(c.daysLeft).toBe(14);
    const m = noticeMail(q, { name: "Nell Corrigan" }, "http://127.0.0.1:3000/");
    expect(m.subject).toBe("Priya Okafor's GTAW qualification lapses on 2025-07-11 (in 14 days)");
    for (const part of [m.text, m.html]) {
      expect(part).toContain("2025-07-11");
      expect(part).toContain("2025-01-10");
      expect(part).toContain("AWS D1.1");
    }
    expect(m.text).toContain("http://127.0.0.1:3000/qualifications?status=lapsing");
    expect(m.html).toContain('href="http://127.0.0.1:3000/qualifications?status=lapsing"');
    expect(m.html).toContain("Priya Okafor&#39;s GTAW");
  });

  it("escapes what people typed before it goes into the HTML part", () => {
    const m = noticeMail({ ...q, welderName: "<b>Eve</b>" }, { name: "Nell" }, "http://x.example");
    expect(m.html).not.toContain("<b>Eve</b>");
    expect(m.html).toContain("&lt;b&gt;Eve&lt;/b&gt;");
    expect(m.text).toContain("<b>Eve</b>");
  });

  it("says 1 day, not 1 days", () => {
    expect(noticeMail({ ...q, daysLeft: 1 }, { name: "Nell" }, "http://x.example").subject).toContain("(in 1 day)");
  });
});
