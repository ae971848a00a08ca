// What must be true before a draft is published (blockers), and what a lead should look at (warnings).
import type { VersionBody } from "./hash";
import { KIND_LABELS } from "./labels";

type ReadinessIssue = { stepKey?: string; sectionKey?: string; message: string };
type Readiness = { blockers: ReadinessIssue[]; warnings: ReadinessIssue[] };

export function publishReadiness(v: VersionBody): Readiness {
  const blockers: ReadinessIssue[] = [];
  const warnings: ReadinessIssue[] = [];
  const steps = v.content.sections.flatMap((s) => s.steps.map((step) => ({ step, section: s })));
  if (steps.length === 0) blockers.push({ message: "A procedure needs at least one step before it is published." });
  for (const s of v.content.sections) {
    if (s.steps.length === 0) blockers.push({ sectionKey: s.key, message: `Section “${s.title}” has no steps: add steps or delete it.` });
  }

  let cautionSeen = false;
  let firstWeldWithoutCaution: string | null = null;
  steps.forEach(({ step }, i) => {
    if (step.kind === "caution") cautionSeen = true;
    if (step.kind === "weld" && !cautionSeen && !firstWeldWithoutCaution) firstWeldWithoutCaution = step.key;
    if (step.kind === "hold" && step.signedBy !== "inspector") {
      blockers.push({ stepKey: step.key, message: `Hold point “${step.title}” must be signed by an inspector.` });
    }
    if (step.kind === "photo" && (!step.photos.required || step.photos.min < 1)) {
      blockers.push({ stepKey: step.key, message: `Photo step “${step.title}” must require at least one photo.` });
    }
    if (step.kind === "weld") {
      const holdAfter = steps.slice(i + 1).some((s) => s.step.kind === "hold");
      if (!holdAfter) warnings.push({ stepKey: step.key, message: `No hold point after weld ${step.jointId}: nobody inspects it before the job goes on.` });
    }
  });
  if (firstWeldWithoutCaution) {
    blockers.push({
      stepKey: firstWeldWithoutCaution,
      message: "Hot work needs a caution step before the first weld (PPE, ventilation, fire watch, coatings removed, vehicle on stands).",
    });
  }
  const hasWeld = steps.some((s) => s.step.kind === "weld");
  if (hasWeld && !steps.some((s) => s.step.kind === "caution" && s.step.hazards.includes("fire-watch"))) {
    warnings.push({ message: "There is welding but no caution names a fire watch after hot work." });
  }
  if (!steps.some((s) => s.step.kind === "caution")) warnings.push({ message: `No ${KIND_LABELS.caution.toLowerCase()} step: most shop procedures carry at least one.` });
  if (!v.code.trim()) warnings.push({ message: "No code or standard is named for this procedure." });
  return { blockers, warnings };
}
