import { describe, expect, it } from "vitest";
import { describeActivity } from "@/lib/activity";

describe("shop activity in words", () => {
  it("names who did what", () => {
    expect(describeActivity("person.invited", { email: "a@b.example", roles: ["welder", "inspector"] }, "Nell Corrigan")).toBe("Nell Corrigan invited a@b.example as welder, inspector");
    expect(describeActivity("procedure.published", { title: "Tube preparation", number: 2 }, "Nell Corrigan")).toBe("Nell Corrigan published “Tube preparation” (version 2)");
  });
  it("never shows a raw code for an action it does not know", () => {
    expect(describeActivity("wps.revision_started", {}, null)).toBe("Someone: wps revision started");
  });
});

describe("a job's weld activity in words", () => {
  it("says which round, which WPS and what the inspector decided", async () => {
    const { describeJobActivity } = await import("@/lib/jobs/activity");
    expect(describeJobActivity("weld_pass.recorded", { passNumber: 2, joint: "W1", wps: "GUS-GMAW-02 rev 1", round: 2, heatInputKJPerMm: 0.4256, outOfRange: false }, "Weld W1")).toBe(
      "recorded pass 2 of W1 to GUS-GMAW-02 rev 1, repair round 2 (0.43 kJ/mm)",
    );
    expect(describeJobActivity("weld.rejected", { joint: "W1", round: 1, rejected: ["undercut"], notes: "Grind the toe." }, "Weld W1")).toBe("inspected W1 and rejected it for repair: undercut — Grind the toe.");
    expect(describeJobActivity("weld.accepted", { joint: "W1", round: 2 }, "Weld W1")).toBe("inspected W1 (repair round 2) and accepted it (signed)");
    expect(describeJobActivity("weld_pass.overridden", { passNumber: 1, joint: "W1", reason: "PQR-7 covers it" }, null)).toBe("accepted pass 1 of W1 as welded, outside its WPS: PQR-7 covers it");
  });
});
