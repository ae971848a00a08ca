// The working value of each step kind, as the API accepts and stores it (SI units). A value may be
// partial while the welder works; lib/jobs/readiness decides when it is complete enough to sign.
import { z } from "zod";
import { steeringInputSchema } from "@/lib/geometry/schema";
import { HAZARDS, type StepKind } from "@/lib/procedures/schema";

const finite = (label: string) => z.number({ message: `${label} must be a number.` }).finite(`${label} must be a finite number.`);
const note = z.string().max(2000, "A note is at most 2,000 characters.").optional();
const unitName = z.string().max(16).optional();

export const checkValueSchema = z.object({ confirmed: z.boolean().optional(), note }).strict();
export const measureValueSchema = z.object({ reading: finite("The reading").optional(), unit: unitName, note }).strict();
export const photoValueSchema = z.object({ note }).strict();
export const cautionValueSchema = z
  .object({ acknowledged: z.array(z.enum(HAZARDS, { message: "Unknown hazard." })).max(HAZARDS.length).optional(), note })
  .strict();
export const weldValueSchema = z.object({ note }).strict();
export const holdValueSchema = z.object({ note }).strict();
export const torqueValueSchema = z
  .object({ achievedNm: finite("The achieved torque").min(0, "Torque cannot be negative.").max(20_000).optional(), unit: unitName, note })
  .strict();
export const coatingValueSchema = z
  .object({
    airTempC: finite("Air temperature").min(-60).max(80).optional(),
    relativeHumidity: finite("Relative humidity").gt(0, "Relative humidity is above 0 %.").max(100, "Relative humidity is at most 100 %.").optional(),
    surfaceTempC: finite("Surface temperature").min(-60).max(200).optional(),
    // Dry film thickness readings in µm, grouped by spot (SSPC-PA 2: at least 3 readings a spot).
    dftSpots: z.array(z.array(finite("A DFT reading").min(0).max(10_000)).max(20)).max(20).optional(),
    tempUnit: unitName,
    dftUnit: unitName,
    note,
  })
  .strict();

// What the server computes from a capture's input; the client's own figures are never stored.
export type GeometryResults = {
  trackBarAngleDeg: number;
  dragLinkAngleDeg: number;
  angleDifferenceDeg: number;
  worstHeave: { travel: number; wheelSteerDeg: number; dragLinkError: number };
  steeringWheelDeg: number | null;
  /** [travel mm, wheel steer °] at most 41 points, for the before/after chart */
  curve: [number, number][];
};

export const geometryCaptureSchema = z
  .object({
    input: steeringInputSchema,
    unit: z.enum(["mm", "in"]).default("mm"),
    /** Present when the joints were measured from the floor: which side the driver sits, to show the sides again. */
    drive: z.enum(["lhd", "rhd"]).optional(),
    capturedAt: z.string().max(40).optional(),
  })
  .strip();
export type GeometryCaptureInput = z.output<typeof geometryCaptureSchema>;
export type GeometryCapture = GeometryCaptureInput & { results: GeometryResults };

export const geometryValueSchema = z.object({ before: geometryCaptureSchema.optional(), after: geometryCaptureSchema.optional(), note }).strict();

export const VALUE_SCHEMAS = {
  check: checkValueSchema,
  measure: measureValueSchema,
  photo: photoValueSchema,
  caution: cautionValueSchema,
  weld: weldValueSchema,
  hold: holdValueSchema,
  torque: torqueValueSchema,
  coating: coatingValueSchema,
  geometry: geometryValueSchema,
} as const satisfies Record<StepKind, z.ZodType>;

export type CheckValue = z.output<typeof checkValueSchema>;
export type MeasureValue = z.output<typeof measureValueSchema>;
export type CautionValue = z.output<typeof cautionValueSchema>;
export type TorqueValue = z.output<typeof torqueValueSchema>;
export type CoatingValue = z.output<typeof coatingValueSchema>;
export type GeometryValue = { before?: GeometryCapture; after?: GeometryCapture; note?: string };

export function parseValue(kind: StepKind, value: unknown) {
  return VALUE_SCHEMAS[kind].safeParse(value ?? {});
}
