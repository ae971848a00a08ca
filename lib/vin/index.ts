export * from "./check-digit";
