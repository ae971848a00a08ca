// zod v4 schemas for the welding calculators, shared by API routes and forms. Each field has its own
// message so a form can show it beside the input (issue.path is the field path, e.g. ["travelSpeed","value"]).
// Upper bounds are sanity limits that catch unit mix-ups (amps typed as volts, mm as in), not process limits.

import { z } from "zod";
import { BOLT_CONDITIONS, type BoltTorqueRequest } from "./bolt-torque";
import { CONTINUITY_CODES, parseIsoDate } from "./continuity";
import { ELECTRODE_CLASSES, type FilletWeldRequest } from "./fillet-weld";
import type { HeatInputRequest, PassHeatInputRequest } from "./heat-input";
import type { PreheatRequest } from "./preheat";
import { PROCESSES } from "./processes";
import { VISUAL_CRITERIA, type VisualObservations } from "./visual-acceptance";
import type { PassValues, WpsRanges } from "./wps-check";

const required = (label: string, what: string) => (iss: { input: unknown }) =>
  iss.input === undefined ? `${label} is required` : `${label} must be ${what}`;

/** A finite number in (0, max]. */
function positive(label: string, unit: string, max: number) {
  return z
    .number({ error: required(label, `a number in ${unit}`) })
    .positive({ error: `${label} must be greater than 0 ${unit}` })
    .max(max, { error: `${label} must be at most ${max} ${unit}` });
}

/** A finite number in [min, max]. */
function between(label: string, unit: string, min: number, max: number) {
  return z
    .number({ error: required(label, `a number in ${unit}`) })
    .min(min, { error: `${label} must be at least ${min} ${unit}` })
    .max(max, { error: `${label} must be at most ${max} ${unit}` });
}

const bool = (label: string) => z.boolean({ error: required(label, "true or false") });

export const processSchema = z.enum(PROCESSES, {
  error: `process must be one of ${PROCESSES.join(", ")}`,
});

// Travel-speed ceiling ≈ 10 m/min in either unit: beyond any arc process this module covers.
const SPEED_MAX = { "mm/min": 10_000, "in/min": 400 } as const;

export const travelSpeedSchema = z
  .strictObject({
    // The ceiling depends on the unit, so it is checked below against the pair.
    value: z
      .number({ error: required("travel speed", "a number") })
      .positive({ error: "travel speed must be greater than 0" }),
    unit: z.enum(["mm/min", "in/min"], { error: 'travel speed unit must be "mm/min" or "in/min"' }),
  })
  .superRefine((s, ctx) => {
    const max = SPEED_MAX[s.unit];
    if (s.value > max) {
      ctx.addIssue({ code: "custom", path: ["value"], message: `travel speed must be at most ${max} ${s.unit}` });
    }
  });

export const lengthSchema = (label: string) =>
  z
    .strictObject({
      value: positive(label, "(mm or in)", 100_000),
      unit: z.enum(["mm", "in"], { error: `${label} unit must be "mm" or "in"` }),
    });

const VOLTS = positive("volts", "V", 100);
const AMPS = positive("amps", "A", 2_000);

/** Body of POST /api/calc/heat-input: exactly { process, volts, amps, travelSpeed: { value, unit } }. */
export const heatInputRequestSchema = z.strictObject({
  process: processSchema,
  volts: VOLTS,
  amps: AMPS,
  travelSpeed: travelSpeedSchema,
});

const ARC_TIME = positive("arc time", "s", 86_400);

export const passHeatInputRequestSchema = z.discriminatedUnion(
  "method",
  [
    z
      .strictObject({
        method: z.literal("voltage-current"),
        process: processSchema.optional(),
        volts: VOLTS,
        amps: AMPS,
        travelSpeed: travelSpeedSchema.optional(),
        beadLength: lengthSchema("bead length").optional(),
        arcTimeS: ARC_TIME.optional(),
      })
      .superRefine((r, ctx) => {
        const derived = r.beadLength !== undefined && r.arcTimeS !== undefined;
        const partial = r.beadLength !== undefined || r.arcTimeS !== undefined;
        if (r.travelSpeed && partial) {
          ctx.addIssue({ code: "custom", path: ["travelSpeed"], message: "give travel speed, or bead length with arc time, not both" });
        } else if (!r.travelSpeed && !derived) {
          ctx.addIssue({
            code: "custom",
            path: [r.beadLength === undefined ? "beadLength" : "arcTimeS"],
            message: "travel speed needs either travelSpeed or both bead length and arc time",
          });
        }
      }),
    z.strictObject({
      method: z.literal("energy"),
      process: processSchema.optional(),
      energyJ: positive("energy", "J", 1e9),
      beadLength: lengthSchema("bead length"),
      arcTimeS: ARC_TIME.optional(),
    }),
    z.strictObject({
      method: z.literal("power"),
      process: processSchema.optional(),
      powerW: positive("power", "W", 200_000),
      arcTimeS: ARC_TIME,
      beadLength: lengthSchema("bead length"),
    }),
  ],
  { error: 'method must be "voltage-current", "energy" or "power"' },
);

