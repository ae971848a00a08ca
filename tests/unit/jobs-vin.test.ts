import { describe, expect, it } from "vitest";
import { createJobSchema } from "@/lib/jobs/schemas";
import { vinForJob } from "@/lib/jobs/vin";
import { vinCheckDigit } from "@/lib/vin";

// Source: 49 CFR 565.15(c) — the regulation's own worked example VIN 1M8GDM9A_KP042788: the weighted sum
// of the other sixteen characters leaves remainder 10 on division by 11, so the check digit is "X"
// (also in REFERENCES.md, VIN check digit, with 1G4AH59H?5G118341 → 4).
describe("VIN check digit on a job (49 CFR 565.15)", () => {
  it("the regulation's worked example gives X", () => {
    expect(vinCheckDigit("1M8GDM9A?KP042788")).toBe("X");
    expect(vinForJob("1M8GDM9AXKP042788")).toEqual({ vin: "1M8GDM9AXKP042788", warning: null, checkDigitOk: true });
  });

  it("a mismatch is a warning on the job, never a refusal", () => {
    const r = vinForJob("1m8gdm9a5kp042788");
    expect(r.vin).toBe("1M8GDM9A5KP042788");
    expect(r.checkDigitOk).toBe(false);
    expect(r.warning).toMatch(/Check digit \(position 9\) is 5 but the other characters give X/);
    const parsed = createJobSchema.safeParse({
      customerName: "Test Customer",
      vehicleMakeModel: "mid-size pickup",
      vin: "1M8GDM9A5KP042788",
      axleDescription: "front axle housing",
      axleTag: "T-1",
      procedureVersionId: "0b5b1c0e-8a8e-4a4b-9f6a-3f1f2b3c4d5e",
    });
    expect(parsed.success).toBe(true);
  });

  it("a short, pre-1981 style VIN and an empty one are kept, with or without a note", () => {
    expect(vinForJob("").warning).toBeNull();
    expect(vinForJob("ABC12345").warning).toMatch(/8 characters/);
    expect(vinForJob("1G4AH59H45G118341").warning).toBeNull();
  });
});
