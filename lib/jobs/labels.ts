// Words and shapes for job states, step kinds, meanings and dispositions. Pure: shared by server and browser.
// Step kind names and glyphs are lib/procedures/labels (KIND_LABELS, KIND_GLYPHS).

export const JOB_STATE_VALUES = ["planned", "in_progress", "on_hold", "ready_for_release", "released", "void"] as const;
export type JobStateName = (typeof JOB_STATE_VALUES)[number];

export type JointState = "welding" | "awaiting_inspection" | "repair" | "accepted";

export type Tone = "pass" | "fail" | "warn" | "info" | "idle";

export const JOB_STATE_LABELS: Record<JobStateName, { label: string; tone: Tone }> = {
  planned: { label: "Planned", tone: "idle" },
  in_progress: { label: "In progress", tone: "info" },
  on_hold: { label: "On hold", tone: "warn" },
  ready_for_release: { label: "Ready for release", tone: "pass" },
  released: { label: "Released", tone: "pass" },
  void: { label: "Void", tone: "fail" },
};


export const MEANING_LABELS = {
  performed: "Performed",
  inspected: "Inspected",
  dispositioned: "Dispositioned",
  released: "Released",
} as const;

export const DISPOSITION_VALUES = ["rework", "repair", "use_as_is", "scrap"] as const;
export type DispositionName = (typeof DISPOSITION_VALUES)[number];

export const DISPOSITION_LABELS: Record<DispositionName, { label: string; explain: string }> = {
  rework: { label: "Rework", explain: "Redo the work to the procedure; the step is measured and signed again." },
  repair: { label: "Repair", explain: "Repair by an approved method; the step is measured and signed again." },
  use_as_is: { label: "Use as is", explain: "Accept the part as it is; the step may be signed with the value recorded." },
  scrap: { label: "Scrap", explain: "Scrap the part and fit a new one; the step is done and signed again." },
};

// What the welder confirms for each hazard of a caution step (the short names are lib/procedures HAZARD_LABELS).
export const HAZARD_CONFIRMATIONS: Record<string, string> = {
  ppe: "Protective equipment on: helmet, gloves, flame-resistant clothing, eye and hearing protection",
  ventilation: "Fumes extracted or the bay ventilated",
  "fire-watch": "Fire watch kept during hot work and for 30 minutes after; extinguisher in reach",
  "coatings-removed": "Paint, undercoat, grease and fuel lines cleared from the heat zone",
  "vehicle-supported": "Vehicle on rated stands on firm ground, wheels chocked",
  "battery-disconnected": "Battery disconnected before welding on the vehicle",
  other: "The other hazards named in the instructions",
};
