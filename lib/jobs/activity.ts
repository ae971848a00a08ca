// A job's activity in words (who is shown beside it). Pure.
import { DISPOSITION_LABELS, JOB_STATE_LABELS, MEANING_LABELS, type DispositionName, type JobStateName } from "./labels";

export function describeJobActivity(action: string, detail: Record<string, unknown>, stepTitle: string | null): string {
  const step = stepTitle ? `“${stepTitle}”` : "a step";
  const d = detail as Record<string, string | number | boolean | null | undefined>;
  switch (action) {
    case "job.created":
      return `created the job from ${String(d.procedure ?? "a procedure")} v${String(d.version ?? "?")} (${String(d.steps ?? "?")} steps)${d.vinWarning ? " — VIN warning noted" : ""}`;
    case "job.updated":
      return `changed the job's details (${Array.isArray(detail.fields) ? (detail.fields as string[]).join(", ") : ""})`;
    case "job.state":
      return `moved the job from ${JOB_STATE_LABELS[d.from as JobStateName]?.label ?? d.from} to ${JOB_STATE_LABELS[d.to as JobStateName]?.label ?? d.to}`;
    case "job.released":
      return "released the job (signed)";
    case "job.voided":
      return `voided the job: ${String(d.reason ?? "")}`;
    case "step.value_saved":
      return `saved a value on ${step}`;
    case "step.signed":
      return `signed ${step} as ${(MEANING_LABELS[d.meaning as keyof typeof MEANING_LABELS] ?? String(d.meaning)).toLowerCase()}${Array.isArray(detail.acceptedUnder) && (detail.acceptedUnder as number[]).length ? ` under NC-${(detail.acceptedUnder as number[]).join(", NC-")}` : ""}`;
    case "step.amended":
      return `amended ${step}: ${String(d.reason ?? "")}`;
    case "sign.refused":
      return `was refused signing ${step}: ${String(d.reason ?? "")}${d.locked ? " (signing now locked)" : ""}`;
    case "photo.added":
      return `added a photo${stepTitle ? ` to ${step}` : ""}`;
    case "photo.removed":
      return `took a photo off ${step}`;
    case "weld_pass.recorded": {
      const round = typeof d.round === "number" && d.round > 1 ? `, repair round ${d.round}` : "";
      const wps = d.wps ? ` to ${String(d.wps)}` : "";
      const flag = d.outOfRange ? `, outside the WPS: ${Array.isArray(detail.findings) ? (detail.findings as string[]).join(" ") : ""}` : "";
      return `recorded pass ${String(d.passNumber ?? "")} of ${String(d.joint ?? "a joint")}${wps}${round} (${typeof d.heatInputKJPerMm === "number" ? d.heatInputKJPerMm.toFixed(2) : "?"} kJ/mm)${flag}`;
    }
    case "weld_pass.overridden":
      return `accepted pass ${String(d.passNumber ?? "")} of ${String(d.joint ?? "a joint")} as welded, outside its WPS: ${String(d.reason ?? "")}`;
    case "weld.accepted":
      return `inspected ${String(d.joint ?? "a joint")}${typeof d.round === "number" && d.round > 1 ? ` (repair round ${d.round})` : ""} and accepted it (signed)`;
    case "weld.rejected":
      return `inspected ${String(d.joint ?? "a joint")}${typeof d.round === "number" && d.round > 1 ? ` (repair round ${d.round})` : ""} and rejected it for repair${Array.isArray(detail.rejected) && (detail.rejected as string[]).length ? `: ${(detail.rejected as string[]).join(", ")}` : ""}${d.notes ? ` — ${String(d.notes)}` : ""}`;
    case "material.recorded":
      return `recorded ${String(d.description ?? "a material")}, heat/lot ${String(d.heatNumber ?? "")}`;
    case "material.corrected":
      return `corrected a material entry to ${String(d.description ?? "")}, heat/lot ${String(d.heatNumber ?? "")}: ${String(d.reason ?? "")}`;
    case "material.withdrawn":
      return `withdrew the material entry ${String(d.description ?? "")}: ${String(d.reason ?? "")}`;
    case "weld_pass.struck":
      return `struck out pass ${String(d.passNumber ?? "")} on ${step}`;
    case "nc.raised":
      return `raised NC-${String(d.number ?? "")} on ${step}: ${String(d.description ?? "")}`;
    case "nc.dispositioned":
      return `dispositioned NC-${String(d.number ?? "")}: ${DISPOSITION_LABELS[d.disposition as DispositionName]?.label ?? d.disposition}${d.notes ? ` — ${String(d.notes)}` : ""}`;
    default:
      return action;
  }
}
