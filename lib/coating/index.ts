export * from "./dew-point";
export * from "./dft";
export * from "./schemas";
