// What a WPS revision holds, the words for it, and the zod schemas the API and the draft editor share.
// Values are SI: mm, L/min, V, A, mm/min, kJ/mm, °C. Pure (zod and lib/welding only): safe in the browser.
import { z } from "zod";
import { PROCESS_INFO, type WeldingProcess, type WpsRanges } from "@/lib/welding";

// The five arc processes a bracket shop writes procedures for (lib/welding also knows plasma, PAW).
export const WPS_PROCESSES = ["SMAW", "GMAW", "FCAW", "GTAW", "SAW"] as const satisfies readonly WeldingProcess[];
export type WpsProcess = (typeof WPS_PROCESSES)[number];

// Test positions as the codes write them: F fillet, G groove; 5G/6G pipe, 6GR restricted.
export const WPS_POSITIONS = ["1F", "2F", "3F", "4F", "5F", "6F", "1G", "2G", "3G", "4G", "5G", "6G", "6GR"] as const;
export type WpsPosition = (typeof WPS_POSITIONS)[number];

export const CURRENT_TYPES = ["DC", "AC"] as const;
export const POLARITIES = ["EP", "EN"] as const;
export const HEAT_INPUT_BASES = ["arc-energy", "iso-q"] as const;
export type WpsStatus = "draft" | "published" | "retired";
// The state of a WPS as a whole, for the library list: in use, never published yet, or out of use.
export const WPS_STATES = ["published", "draft", "retired"] as const;
export type WpsState = (typeof WPS_STATES)[number];

export const STATUS_LABELS: Record<WpsStatus, string> = { draft: "Draft", published: "Published", retired: "Retired" };
export const CURRENT_LABELS: Record<(typeof CURRENT_TYPES)[number], string> = { DC: "Direct current (DC)", AC: "Alternating current (AC)" };
export const POLARITY_LABELS: Record<(typeof POLARITIES)[number], string> = {
  EP: "Electrode positive (DCEP)",
  EN: "Electrode negative (DCEN)",
};
export const BASIS_LABELS: Record<(typeof HEAT_INPUT_BASES)[number], string> = {
  "arc-energy": "Arc energy, no efficiency factor (ASME IX QW-409.1)",
  "iso-q": "Heat input Q = k × arc energy (ISO/TR 17671-1)",
};

// Which ISO 4063 numbers a process family takes; the first is offered by default.
function iso4063For(process: WpsProcess): readonly number[] {
  return PROCESS_INFO[process].iso4063;
}

export type WpsContent = {
  title: string;
  process: WpsProcess | null;
  iso4063: number | null;
  baseMetals: string;
  thicknessMinMm: number | null;
  thicknessMaxMm: number | null;
  fillerClassification: string;
  fillerDiameterMm: number | null;
  shieldingGas: string;
  gasFlowLPerMin: number | null;
  currentType: (typeof CURRENT_TYPES)[number] | null;
  polarity: (typeof POLARITIES)[number] | null;
  voltsMin: number | null;
  voltsMax: number | null;
  ampsMin: number | null;
  ampsMax: number | null;
  travelSpeedMinMmPerMin: number | null;
  travelSpeedMaxMmPerMin: number | null;
  heatInputMaxKJPerMm: number | null;
  heatInputBasis: (typeof HEAT_INPUT_BASES)[number] | null;
  preheatMinC: number | null;
  interpassMaxC: number | null;
  positions: WpsPosition[];
  notes: string;
};

type WpsField = keyof WpsContent;

export const FIELD_LABELS: Record<WpsField, string> = {
  title: "Title",
  process: "Process",
  iso4063: "ISO 4063 number",
  baseMetals: "Base metals",
  thicknessMinMm: "Thickness, minimum (mm)",
  thicknessMaxMm: "Thickness, maximum (mm)",
  fillerClassification: "Filler classification",
  fillerDiameterMm: "Filler diameter (mm)",
  shieldingGas: "Shielding gas",
  gasFlowLPerMin: "Gas flow (L/min)",
  currentType: "Current",
  polarity: "Polarity",
  voltsMin: "Volts, minimum",
  voltsMax: "Volts, maximum",
  ampsMin: "Amps, minimum",
  ampsMax: "Amps, maximum",
  travelSpeedMinMmPerMin: "Travel speed, minimum (mm/min)",
  travelSpeedMaxMmPerMin: "Travel speed, maximum (mm/min)",
  heatInputMaxKJPerMm: "Heat input, maximum (kJ/mm)",
  heatInputBasis: "Heat input basis",
  preheatMinC: "Preheat, minimum (°C)",
  interpassMaxC: "Interpass, maximum (°C)",
  positions: "Positions",
  notes: "Notes",
};

