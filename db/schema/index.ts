export * from "./auth";
export * from "./shops";
export * from "./procedures";
export * from "./jobs";
export * from "./welding";
export * from "./records";
