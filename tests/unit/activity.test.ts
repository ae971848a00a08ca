import { describe, expect, it } from "vitest";
import { describeActivity } from "@/lib/activity";

describe("shop activity in words", () => {
  it("names who did what", () => {
    expect(describeActivity("person.invited", { email: "a@b.example", roles: ["welder", "inspector"] }, "Dana Corrigan")).toBe("Dana Corrigan invited a@b.example as welder, inspector");
    expect(describeActivity("procedure.published", { title: "Tube preparation", number: 2 }, "Dana Corrigan")).toBe("Dana Corrigan published “Tube preparation” (version 2)");
  });
  it("never shows a raw code for an action it does not know", () => {
    expect(describeActivity("wps.revision_started", {}, null)).toBe("Someone: wps revision started");
  });
});
