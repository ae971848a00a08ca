/**
 * Reading quantities typed by people on the shop floor: `3 1/4"`, `3-1/4 in`, `82,5 mm`, `65 ft-lb`,
 * `300F`, `5' 6"`, `6 mil`, `150 µm`. Never throws: a typo becomes a message on the form.
 */
import { type Quantity, type UnitOf, QUANTITIES, isUnitOf, toSI } from "./quantities";
import { K_AT_0C } from "./factors";

export type ParseSuccess<Q extends Quantity = Quantity> = Q extends Quantity
  ? { ok: true; quantity: Q; unit: UnitOf<Q>; value: number; valueSI: number }
  : never;
export type ParseFailure = { ok: false; message: string };
export type ParseResult<Q extends Quantity = Quantity> = ParseSuccess<Q> | ParseFailure;

export interface ParseOptions<Q extends Quantity> {
  /** unit assumed for a bare number (only used together with a quantity) */
  defaultUnit?: UnitOf<Q>;
}

type Candidate = { [Q in Quantity]: { quantity: Q; unit: UnitOf<Q> } }[Quantity];

// Keys are normalised: lower case, no spaces, dots, hyphens, middle dots or asterisks
// (so "lbf·ft", "lb-ft" and "lb ft" meet), micro sign folded to Greek mu.
// A key listed under several quantities resolves to the first unless a quantity is asked for.
const ALIASES: Record<string, Candidate[]> = {};
function alias(keys: string[], ...candidates: Candidate[]): void {
  for (const k of keys) (ALIASES[k] ??= []).push(...candidates);
}
alias(["mm", "millimeter", "millimeters", "millimetre", "millimetres"], { quantity: "length", unit: "mm" }, { quantity: "thickness", unit: "mm" });
alias(["cm", "centimeter", "centimeters", "centimetre", "centimetres"], { quantity: "length", unit: "cm" });
alias(["m", "meter", "meters", "metre", "metres"], { quantity: "length", unit: "m" });
alias(['"', "''", "in", "inch", "inches"], { quantity: "length", unit: "in" });
alias(["'", "ft", "foot", "feet"], { quantity: "length", unit: "ft" });
alias(["°", "deg", "degs", "degree", "degrees"], { quantity: "angle", unit: "deg" });
alias(["rad", "radian", "radians"], { quantity: "angle", unit: "rad" });
alias(["°c", "c", "degc", "degreec", "degreesc", "celsius"], { quantity: "temperature", unit: "degC" });
alias(["°f", "f", "degf", "degreef", "degreesf", "fahrenheit"], { quantity: "temperature", unit: "degF" });
alias(["k", "kelvin"], { quantity: "temperature", unit: "K" });
alias(["μm", "um", "micron", "microns", "micrometer", "micrometers", "micrometre", "micrometres"], { quantity: "thickness", unit: "um" });
alias(["mil", "mils", "thou"], { quantity: "thickness", unit: "mil" });
alias(["nm", "newtonmeter", "newtonmeters", "newtonmetre", "newtonmetres"], { quantity: "torque", unit: "N_m" });
alias(
  ["lbft", "lbsft", "lbfft", "ftlb", "ftlbs", "ftlbf", "poundfoot", "poundfeet", "footpound", "footpounds"],
  { quantity: "torque", unit: "lbf_ft" },
);
alias(["lbin", "lbsin", "lbfin", "inlb", "inlbs", "inlbf", "poundinch", "poundinches", "inchpound", "inchpounds"], {
  quantity: "torque",
  unit: "lbf_in",
});
alias(["kpa"], { quantity: "pressure", unit: "kPa" });
alias(["mpa"], { quantity: "pressure", unit: "MPa" });
alias(["bar"], { quantity: "pressure", unit: "bar" });
alias(["psi", "lbf/in2", "lbf/in²", "lb/in2", "lb/in²"], { quantity: "pressure", unit: "psi" });
alias(["mm/min", "mmpermin", "mm/minute"], { quantity: "speed", unit: "mm_min" });
alias(["mm/s", "mm/sec", "mmpers"], { quantity: "speed", unit: "mm_s" });
alias(["in/min", "ipm", "inpermin", "inch/min", "inches/min", '"/min'], { quantity: "speed", unit: "in_min" });
alias(["n", "newton", "newtons"], { quantity: "force", unit: "N" });
alias(["kn", "kilonewton", "kilonewtons"], { quantity: "force", unit: "kN" });
alias(["lbf", "lb", "lbs", "pound", "pounds"], { quantity: "force", unit: "lbf" });
alias(["kip", "kips"], { quantity: "force", unit: "kip" });

