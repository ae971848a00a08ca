// Text and number formatting for the traveller. Pure, so it is tested without rendering.

// The characters both embedded faces (Inter and IBM Plex Mono, latin subsets in public/fonts) draw.
// Read from the fonts' cmaps; anything else would print as an empty box, so it is replaced first.
// react-pdf draws any other character, a line feed included, in its unembedded Helvetica fallback,
// which also breaks PDF/A.
const COVERED: readonly [number, number][] = [
  [0x20, 0x7e],
  [0xa0, 0xac],
  [0xae, 0xff],
  [0x131, 0x131],
  [0x152, 0x153],
  [0x2bb, 0x2bc],
  [0x2c6, 0x2c6],
  [0x2da, 0x2da],
  [0x2dc, 0x2dc],
  [0x2013, 0x2014],
  [0x2018, 0x201a],
  [0x201c, 0x201e],
  [0x2022, 0x2022],
  [0x2026, 0x2026],
  [0x2032, 0x2033],
  [0x2039, 0x203a],
  [0x2044, 0x2044],
  [0x20ac, 0x20ac],
  [0x2122, 0x2122],
  [0x2191, 0x2191],
  [0x2193, 0x2193],
  [0x2212, 0x2212],
];

const REPLACE: Record<string, string> = {
  "\n": " ",
  "\t": " ",
  "\r": "",
  "\u00ad": "",
  "\u2009": " ",
  "\u200a": " ",
  "\u202f": " ",
  "\u2007": " ",
  "\u200b": "",
  "\u2010": "-",
  "\u2011": "-",
  "\u2264": "<=",
  "\u2265": ">=",
  "\u2260": "!=",
  "\u2248": "~",
  "\u2192": "->",
  "\u2190": "<-",
  "\u03bc": "\u00b5",
  "\u03b8": "theta",
  "\u03c6": "phi",
  "\u0394": "delta ",
  "\u2126": "ohm",
  "\u2300": "dia. ",
  "\u2103": "\u00b0C",
  "\u2109": "\u00b0F",
  "\u2713": "ok",
  "\u2714": "ok",
  "\u2715": "x",
  "\u2717": "x",
  "\u25cf": "\u2022",
  "\u25cb": "o",
};

function covered(cp: number): boolean {
  for (const [lo, hi] of COVERED) if (cp >= lo && cp <= hi) return true;
  return false;
}

/**
 * Text the embedded fonts can draw: unknown characters become their nearest plain form (ě → e, ≤ → <=),
 * or "?" when there is none, so nothing silently vanishes from a printed record.
 */
export function printable(input: string): string {
  let out = "";
  for (const ch of input.normalize("NFC")) {
    const cp = ch.codePointAt(0) ?? 0;
    if (covered(cp)) {
      out += ch;
      continue;
    }
    const mapped = REPLACE[ch];
    if (mapped !== undefined) {
      out += mapped;
      continue;
    }
    const base = ch.normalize("NFD").replace(/\p{M}/gu, "");
    out += base.length > 0 && [...base].every((c) => covered(c.codePointAt(0) ?? 0)) ? base : "?";
  }
  return out;
}

/** Multi-line text as printable lines (blank lines kept as empty strings, trailing ones dropped). */
export function printableLines(input: string): string[] {
  const lines = input.replace(/\r\n?/g, "\n").split("\n").map((l) => printable(l).trimEnd());
  while (lines.length > 0 && lines[lines.length - 1] === "") lines.pop();
  return lines;
}

const MINUS = "\u2212";

/** A reading for print: fixed decimals when given, else up to 3 with trailing zeros trimmed; a true minus sign. */
export function formatNumber(value: number, decimals?: number): string {
  let s = decimals === undefined ? String(Number(value.toFixed(3))) : value.toFixed(decimals);
  if (/^-0(\.0+)?$/.test(s)) s = s.slice(1);
  return s.startsWith("-") ? MINUS + s.slice(1) : s;
}

/** A signed figure, "+1.2" / "−0.4", for deltas and angles where the sign matters. */
export function formatSigned(value: number, decimals: number): string {
  const s = formatNumber(value, decimals);
  return s.startsWith(MINUS) || Number(value.toFixed(decimals)) === 0 ? s : `+${s}`;
}

function parts(date: Date, timeZone: string): Record<string, string> {
  const fmt = new Intl.DateTimeFormat("en-CA", {
    timeZone,
    year: "numeric",
    month: "2-digit",
    day: "2-digit",
    hour: "2-digit",
    minute: "2-digit",
    hourCycle: "h23",
    timeZoneName: "longOffset",
  });
  const out: Record<string, string> = {};
  for (const p of fmt.formatToParts(date)) out[p.type] = p.value;
  return out;
}

/** "2026-03-04 10:22 UTC" or "2026-03-04 11:22 UTC+01:00": ISO 8601 order with the offset spelled out. */
export function formatInstant(date: Date, timeZone: string): string {
  const p = parts(date, timeZone);
  const offset = (p.timeZoneName ?? "GMT").replace(/^GMT/, "UTC").replace(/^UTC[+-]00:00$/, "UTC");
  return `${p.year}-${p.month}-${p.day} ${p.hour}:${p.minute} ${offset}`;
}

/** The calendar day of an instant in the shop's zone. */
export function formatDay(date: Date, timeZone: string): string {
  const p = parts(date, timeZone);
  return `${p.year}-${p.month}-${p.day}`;
}

/** A long hex string in groups, so it can be read aloud and wraps without hyphens. */
export function groupHex(hex: string, size = 4): string[] {
  const groups: string[] = [];
  for (let i = 0; i < hex.length; i += size) groups.push(hex.slice(i, i + size));
  return groups;
}

/** The seal's short form printed large: its first 12 hex characters. */
export function sealShort(sha256: string): string {
  return sha256.slice(0, 12);
}

/** Break a URL into lines of at most `width` characters, preferring breaks after "/", "?", "&" or "-". */
export function wrapUrl(url: string, width: number): string[] {
  const lines: string[] = [];
  let rest = url;
  while (rest.length > width) {
    const window = rest.slice(0, width);
    let cut = Math.max(window.lastIndexOf("/"), window.lastIndexOf("?"), window.lastIndexOf("&"), window.lastIndexOf("-"));
    cut = cut >= width / 3 ? cut + 1 : width;
    lines.push(rest.slice(0, cut));
    rest = rest.slice(cut);
  }
  if (rest) lines.push(rest);
  return lines;
}
