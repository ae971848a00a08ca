// Filters of the quality figures (GET /api/quality and the Quality screen) and the shape of the answer.
// Pure: shared by the route, the page and the browser.
import { z } from "zod";

const DAY_RE = /^\d{4}-\d{2}-\d{2}$/;

function isCalendarDay(v: string): boolean {
  const d = new Date(`${v}T00:00:00Z`);
  return !Number.isNaN(d.getTime()) && d.toISOString().slice(0, 10) === v;
}

const day = z
  .string()
  .trim()
  .regex(DAY_RE, "A date like 2026-11-30.")
  .refine(isCalendarDay, "Not a calendar date.");

// An empty form field means "no filter", so a submitted filter form and a hand-written URL read the same.
const blank = (v: unknown) => (typeof v === "string" && v.trim() === "" ? undefined : v);

export const qualityQuerySchema = z
  .object({
    from: z.preprocess(blank, day.optional()),
    to: z.preprocess(blank, day.optional()),
    welderId: z.preprocess(blank, z.string().trim().min(1).max(64, "At most 64 characters.").regex(/^[A-Za-z0-9_-]+$/, "Not a person's id.").optional()),
    wpsId: z.preprocess(blank, z.uuid("Not a WPS id.").optional()),
    procedureId: z.preprocess(blank, z.uuid("Not a procedure id.").optional()),
  })
  .strict()
  .refine((v) => !v.from || !v.to || v.from <= v.to, { path: ["to"], message: "The end date is before the start date." })
  .refine((v) => !v.from || !v.to || daysBetween(v.from, v.to) <= 3660, { path: ["from"], message: "At most ten years at a time." });

function daysBetween(from: string, to: string): number {
  return Math.round((Date.parse(`${to}T00:00:00Z`) - Date.parse(`${from}T00:00:00Z`)) / 86_400_000);
}

/** The screen opens on the last 90 days; an explicit range replaces it. */
const DEFAULT_WINDOW_DAYS = 90;

export function defaultRange(today: string, days = DEFAULT_WINDOW_DAYS): { from: string; to: string } {
  const t = Date.parse(`${today}T00:00:00Z`);
  return { from: new Date(t - days * 86_400_000).toISOString().slice(0, 10), to: today };
}

/** At most this many heat-input points per WPS (the latest): enough for an individuals chart, small on the wire. */
export const MAX_HEAT_POINTS = 500;

type Yield = { inspected: number; acceptedFirst: number; ratio: number | null };

export type HeatPoint = {
  at: string;
  kJPerMm: number;
  /** inside the heat-input limit of the WPS revision the pass was welded to (true when it sets none) */
  within: boolean;
  limitKJPerMm: number | null;
  jobNumber: string;
  jointId: string;
  passNumber: number;
  round: number;
  welderName: string;
};

export type QualityFigures = {
  range: { from: string | null; to: string | null };
  scope: "shop" | "welder";
  firstPassYield: {
    overall: Yield;
    byWelder: (Yield & { welderId: string; welderName: string })[];
    byWps: (Yield & { wpsId: string | null; reference: string })[];
  };
  defects: { criterion: string; count: number }[];
  heatInput: { wpsId: string | null; reference: string; total: number; points: HeatPoint[] }[];
  nonconformances: {
    byDisposition: { disposition: string; count: number; medianDays: number | null; maxDays: number | null }[];
    oldestOpen: { jobId: string; jobNumber: string; number: number; description: string; raisedAt: string; days: number }[];
  };
  inspectionWait: {
    inspected: number;
    medianHours: number | null;
    p90Hours: number | null;
    maxHours: number | null;
    waitingNow: number;
    oldestWaitingHours: number | null;
  };
  jobs: { state: string; count: number; medianDays: number | null; maxDays: number | null }[];
  qualifications: {
    lapsed: number;
    within30: number;
    within60: number;
    within90: number;
    lapsing: { welderId: string; welderName: string; process: string; expiresOn: string; daysLeft: number }[];
  };
};

export const ratio = (acceptedFirst: number, inspected: number): number | null => (inspected > 0 ? acceptedFirst / inspected : null);
