// Who signs a step, in which role and with which meaning. The step's `signedBy` names the role; a hold
// point is always an inspector's. A lead may perform a welder's step (leads are often hands-on).
import type { Step } from "@/lib/procedures/schema";

export type SigningRole = { role: "welder" | "inspector" | "lead"; meaning: "performed" | "inspected" };

export function signingRole(spec: Pick<Step, "kind" | "signedBy">, roles: readonly string[]): SigningRole | { refuse: string } {
  if (spec.kind === "hold" || spec.signedBy === "inspector") {
    return roles.includes("inspector")
      ? { role: "inspector", meaning: "inspected" }
      : { refuse: spec.kind === "hold" ? "Only an inspector signs a hold point." : "Only an inspector signs this step." };
  }
  if (spec.signedBy === "lead") {
    return roles.includes("lead") ? { role: "lead", meaning: "performed" } : { refuse: "Only a lead signs this step." };
  }
  if (roles.includes("welder")) return { role: "welder", meaning: "performed" };
  if (roles.includes("lead")) return { role: "lead", meaning: "performed" };
  return { refuse: "Only a welder or a lead works this step." };
}

export function meaningOf(spec: Pick<Step, "kind" | "signedBy">): "performed" | "inspected" {
  return spec.kind === "hold" || spec.signedBy === "inspector" ? "inspected" : "performed";
}
