import { describe, expect, it } from "vitest";
import { governingPreheat } from "@/lib/jobs/preheat";

// The rule checked is plain arithmetic on two floors: a temperature at or above the higher minimum meets
// both documents, one between them meets only the lower (worked by hand, no table involved).
describe("governingPreheat", () => {
  it("takes the procedure's 65 °C over the WPS's 10 °C", () => {
    expect(governingPreheat(65, 10)).toEqual({ minC: 65, source: "procedure", procedureC: 65, wpsC: 10 });
  });
  it("takes the WPS's when it is the stricter", () => {
    expect(governingPreheat(10, 95)).toMatchObject({ minC: 95, source: "wps" });
  });
  it("names both when they agree, and the procedure alone when the WPS sets none", () => {
    expect(governingPreheat(20, 20).source).toBe("both");
    expect(governingPreheat(20, undefined)).toMatchObject({ minC: 20, source: "procedure", wpsC: null });
  });
});
