/** Browser-safe part of the seal module: no Node APIs; bring your own SHA-256 to the *With functions. */
export * from "./canonical-json";
export * from "./chain-core";
