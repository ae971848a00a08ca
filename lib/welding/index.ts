// Pure welding domain module: no I/O, no Node-only APIs; safe to import from server and browser.
// The zod schemas are imported from "./schema" directly, so screens that only compute never ship zod.
export * from "./units";
export * from "./processes";
export * from "./heat-input";
export * from "./wps-check";
export * from "./preheat";
export * from "./fillet-weld";
export * from "./visual-acceptance";
export * from "./continuity";
export * from "./bolt-torque";
