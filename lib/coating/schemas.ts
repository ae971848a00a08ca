/** Request schemas for the coating calculators (zod 4), shared by API routes and forms. */
import { z } from "zod";

import { MIN_READINGS_PER_SPOT } from "./dft";

// z.number() in zod 4 already rejects NaN, ±Infinity and strings; a custom message names the field.
const num = (label: string) => z.number({ error: `${label} must be a number` });

/** Body of POST /api/calc/dew-point. Unknown keys are rejected so typos surface. */
export const dewPointRequestSchema = z.strictObject({
  airTempC: num("airTempC").min(-100, "airTempC below −100 °C is not plausible").max(100, "airTempC above 100 °C is not plausible"),
  relativeHumidity: num("relativeHumidity")
    // 0 is excluded: ln(0) is undefined, and 0 % RH is not a field reading.
    .gt(0, "relativeHumidity must be greater than 0 %")
    .lte(100, "relativeHumidity must be at most 100 %"),
  surfaceTempC: num("surfaceTempC").min(-100, "surfaceTempC below −100 °C is not plausible").max(300, "surfaceTempC above 300 °C is not plausible"),
  requiredMarginC: num("requiredMarginC").min(0, "requiredMarginC must be ≥ 0").max(50, "requiredMarginC above 50 °C is not plausible").optional(),
});
export type DewPointRequest = z.infer<typeof dewPointRequestSchema>;

/** One measured area: spec range plus spots of gauge readings (same unit throughout). */
export const dftRequestSchema = z
  .strictObject({
    specMin: num("specMin").positive("specMin must be > 0"),
    specMax: num("specMax").positive("specMax must be > 0"),
    unit: z.enum(["um", "mil"]).optional(),
    spots: z
      .array(
        z
          .array(num("reading").nonnegative("a reading cannot be negative"))
          .min(MIN_READINGS_PER_SPOT, `each spot needs at least ${MIN_READINGS_PER_SPOT} readings`)
          .max(100, "too many readings in one spot"),
      )
      .min(1, "at least one spot is required")
      .max(50, "too many spots in one area"),
  })
  .refine((v) => v.specMax >= v.specMin, { path: ["specMax"], message: "specMax must be ≥ specMin" });
export type DftRequest = z.infer<typeof dftRequestSchema>;