export const EMPTY_CONTENT: WpsContent = {
  title: "",
  process: null,
  iso4063: null,
  baseMetals: "",
  thicknessMinMm: null,
  thicknessMaxMm: null,
  fillerClassification: "",
  fillerDiameterMm: null,
  shieldingGas: "",
  gasFlowLPerMin: null,
  currentType: null,
  polarity: null,
  voltsMin: null,
  voltsMax: null,
  ampsMin: null,
  ampsMax: null,
  travelSpeedMinMmPerMin: null,
  travelSpeedMaxMmPerMin: null,
  heatInputMaxKJPerMm: null,
  heatInputBasis: null,
  preheatMinC: null,
  interpassMaxC: null,
  positions: [],
  notes: "",
};

// --- field schemas ------------------------------------------------------------------------------------
// Upper bounds catch unit mix-ups (inches typed as mm, amps as volts), not process limits.

const numberIn = (label: string, unit: string, min: number, max: number, opts: { exclusiveMin?: boolean; int?: boolean } = {}) => {
  let s = z.number({ error: (iss) => (iss.input === undefined ? `Enter ${label}.` : `${label[0]!.toUpperCase()}${label.slice(1)} must be a number${unit ? ` in ${unit}` : ""}.`) });
  if (opts.int) s = s.int({ error: `${label[0]!.toUpperCase()}${label.slice(1)} must be a whole number.` });
  s = opts.exclusiveMin
    ? s.gt(min, { error: `Must be above ${min}${unit ? ` ${unit}` : ""}.` })
    : s.min(min, { error: `Must be at least ${min}${unit ? ` ${unit}` : ""}.` });
  return s.max(max, { error: `Must be at most ${max}${unit ? ` ${unit}` : ""}.` });
};
const positive = (label: string, unit: string, max: number) => numberIn(label, unit, 0, max, { exclusiveMin: true });
const text = (label: string, max: number) => z.string({ error: `${label} must be text.` }).trim().max(max, { error: `At most ${max} characters.` });

const wpsFieldSchemas = {
  title: text("Title", 120),
  process: z.enum(WPS_PROCESSES, { error: `Process is one of ${WPS_PROCESSES.join(", ")}.` }),
  iso4063: numberIn("the ISO 4063 number", "", 1, 999, { int: true }),
  baseMetals: text("Base metals", 300),
  thicknessMinMm: positive("the minimum thickness", "mm", 300),
  thicknessMaxMm: positive("the maximum thickness", "mm", 300),
  fillerClassification: text("Filler classification", 60),
  fillerDiameterMm: positive("the filler diameter", "mm", 10),
  shieldingGas: text("Shielding gas", 80),
  gasFlowLPerMin: positive("the gas flow", "L/min", 60),
  currentType: z.enum(CURRENT_TYPES, { error: "Current is DC or AC." }),
  polarity: z.enum(POLARITIES, { error: "Polarity is EP (electrode positive) or EN (electrode negative)." }),
  voltsMin: positive("the minimum voltage", "V", 100),
  voltsMax: positive("the maximum voltage", "V", 100),
  ampsMin: positive("the minimum current", "A", 2000),
  ampsMax: positive("the maximum current", "A", 2000),
  travelSpeedMinMmPerMin: positive("the minimum travel speed", "mm/min", 10_000),
  travelSpeedMaxMmPerMin: positive("the maximum travel speed", "mm/min", 10_000),
  heatInputMaxKJPerMm: positive("the maximum heat input", "kJ/mm", 20),
  heatInputBasis: z.enum(HEAT_INPUT_BASES, { error: 'Heat input basis is "arc-energy" or "iso-q".' }),
  preheatMinC: numberIn("the minimum preheat", "°C", -40, 400),
  interpassMaxC: numberIn("the maximum interpass temperature", "°C", 0, 600),
  positions: z
    .array(z.enum(WPS_POSITIONS, { error: `A position is one of ${WPS_POSITIONS.join(", ")}.` }), { error: "Positions must be a list." })
    .max(WPS_POSITIONS.length)
    .transform((p) => WPS_POSITIONS.filter((x) => p.includes(x))),
  notes: text("Notes", 2000),
} satisfies Record<WpsField, z.ZodType>;

