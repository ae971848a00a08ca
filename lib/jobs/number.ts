// Job numbers: "GJ-2026-0042" — shop-local, counted per calendar year, at least four digits.
export const JOB_NUMBER_PREFIX = "GJ";

export function formatJobNumber(year: number, seq: number): string {
  return `${JOB_NUMBER_PREFIX}-${year}-${String(seq).padStart(4, "0")}`;
}

export const JOB_NUMBER_RE = /^GJ-(\d{4})-(\d{4,})$/;
