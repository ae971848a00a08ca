export * from "./canonical-json";
export * from "./chain-core";
export * from "./sha256";
export * from "./chain";