type Issue = { path: WpsField; message: string };

// Checks that hold for every revision, draft or not: ranges the right way round, matching numbers.
export function contentIssues(c: WpsContent): Issue[] {
  const issues: Issue[] = [];
  const pairs = [
    ["thicknessMinMm", "thicknessMaxMm", "thickness"],
    ["voltsMin", "voltsMax", "voltage"],
    ["ampsMin", "ampsMax", "current"],
    ["travelSpeedMinMmPerMin", "travelSpeedMaxMmPerMin", "travel speed"],
  ] as const;
  for (const [lo, hi, what] of pairs) {
    const a = c[lo];
    const b = c[hi];
    if (a !== null && b !== null && a > b) issues.push({ path: lo, message: `The minimum ${what} is above the maximum.` });
  }
  if (c.preheatMinC !== null && c.interpassMaxC !== null && c.preheatMinC > c.interpassMaxC) {
    issues.push({ path: "preheatMinC", message: "The minimum preheat is above the maximum interpass temperature." });
  }
  if (c.process && c.iso4063 !== null && !iso4063For(c.process).includes(c.iso4063)) {
    issues.push({ path: "iso4063", message: `${c.process} is ISO 4063 ${iso4063For(c.process).join(" or ")}.` });
  }
  if (c.currentType === "AC" && c.polarity !== null) {
    issues.push({ path: "polarity", message: "Alternating current has no polarity: leave it empty." });
  }
  if (c.process && (c.process === "SMAW" || c.process === "SAW") && c.shieldingGas) {
    issues.push({ path: "shieldingGas", message: `${c.process} is shielded by its flux, not a gas: leave it empty.` });
  }
  if (c.gasFlowLPerMin !== null && !c.shieldingGas) {
    issues.push({ path: "gasFlowLPerMin", message: "A gas flow needs the shielding gas named." });
  }
  return issues;
}

// What publishing needs beyond that: everything a welder and an inspector read off the WPS.
export function publishIssues(c: WpsContent): Issue[] {
  const issues = contentIssues(c);
  const need = (field: WpsField, ok: boolean, message = "Fill this in before publishing.") => {
    if (!ok) issues.push({ path: field, message });
  };
  need("title", c.title.length >= 3, "A title of at least 3 characters.");
  need("process", c.process !== null);
  need("iso4063", c.iso4063 !== null);
  need("baseMetals", c.baseMetals.length > 0);
  need("thicknessMinMm", c.thicknessMinMm !== null);
  need("thicknessMaxMm", c.thicknessMaxMm !== null);
  need("fillerClassification", c.fillerClassification.length > 0);
  need("fillerDiameterMm", c.fillerDiameterMm !== null);
  need("currentType", c.currentType !== null);
  if (c.currentType === "DC") need("polarity", c.polarity !== null, "DC needs its polarity.");
  for (const f of ["voltsMin", "voltsMax", "ampsMin", "ampsMax", "travelSpeedMinMmPerMin", "travelSpeedMaxMmPerMin", "preheatMinC"] as const) {
    need(f, c[f] !== null);
  }
  if (c.heatInputMaxKJPerMm !== null) need("heatInputBasis", c.heatInputBasis !== null, "Say what the heat input limit measures.");
  need("positions", c.positions.length > 0, "Tick at least one position.");
  if (c.process === "GMAW" || c.process === "GTAW") {
    need("shieldingGas", c.shieldingGas.length > 0, `${c.process} needs its shielding gas.`);
    need("gasFlowLPerMin", c.gasFlowLPerMin !== null, "Give the gas flow.");
  }
  return issues;
}

export function issuesToFields(issues: Issue[]): Record<string, string[]> {
  const fields: Record<string, string[]> = {};
  for (const i of issues) (fields[i.path] ??= []).push(i.message);
  return fields;
}

// --- request schemas ----------------------------------------------------------------------------------

const optionalShape = Object.fromEntries(Object.entries(wpsFieldSchemas).map(([k, s]) => [k, s.optional()])) as {
  [K in WpsField]: z.ZodOptional<(typeof wpsFieldSchemas)[K]>;
};

/** The draft editor's form: every field, any may be empty; an empty field is stored as empty. */
export const wpsDraftFormSchema = z
  .object({ ...optionalShape, wpsId: z.string().uuid(), number: z.coerce.number().int().min(1) })
  .superRefine((v, ctx) => {
    for (const i of contentIssues(formToContent(v))) ctx.addIssue({ code: "custom", path: [i.path], message: i.message });
  });

