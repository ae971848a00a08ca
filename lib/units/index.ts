export * from "./factors";
export * from "./quantities";
export * from "./format";
export * from "./parse";
