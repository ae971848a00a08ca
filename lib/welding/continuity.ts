// Welder qualification continuity: a process not used within the period lapses.
// ASME BPVC IX QW-322.1: lapses when the welder has not used the process for 6 months or more, so
//   last use 2025-01-10 → lapsed on 2025-07-10 (the 6-month anniversary itself).
// AWS D1.1 (4.2.3.1 in 2015; 6.2.3.1 in 2020, from memory): lapses after a period *exceeding* six months, so
//   the anniversary is still good and the qualification is lapsed from the day after, 2025-07-11.
// Dates are calendar dates (no time, no zone), computed in UTC so the browser's zone and DST never shift them.
// Adding months keeps the day of the month and clamps it to the end of a shorter month
// (2025-08-31 + 6 months = 2026-02-28): the alternative, rolling over into March, would extend a
// qualification by up to three days, and clamping errs towards requalifying.

export const CONTINUITY_CODES = ["asme-ix", "aws-d1.1"] as const;
export type ContinuityCode = (typeof CONTINUITY_CODES)[number];

export type ContinuityStatus = "current" | "lapsing" | "lapsed";

export interface ContinuityResult {
  status: ContinuityStatus;
  /** First date on which the qualification is lapsed (YYYY-MM-DD). */
  expiresOn: string;
  /** Last date on which the welder may still weld with the process (the day before expiresOn). */
  lastValidOn: string;
  /** Whole days from today to expiresOn: 0 on that day, negative after it. */
  daysLeft: number;
  source: string;
}

/** "Lapsing" warns this many days ahead of expiresOn. */
export const LAPSING_WINDOW_DAYS = 30;
export const CONTINUITY_MONTHS = 6;

const DAY_MS = 86_400_000;
const ISO_DATE = /^(\d{4})-(\d{2})-(\d{2})$/;

/** Parses a strict calendar date "YYYY-MM-DD" to a UTC day number (days since 1970-01-01). */
export function parseIsoDate(iso: string): number {
  const m = ISO_DATE.exec(iso);
  if (!m) throw new RangeError(`expected a date as YYYY-MM-DD, got "${iso}"`);
  const [y, mo, d] = [Number(m[1]), Number(m[2]), Number(m[3])];
  const ms = Date.UTC(y, mo - 1, d);
  const back = new Date(ms);
  // Date.UTC rolls 2025-02-30 over to March; a round trip catches dates that do not exist.
  if (back.getUTCFullYear() !== y || back.getUTCMonth() !== mo - 1 || back.getUTCDate() !== d) {
    throw new RangeError(`"${iso}" is not a calendar date`);
  }
  return ms / DAY_MS;
}

export function formatIsoDate(dayNumber: number): string {
  return new Date(dayNumber * DAY_MS).toISOString().slice(0, 10);
}

/** Adds calendar months, clamping the day to the last day of a shorter target month. */
export function addMonthsClamped(iso: string, months: number): string {
  const day = parseIsoDate(iso);
  const d = new Date(day * DAY_MS);
  const y = d.getUTCFullYear();
  const total = d.getUTCMonth() + months;
  const ty = y + Math.floor(total / 12);
  const tm = ((total % 12) + 12) % 12;
  const lastDay = new Date(Date.UTC(ty, tm + 1, 0)).getUTCDate();
  return formatIsoDate(Date.UTC(ty, tm, Math.min(d.getUTCDate(), lastDay)) / DAY_MS);
}

export function addDays(iso: string, days: number): string {
  return formatIsoDate(parseIsoDate(iso) + days);
}

export function continuity(code: ContinuityCode, lastUsedIso: string, todayIso: string): ContinuityResult {
  const last = parseIsoDate(lastUsedIso);
  const today = parseIsoDate(todayIso);
  if (last > today) {
    throw new RangeError(`last use ${lastUsedIso} is after today ${todayIso}`);
  }
  const anniversary = addMonthsClamped(lastUsedIso, CONTINUITY_MONTHS);
  // ASME: "6 months or more" → lapsed on the anniversary; AWS: "exceeding six months" → the day after.
  const expiresOn = code === "asme-ix" ? anniversary : addDays(anniversary, 1);
  const daysLeft = parseIsoDate(expiresOn) - today;
  const status: ContinuityStatus =
    daysLeft <= 0 ? "lapsed" : daysLeft <= LAPSING_WINDOW_DAYS ? "lapsing" : "current";
  return {
    status,
    expiresOn,
    lastValidOn: addDays(expiresOn, -1),
    daysLeft,
    source:
      code === "asme-ix"
        ? "ASME BPVC Section IX QW-322.1: lapses when the process is unused for 6 months or more"
        : "AWS D1.1:2020, welder qualification period: lapses when unused for a period exceeding six months",
  };
}