/** Body of POST /api/calc/fillet-weld. SI: mm, MPa, kN. */
export const filletWeldRequestSchema = z
  .strictObject({
    legMm: positive("leg", "mm", 50),
    lengthMm: positive("weld length", "mm", 10_000),
    electrodeClass: z
      .enum(ELECTRODE_CLASSES, { error: `electrode class must be one of ${ELECTRODE_CLASSES.join(", ")}` })
      .optional(),
    electrodeMPa: between("electrode strength FEXX", "MPa", 300, 1_000).optional(),
    angleDeg: between("load angle", "degrees", 0, 90).optional(),
    directionalIncrease: bool("directionalIncrease").optional(),
    method: z.enum(["LRFD", "ASD"], { error: 'method must be "LRFD" or "ASD"' }),
    thinnerPartMm: positive("thinner part", "mm", 300).optional(),
    thickerPartMm: positive("thicker part", "mm", 300).optional(),
    sizeSystem: z.enum(["in", "mm"], { error: 'sizeSystem must be "in" or "mm"' }).optional(),
    loadKN: between("load", "kN", 0, 100_000).optional(),
  })
  .superRefine((r, ctx) => {
    if (r.electrodeClass === undefined && r.electrodeMPa === undefined) {
      ctx.addIssue({ code: "custom", path: ["electrodeClass"], message: "give the electrode class (e.g. E70) or electrodeMPa" });
    } else if (r.electrodeClass !== undefined && r.electrodeMPa !== undefined) {
      ctx.addIssue({ code: "custom", path: ["electrodeMPa"], message: "give the electrode class or electrodeMPa, not both" });
    }
    if (r.thinnerPartMm !== undefined && r.thickerPartMm !== undefined && r.thinnerPartMm > r.thickerPartMm) {
      ctx.addIssue({ code: "custom", path: ["thinnerPartMm"], message: "thinner part must not be thicker than the thicker part" });
    }
  });

const MM = (label: string, max: number) => between(label, "mm", 0, max);

export const visualCriteriaSchema = z.enum(VISUAL_CRITERIA, {
  error: `criteria must be one of ${VISUAL_CRITERIA.join(", ")}`,
});

export const visualObservationsSchema = z
  .strictObject({
    cracks: bool("cracks"),
    fusionComplete: bool("fusionComplete"),
    cratersFilled: bool("cratersFilled"),
    profileAcceptable: bool("profileAcceptable"),
    specifiedLegMm: positive("specified leg", "mm", 50),
    measuredLegMm: MM("measured leg", 100),
    undersizeLengthMm: MM("undersize length", 100_000).optional(),
    weldLengthMm: positive("weld length", "mm", 100_000),
    materialThicknessMm: positive("material thickness", "mm", 300),
    undercutDepthMm: MM("undercut depth", 20),
    undercutAccumulatedMm: MM("accumulated undercut length", 300),
    porosityMm: MM("porosity in 25 mm", 25),
    porosity12Mm: MM("porosity in 300 mm", 300),
    arcStrikes: bool("arcStrikes"),
    spatterAcceptable: bool("spatterAcceptable"),
  })
  .superRefine((o, ctx) => {
    if (o.undersizeLengthMm !== undefined && o.undersizeLengthMm > o.weldLengthMm) {
      ctx.addIssue({ code: "custom", path: ["undersizeLengthMm"], message: "undersize length cannot exceed the weld length" });
    }
    if (o.porosityMm > o.porosity12Mm && o.weldLengthMm >= 300) {
      ctx.addIssue({ code: "custom", path: ["porosity12Mm"], message: "porosity in 300 mm cannot be less than in any 25 mm of it" });
    }
  });

export const visualRequestSchema = z.strictObject({
  criteria: visualCriteriaSchema,
  observations: visualObservationsSchema,
});

const TEMP = (label: string) => between(label, "°C", -60, 1_000);
const opt = <T extends z.ZodType>(s: T) => s.optional();

