// Reading what people type into calculator fields and writing figures back: pure, shared by every screen.
// Lengths, temperatures and other quantities go through lib/units' free-text parser, so `3 1/4"` or `82,5`
// work wherever a number does; a bare number takes the unit the screen is showing.
import { z } from "zod";
import { fromSI, parseQuantity, preferredUnit, unitSymbol, type Quantity, type UnitOf, type UnitSystem } from "@/lib/units";

export type { UnitSystem };

/** Minus sign for figures on screen (the parser reads it back as "-"). */
export const MINUS = "\u2212";

const PLAIN_NUMBER = /^[+\-\u2212]?(?:\d+(?:[.,]\d*)?|[.,]\d+)$/;

/** A plain decimal number, point or comma; NaN for anything else (no units, no thousands separators). */
export function readPlainNumber(text: string): number {
  const t = text.trim().replace(/\s+/g, "");
  if (!PLAIN_NUMBER.test(t)) return Number.NaN;
  return Number(t.replace("\u2212", "-").replace(",", "."));
}

/** zod: required plain number from a text field. */
export function numberText(label: string) {
  return z.string().transform((text, ctx) => {
    if (text.trim() === "") {
      ctx.addIssue({ code: "custom", message: `Enter ${label}.` });
      return z.NEVER;
    }
    const v = readPlainNumber(text);
    if (!Number.isFinite(v)) {
      ctx.addIssue({ code: "custom", message: `${capital(label)} must be a number, e.g. 24 or 24.5.` });
      return z.NEVER;
    }
    return v;
  });
}

/** zod: optional plain number; blank gives undefined. */
export function optionalNumberText(label: string) {
  return z.string().transform((text, ctx) => {
    if (text.trim() === "") return undefined;
    const v = readPlainNumber(text);
    if (!Number.isFinite(v)) {
      ctx.addIssue({ code: "custom", message: `${capital(label)} must be a number, or leave it blank.` });
      return z.NEVER;
    }
    return v;
  });
}

/** zod: required quantity from a text field, in the quantity's stored unit (mm, °C, kN, µm…). */
export function quantityText<Q extends Quantity>(quantity: Q, defaultUnit: UnitOf<Q>, label: string) {
  return z.string().transform((text, ctx) => {
    if (text.trim() === "") {
      ctx.addIssue({ code: "custom", message: `Enter ${label}.` });
      return z.NEVER;
    }
    const r = parseQuantity(text, quantity, { defaultUnit });
    if (!r.ok) {
      ctx.addIssue({ code: "custom", message: r.message });
      return z.NEVER;
    }
    return r.valueSI;
  });
}

export function optionalQuantityText<Q extends Quantity>(quantity: Q, defaultUnit: UnitOf<Q>) {
  return z.string().transform((text, ctx) => {
    if (text.trim() === "") return undefined;
    const r = parseQuantity(text, quantity, { defaultUnit });
    if (!r.ok) {
      ctx.addIssue({ code: "custom", message: r.message });
      return z.NEVER;
    }
    return r.valueSI;
  });
}

function capital(s: string): string {
  return s.charAt(0).toUpperCase() + s.slice(1);
}

export type FieldErrors = Record<string, string>;

/** First message per field, keyed by the form's own field name (mapPath turns a schema path into one). */
export function fieldErrors(issues: readonly z.core.$ZodIssue[], mapPath: (path: string) => string = (p) => p): FieldErrors {
  const out: FieldErrors = {};
  for (const issue of issues) {
    const key = mapPath(issue.path.length ? issue.path.map(String).join(".") : "_");
    out[key] ??= capital(issue.message);
  }
  return out;
}

/** Grouped, fixed decimals, a true minus sign; "−0.00" never appears. */
export function figure(value: number, digits: number, opts: { sign?: boolean; group?: boolean } = {}): string {
  if (!Number.isFinite(value)) return "—";
  const text = Math.abs(value).toLocaleString("en-US", {
    minimumFractionDigits: digits,
    maximumFractionDigits: digits,
    useGrouping: opts.group ?? true,
  });
  const zero = /^[0.,]*$/.test(text);
  if (zero) return text;
  if (value < 0) return MINUS + text;
  return opts.sign ? `+${text}` : text;
}

/** A stored value shown in the person's units, e.g. "0.223 in" or "5.67 mm". */
export function shown<Q extends Quantity>(quantity: Q, valueSI: number, system: UnitSystem, digits: { metric: number; imperial: number }, opts: { sign?: boolean } = {}): string {
  const unit = preferredUnit(quantity, system);
  const symbol = unitSymbol(quantity, unit);
  const v = figure(fromSI(quantity, valueSI, unit), digits[system], opts);
  return symbol === "°" ? `${v}°` : `${v} ${symbol}`;
}

/** The value alone, in the person's units (for tables whose header carries the unit). */
export function shownValue<Q extends Quantity>(quantity: Q, valueSI: number, system: UnitSystem, digits: { metric: number; imperial: number }, opts: { sign?: boolean } = {}): string {
  return figure(fromSI(quantity, valueSI, preferredUnit(quantity, system)), digits[system], opts);
}

export function symbolFor(quantity: Quantity, system: UnitSystem): string {
  return unitSymbol(quantity, preferredUnit(quantity, system));
}

/**
 * Rewrites a field typed in one unit system into the other, so switching units keeps what was entered.
 * A field that does not read (a typo) is left exactly as typed, so nothing is lost.
 */
export function convertText<Q extends Quantity>(text: string, quantity: Q, from: UnitSystem, to: UnitSystem, digits: { metric: number; imperial: number }): string {
  if (from === to || text.trim() === "") return text;
  const r = parseQuantity(text, quantity, { defaultUnit: preferredUnit(quantity, from) });
  if (!r.ok) return text;
  const v = fromSI(quantity, r.valueSI, preferredUnit(quantity, to));
  return trimNumber(v, digits[to]);
}

/** Fixed decimals without trailing zeros, plain "-" so the field reads back: 18.8976, 480, -0.5. */
export function trimNumber(value: number, digits: number): string {
  const s = value.toFixed(digits);
  const t = s.includes(".") ? s.replace(/0+$/, "").replace(/\.$/, "") : s;
  return t === "-0" ? "0" : t;
}

/** Nearest fraction of an inch, e.g. 3.2504 → "3 1/4"; for shop drawings, alongside the decimal. */
export function inchFraction(inches: number, denominator = 16): string {
  if (!Number.isFinite(inches)) return "—";
  const sign = inches < 0 ? MINUS : "";
  let whole = Math.floor(Math.abs(inches));
  let n = Math.round((Math.abs(inches) - whole) * denominator);
  let d = denominator;
  if (n === d) {
    whole += 1;
    n = 0;
  }
  while (n > 0 && n % 2 === 0 && d % 2 === 0) {
    n /= 2;
    d /= 2;
  }
  if (n === 0) return `${sign}${whole}"`;
  return whole === 0 ? `${sign}${n}/${d}"` : `${sign}${whole} ${n}/${d}"`;
}
