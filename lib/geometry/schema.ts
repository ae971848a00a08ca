import { z } from "zod";
import { holeRangeCount, LIMITS, sweepCount } from "./limits";
import type { SteeringInput } from "./types";

const mm = (what: string) =>
  z
    .number(`${what} must be a number (mm)`)
    .min(-LIMITS.coordMm, `${what} must be within ±${LIMITS.coordMm} mm`)
    .max(LIMITS.coordMm, `${what} must be within ±${LIMITS.coordMm} mm`);

const point = (what: string) => z.object({ y: mm(`${what} y`), z: mm(`${what} z`) });

const positive = (what: string, max: number, unit: string) =>
  z
    .number(`${what} must be a number`)
    .gt(0, `${what} must be greater than 0`)
    .max(max, `${what} must be at most ${max}${unit ? ` ${unit}` : ""}`);

const nonNegative = (what: string, max: number, unit: string) =>
  z
    .number(`${what} must be a number`)
    .min(0, `${what} must be 0 or more (give it as a positive distance)`)
    .max(max, `${what} must be at most ${max} ${unit}`);

const tooMany = (n: number) =>
  `step gives ${n} points; at most ${LIMITS.maxSweepPoints} are allowed, use a larger step`;

/**
 * Request body for the steering-geometry calculator. Unknown keys are stripped, not rejected.
 * Bounds keep a request from allocating without limit; impossible-but-valid geometry is left to
 * computeSteeringGeometry, which throws GeometryError (HTTP 422).
 */
export const steeringInputSchema = z
  .object({
    trackBar: z.object({ frameEnd: point("lateral link frame end"), axleEnd: point("lateral link axle end") }),
    dragLink: z.object({ pitmanEnd: point("drag link pitman end"), knuckleEnd: point("drag link knuckle end") }),
    axleCenter: point("axle centre"),
    steeringArmLength: positive("steering arm length", LIMITS.armMm, "mm"),
    steeringRatio: positive("steering ratio", LIMITS.ratio, "").optional(),
    travel: z
      .object({
        bump: nonNegative("bump", LIMITS.travelMm, "mm"),
        droop: nonNegative("droop", LIMITS.travelMm, "mm"),
        step: positive("travel step", LIMITS.travelMm, "mm"),
      })
      .superRefine((t, ctx) => {
        const n = sweepCount(-t.droop, t.bump, t.step);
        if (n > LIMITS.maxSweepPoints) ctx.addIssue({ code: "custom", path: ["step"], message: tooMany(n) });
      }),
    roll: z
      .object({
        maxDeg: nonNegative("maximum roll", LIMITS.rollDeg, "degrees"),
        stepDeg: positive("roll step", LIMITS.rollDeg, "degrees"),
      })
      .superRefine((t, ctx) => {
        const n = sweepCount(-t.maxDeg, t.maxDeg, t.stepDeg);
        if (n > LIMITS.maxSweepPoints) ctx.addIssue({ code: "custom", path: ["stepDeg"], message: tooMany(n) });
      })
      .optional(),
    candidateHoles: z
      .array(
        z.object({
          y: mm("hole y"),
          z: mm("hole z"),
          label: z.string("label must be text").trim().min(1, "label must not be empty").max(LIMITS.labelChars, `label is at most ${LIMITS.labelChars} characters`).optional(),
        }),
      )
      .max(LIMITS.maxHoles, `at most ${LIMITS.maxHoles} candidate holes`)
      .optional(),
    holeRange: z
      .object({
        zMin: mm("lowest hole z"),
        zMax: mm("highest hole z"),
        pitch: positive("hole pitch", LIMITS.coordMm, "mm"),
        y: mm("hole line y").optional(),
      })
      .superRefine((r, ctx) => {
        if (r.zMax < r.zMin) {
          ctx.addIssue({ code: "custom", path: ["zMax"], message: "highest hole z must not be below the lowest" });
        } else if (holeRangeCount(r.zMin, r.zMax, r.pitch) > LIMITS.maxHoles) {
          ctx.addIssue({
            code: "custom",
            path: ["pitch"],
            message: `pitch gives more than ${LIMITS.maxHoles} holes; use a larger pitch`,
          });
        }
      })
      .optional(),
    candidateEnd: z.enum(["axle", "frame"], "candidate end must be \"axle\" or \"frame\"").optional(),
    rankBy: z.enum(["heave", "heaveAndRoll", "combined"], "rank by must be \"heave\", \"heaveAndRoll\" or \"combined\"").optional(),
    rimDiameter: positive("rim diameter", LIMITS.armMm, "mm").optional(),
  })
  .superRefine((v, ctx) => {
    const listed = v.candidateHoles?.length ?? 0;
    const ranged = v.holeRange ? holeRangeCount(v.holeRange.zMin, v.holeRange.zMax, v.holeRange.pitch) : 0;
    // A list alone is capped by its own .max(); this catches list + range together.
    if (v.holeRange && listed + ranged > LIMITS.maxHoles) {
      ctx.addIssue({
        code: "custom",
        path: ["holeRange", "pitch"],
        message: `candidate holes and hole range together exceed ${LIMITS.maxHoles} holes`,
      });
    }
  });

export type SteeringInputParsed = z.output<typeof steeringInputSchema>;

// Compile-time guard: what the schema yields is what the library accepts.
const _schemaFitsLibrary = (v: SteeringInputParsed): SteeringInput => v;
void _schemaFitsLibrary;