export function formToContent(v: Partial<Record<WpsField, unknown>>): WpsContent {
  const out = { ...EMPTY_CONTENT } as Record<WpsField, unknown>;
  for (const k of Object.keys(EMPTY_CONTENT) as WpsField[]) {
    if (v[k] !== undefined) out[k] = v[k];
  }
  return out as WpsContent;
}

/** PATCH /api/wps/{id}/revisions/{n}: any subset of the fields; null clears one. */
export const wpsPatchSchema = z
  .strictObject(
    Object.fromEntries(Object.entries(wpsFieldSchemas).map(([k, s]) => [k, s.nullable().optional()])) as {
      [K in WpsField]: z.ZodOptional<z.ZodNullable<(typeof wpsFieldSchemas)[K]>>;
    },
  )
  .refine((v) => Object.keys(v).length > 0, { message: "Send at least one field to change." });
export type WpsPatch = z.output<typeof wpsPatchSchema>;

export function applyPatch(current: WpsContent, patch: WpsPatch): WpsContent {
  const next = { ...current } as Record<WpsField, unknown>;
  for (const [k, v] of Object.entries(patch) as [WpsField, unknown][]) {
    if (v === undefined) continue;
    next[k] = v === null ? EMPTY_CONTENT[k] : v;
  }
  return next as WpsContent;
}

export const referenceSchema = z
  .string({ error: "Give the WPS a reference, such as GX-WPS-04." })
  .trim()
  .toUpperCase()
  .regex(/^[A-Z0-9][A-Z0-9._/-]{1,39}$/, { error: "A reference is 2 to 40 letters, digits, dots, dashes or slashes, such as GX-WPS-04." });

/** POST /api/wps and the "Start a WPS" form: a reference, a title and a process start revision 1 as a draft. */
export const wpsCreateSchema = z.strictObject({
  reference: referenceSchema,
  title: text("Title", 120).min(3, { error: "A title of at least 3 characters." }),
  process: wpsFieldSchemas.process,
});

export const changeNoteSchema = z
  .string({ error: "Say what changed in this revision." })
  .trim()
  .min(3, { error: "Say what changed in this revision (at least 3 characters)." })
  .max(1000, { error: "At most 1000 characters." });

export const publishSchema = z.strictObject({ changeNote: changeNoteSchema });
export const retireSchema = z.strictObject({
  reason: z
    .string({ error: "Say why this WPS goes out of use." })
    .trim()
    .min(3, { error: "Say why this WPS goes out of use (at least 3 characters)." })
    .max(1000, { error: "At most 1000 characters." }),
});

export const wpsListQuerySchema = z.object({
  q: z.string().trim().max(100).optional(),
  state: z.enum(WPS_STATES, { error: `state is one of ${WPS_STATES.join(", ")}` }).optional(),
  process: z.enum(WPS_PROCESSES, { error: `process is one of ${WPS_PROCESSES.join(", ")}` }).optional(),
  page: z.coerce.number().int().min(1).max(10_000).default(1),
  pageSize: z.coerce.number().int().min(1).max(100).default(20),
});

/** The ranges lib/welding's checkPassAgainstWps reads, from a revision's content. */
export function toWpsRanges(c: WpsContent): WpsRanges {
  const r: WpsRanges = {};
  if (c.process) r.process = c.process;
  if (c.voltsMin !== null) r.voltsMin = c.voltsMin;
  if (c.voltsMax !== null) r.voltsMax = c.voltsMax;
  if (c.ampsMin !== null) r.ampsMin = c.ampsMin;
  if (c.ampsMax !== null) r.ampsMax = c.ampsMax;
  if (c.travelSpeedMinMmPerMin !== null) r.travelSpeedMinMmPerMin = c.travelSpeedMinMmPerMin;
  if (c.travelSpeedMaxMmPerMin !== null) r.travelSpeedMaxMmPerMin = c.travelSpeedMaxMmPerMin;
  if (c.heatInputMaxKJPerMm !== null) r.heatInputMaxKJPerMm = c.heatInputMaxKJPerMm;
  if (c.heatInputBasis !== null) r.heatInputBasis = c.heatInputBasis;
  if (c.preheatMinC !== null) r.preheatMinC = c.preheatMinC;
  if (c.interpassMaxC !== null) r.interpassMaxC = c.interpassMaxC;
  if (c.positions.length) r.positions = [...c.positions];
  return r;
}
