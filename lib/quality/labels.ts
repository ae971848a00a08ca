// Words for the quality figures. Pure: server, browser and CSV.
import { DISPOSITION_LABELS, JOB_STATE_LABELS, type DispositionName, type JobStateName } from "@/lib/jobs/labels";

/** Visual inspection items (lib/welding VisualItem) as an inspector names them. */
const DEFECT_LABELS: Record<string, string> = {
  cracks: "Cracks",
  fusion: "Incomplete fusion",
  craters: "Unfilled craters",
  profile: "Weld profile",
  undersize: "Undersize",
  undercut: "Undercut",
  porosity: "Porosity",
  "arc-strikes": "Arc strikes",
  spatter: "Spatter",
};

export const defectLabel = (c: string): string => DEFECT_LABELS[c] ?? c;

export function dispositionLabel(d: string): string {
  if (d === "open") return "Open (no disposition yet)";
  return DISPOSITION_LABELS[d as DispositionName]?.label ?? d;
}

export const jobStateLabel = (s: string): string => JOB_STATE_LABELS[s as JobStateName]?.label ?? s;

/** "83 %" with the counts behind it kept beside, never instead. */
export function percent(ratio: number | null): string {
  return ratio === null ? "–" : `${Math.round(ratio * 1000) / 10} %`;
}
