// The zod schemas are imported from "./schemas" directly, so screens that only compute never ship zod.
export * from "./dew-point";
export * from "./dft";