const EXAMPLES: Record<Quantity, string> = {
  length: `82.5 mm or 3 1/4"`,
  angle: "12.5°",
  temperature: "150 °C or 300 °F",
  thickness: "150 µm or 6 mil",
  torque: "90 N·m or 65 lbf·ft",
  pressure: "207 kPa or 30 psi",
  speed: "200 mm/min or 8 in/min",
  force: "40 kN or 9 kip",
};

const MAX_LENGTH = 64;

// whole + fraction ("3 1/4", "3-1/4"), fraction ("1/2"), or decimal with point or comma.
const NUMBER_RE = /^(?:(\d+)(?:\s+|\s*-\s*)(\d+)\s*\/\s*(\d+)|(\d+)\s*\/\s*(\d+)|(\d[\d.,]*|[.,]\d+))/;
const FEET_RE = /^(?:'|ft|feet|foot)\.?\s*(?=\d)/i;

function fail(message: string): ParseFailure {
  return { ok: false, message };
}

/** Fold look-alike characters people paste from phones and word processors. */
function clean(text: string): string {
  return text
    .replace(/[º˚]/g, "°") // masculine ordinal and ring above, typed as degree signs
    // Vulgar fractions get a space first, or NFKC would turn "3½" into "31⁄2".
    .replace(/[¼½¾⅐-⅞]/g, (c) => ` ${c.normalize("NFKC")}`)
    .normalize("NFKC") // ½ → 1⁄2, ℉ → °F, µ → μ, ″ → ′′, NBSP → space
    .replace(/⁄/g, "/")
    .replace(/′′|[″“”„]/g, '"')
    .replace(/[′‘’]/g, "'")
    .replace(/[−–—]/g, "-")
    .replace(/\s+/g, " ")
    .trim();
}

/**
 * "82,5" and "82.5" → 82.5; "1,234.5" / "1.234,5" → 1234.5; "1,000,000" → 1e6.
 * NaN when unreadable or ambiguous ("1,000" alone: thousands or decimal comma).
 */
function readDecimal(raw: string): number {
  let s = raw;
  const hasDot = s.includes(".");
  const hasComma = s.includes(",");
  if (hasDot && hasComma) {
    const decimal = s.lastIndexOf(".") > s.lastIndexOf(",") ? "." : ",";
    const group = decimal === "." ? "," : ".";
    s = s.split(group).join("");
    if (s.split(decimal).length > 2) return Number.NaN;
    s = s.replace(decimal, ".");
  } else if (hasComma && /^\d{1,3},\d{3}$/.test(s)) {
    // "1,000 psi": a thousand to some, one to others. Refuse rather than seal a guess.
    return Number.NaN;
  } else if (hasComma || hasDot) {
    const sep = hasComma ? "," : ".";
    const parts = s.split(sep);
    if (parts.length === 2) s = parts.join(".");
    else if (new RegExp(`^\\d{1,3}(\\${sep}\\d{3})+$`).test(s)) s = parts.join("");
    else return Number.NaN;
  }
  if (s.endsWith(".")) s = s.slice(0, -1);
  if (s === "" || s === ".") return Number.NaN;
  return Number(s.startsWith(".") ? `0${s}` : s);
}

type NumberRead = { ok: true; value: number; rest: string } | ParseFailure;

function readNumber(s: string): NumberRead {
  const m = NUMBER_RE.exec(s);
  if (!m) return fail(`Could not find a number at the start of "${s}".`);
  const [all, whole, num, den, fNum, fDen, dec] = m;
  let value: number;
  if (whole !== undefined && num !== undefined && den !== undefined) {
    if (Number(den) === 0) return fail(`The fraction in "${all}" divides by zero.`);
    value = Number(whole) + Number(num) / Number(den);
  } else if (fNum !== undefined && fDen !== undefined) {
    if (Number(fDen) === 0) return fail(`The fraction in "${all}" divides by zero.`);
    value = Number(fNum) / Number(fDen);
  } else {
    value = readDecimal(dec ?? "");
    if (!Number.isFinite(value)) {
      if (dec !== undefined && /^\d{1,3},\d{3}$/.test(dec)) {
        const [int = "", frac = ""] = dec.split(",");
        return fail(`"${dec}" is ambiguous: write ${int}${frac} or ${int}.${frac}.`);
      }
      return fail(`"${dec ?? all}" is not a number that can be read; use one point or one comma for decimals.`);
    }
  }
  return { ok: true, value, rest: s.slice(all.length).trim() };
}

function unitKey(text: string): string {
  return text.toLowerCase().replace(/µ/g, "μ").replace(/[\s·⋅•*×._-]/g, "");
}

function success<Q extends Quantity>(quantity: Q, unit: UnitOf<Q>, value: number): ParseResult {
  const valueSI = toSI(quantity, value, unit);
  if (!Number.isFinite(valueSI)) return fail("That number is too large.");
  if (quantity === "temperature" && valueSI < -K_AT_0C - 1e-9) return fail("That temperature is below absolute zero.");
  if (quantity === "thickness" && value < 0) return fail("A thickness cannot be negative.");
  return { ok: true, quantity, unit, value, valueSI } as ParseSuccess as ParseResult;
}

/**
 * Parse "number unit". With `quantity`, the unit must belong to it (and ambiguous symbols such as
 * "mm" resolve to it); without, the unit decides the quantity.
 */
export function parseQuantity<Q extends Quantity = Quantity>(
  text: string,
  quantity?: Q,
  options: ParseOptions<Q> = {},
): ParseResult<Q> {
  try {
    return parseInner(text, quantity, options as ParseOptions<Quantity>) as ParseResult<Q>;
  } catch {
    // Defensive: parsing must never take a form down.
    return fail("That value could not be read.");
  }
}

function parseInner(text: unknown, quantity: Quantity | undefined, options: ParseOptions<Quantity>): ParseResult {
  if (quantity !== undefined && !(QUANTITIES as readonly string[]).includes(quantity)) {
    return fail(`Unknown quantity "${String(quantity)}".`);
  }
  const example = quantity ? EXAMPLES[quantity] : `82.5 mm or 65 lbf·ft`;
  if (typeof text !== "string") return fail(`Enter a value with a unit, e.g. ${example}.`);
  if (text.length > MAX_LENGTH) return fail("That entry is too long.");
  const s = clean(text);
  if (s === "") return fail(`Enter a value with a unit, e.g. ${example}.`);

  let sign = 1;
  let body = s;
  if (body.startsWith("-") || body.startsWith("+")) {
    sign = body.startsWith("-") ? -1 : 1;
    body = body.slice(1).trim();
  }
  const first = readNumber(body);
  if (!first.ok) return first;
  let value = first.value;
  const rest = first.rest;

  // Feet and inches together: 5' 6", 5'6", 5 ft 6 1/2 in → inches.
  const feet = FEET_RE.exec(rest);
  if (feet && (quantity === undefined || quantity === "length")) {
    const inches = readNumber(rest.slice(feet[0].length));
    if (!inches.ok) return inches;
    const inchUnit = unitKey(inches.rest);
    if (inchUnit !== "" && !["\"", "''", "in", "inch", "inches"].includes(inchUnit)) {
      return fail(`After feet, expected inches (e.g. 5' 6"), not "${inches.rest}".`);
    }
    return success("length", "in", sign * (value * 12 + inches.value));
  }
  value = value * sign + 0; // + 0 turns "-0" into 0

  if (rest === "") {
    if (quantity && options.defaultUnit !== undefined && isUnitOf(quantity, options.defaultUnit)) {
      return success(quantity, options.defaultUnit, value);
    }
    return fail(`Add a unit, e.g. ${example}.`);
  }

  const key = unitKey(rest);
  if (key === "°" && quantity === "temperature") return fail(`Say °C or °F, e.g. ${example}.`);
  const candidates = ALIASES[key];
  if (!candidates || candidates.length === 0) {
    return fail(`Unknown unit "${rest}"${quantity ? `; e.g. ${example}` : ""}.`);
  }
  const chosen = quantity ? candidates.find((c) => c.quantity === quantity) : candidates[0];
  if (!chosen) {
    const other = candidates[0]?.quantity ?? "different";
    return fail(`"${rest}" is a ${other} unit, but a ${quantity} is needed, e.g. ${example}.`);
  }
  return success(chosen.quantity, chosen.unit, value);
}
