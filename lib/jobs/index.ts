// Pure job logic, safe in the browser. Hashing (node:crypto) is in ./hash, imported by the server only.
export * from "./labels";
export * from "./units";
export * from "./tolerance";
export * from "./values";
export * from "./geometry";
export * from "./readiness";
export * from "./state";
export * from "./content";
export * from "./number";
export * from "./vin";
export * from "./schemas";
export type * from "./record";
export * from "./roles";
export * from "./assemble";
export * from "./summary";
export * from "./activity";