export const wpsRangesSchema = z
  .strictObject({
    process: opt(processSchema),
    voltsMin: opt(VOLTS),
    voltsMax: opt(VOLTS),
    ampsMin: opt(AMPS),
    ampsMax: opt(AMPS),
    travelSpeedMinMmPerMin: opt(positive("minimum travel speed", "mm/min", 10_000)),
    travelSpeedMaxMmPerMin: opt(positive("maximum travel speed", "mm/min", 10_000)),
    heatInputMaxKJPerMm: opt(positive("maximum heat input", "kJ/mm", 20)),
    heatInputBasis: z.enum(["arc-energy", "iso-q"], { error: 'heat input basis must be "arc-energy" or "iso-q"' }).optional(),
    preheatMinC: opt(TEMP("minimum preheat")),
    interpassMaxC: opt(TEMP("maximum interpass temperature")),
  })
  .superRefine((w, ctx) => {
    const pairs = [
      ["voltsMin", "voltsMax"],
      ["ampsMin", "ampsMax"],
      ["travelSpeedMinMmPerMin", "travelSpeedMaxMmPerMin"],
    ] as const;
    for (const [lo, hi] of pairs) {
      const a = w[lo];
      const b = w[hi];
      if (a !== undefined && b !== undefined && a > b) {
        ctx.addIssue({ code: "custom", path: [lo], message: `${lo} must not exceed ${hi}` });
      }
    }
    if (w.preheatMinC !== undefined && w.interpassMaxC !== undefined && w.preheatMinC > w.interpassMaxC) {
      ctx.addIssue({ code: "custom", path: ["preheatMinC"], message: "minimum preheat must not exceed the maximum interpass temperature" });
    }
  });

export const passValuesSchema = z.strictObject({
  process: opt(processSchema),
  volts: opt(VOLTS),
  amps: opt(AMPS),
  travelSpeedMmPerMin: opt(positive("travel speed", "mm/min", 10_000)),
  heatInputKJPerMm: opt(positive("heat input", "kJ/mm", 20)),
  preheatC: opt(TEMP("preheat")),
  interpassC: opt(TEMP("interpass temperature")),
});

export const preheatRequestSchema = z.strictObject({
  category: z.enum(["A", "B"], { error: 'category must be "A" or "B"' }),
  thicknessMm: positive("thickness", "mm", 500),
  baseMetalTempC: opt(between("base-metal temperature", "°C", -60, 60)),
});

const isoDate = (label: string) =>
  z.string({ error: required(label, "a date YYYY-MM-DD") }).refine(
    (s) => {
      try {
        parseIsoDate(s);
        return true;
      } catch {
        return false;
      }
    },
    { error: `${label} must be a calendar date YYYY-MM-DD` },
  );

export const continuityRequestSchema = z
  .strictObject({
    code: z.enum(CONTINUITY_CODES, { error: `code must be one of ${CONTINUITY_CODES.join(", ")}` }),
    lastUsed: isoDate("last use date"),
    today: isoDate("today"),
  })
  .superRefine((r, ctx) => {
    // Lexical order is date order for valid YYYY-MM-DD strings.
    if (r.lastUsed > r.today) {
      ctx.addIssue({ code: "custom", path: ["lastUsed"], message: "last use date cannot be after today" });
    }
  });

export const boltTorqueRequestSchema = z.strictObject({
  diameterMm: positive("bolt diameter", "mm", 200),
  preloadKN: positive("preload", "kN", 5_000),
  condition: z.enum(BOLT_CONDITIONS, { error: `condition must be one of ${BOLT_CONDITIONS.join(", ")}` }).optional(),
  nutFactor: opt(between("nut factor", "", 0.05, 0.5)),
});

// Compile-time guarantees that what a schema outputs is what the matching function takes.
type Assignable<T extends U, U> = T;
type _Checks = [
  Assignable<z.output<typeof heatInputRequestSchema>, HeatInputRequest>,
  Assignable<z.output<typeof passHeatInputRequestSchema>, PassHeatInputRequest>,
  Assignable<z.output<typeof filletWeldRequestSchema>, FilletWeldRequest>,
  Assignable<z.output<typeof visualObservationsSchema>, VisualObservations>,
  Assignable<z.output<typeof wpsRangesSchema>, WpsRanges>,
  Assignable<z.output<typeof passValuesSchema>, PassValues>,
  Assignable<z.output<typeof preheatRequestSchema>, PreheatRequest>,
  Assignable<z.output<typeof boltTorqueRequestSchema>, BoltTorqueRequest>,
];

export type HeatInputRequestInput = z.input<typeof heatInputRequestSchema>;
export type FilletWeldRequestInput = z.input<typeof filletWeldRequestSchema>;
