// Words for step kinds, hazards and fields as a shop reads them. Pure: used by screens, the diff and files.
import type { HAZARDS, StepKind } from "./schema";

export const KIND_LABELS: Record<StepKind, string> = {
  check: "Check",
  measure: "Measure",
  photo: "Photo",
  caution: "Caution",
  weld: "Weld",
  hold: "Hold point",
  torque: "Torque",
  coating: "Coating",
  geometry: "Geometry",
};

// A glyph per kind so an outline reads without colour.
export const KIND_GLYPHS: Record<StepKind, string> = {
  check: "☐",
  measure: "⟷",
  photo: "▣",
  caution: "△",
  weld: "⌒",
  hold: "‖",
  torque: "↻",
  coating: "▤",
  geometry: "⊾",
};

export const KIND_HINTS: Record<StepKind, string> = {
  check: "Something the signer confirms was done or is so.",
  measure: "A value read off a gauge, checked against a nominal and tolerance.",
  photo: "Photos that must be taken before the step is signed.",
  caution: "A safety warning the signer must acknowledge before going on.",
  weld: "One weld joint with its size, length, position, process, WPS and preheat.",
  hold: "Inspection hold point: later steps stay locked until an inspector signs it.",
  torque: "A fastener tightened to a specified torque.",
  coating: "A coat applied under checked conditions to a specified DFT range.",
  geometry: "Capture of the steering-link points (lateral link, drag link, axle centre).",
};

export const HAZARD_LABELS: Record<(typeof HAZARDS)[number], string> = {
  ppe: "PPE",
  ventilation: "Ventilation and fume",
  "fire-watch": "Fire watch",
  "coatings-removed": "Coatings removed before heat",
  "vehicle-supported": "Vehicle on stands",
  "battery-disconnected": "Battery disconnected",
  other: "Other",
};

export const SIGNER_LABELS = { welder: "Welder", inspector: "Inspector", lead: "Lead" } as const;

export const QUANTITY_LABELS = {
  length: "Length",
  angle: "Angle",
  temperature: "Temperature",
  thickness: "Coating thickness",
  torque: "Torque",
  pressure: "Pressure",
} as const;

export const QUANTITY_SYMBOLS = { length: "mm", angle: "°", temperature: "°C", thickness: "µm", torque: "N·m", pressure: "kPa" } as const;

export const TOLERANCE_LABELS = { plusMinus: "± about the nominal", range: "Between min and max", min: "At least", max: "At most" } as const;

export const TORQUE_UNIT_LABELS = { N_m: "N·m", lbf_ft: "lbf·ft" } as const;

export const CAPTURE_LABELS = { before: "Before the work", after: "After the work", both: "Before and after" } as const;

export const VERSION_STATUS_LABELS = { draft: "Draft", published: "Published", retired: "Retired" } as const;
export type VersionStatus = keyof typeof VERSION_STATUS_LABELS;

// Field paths (as the diff flattens a step) to labels.
export const FIELD_LABELS: Record<string, string> = {
  key: "Key",
  kind: "Kind",
  title: "Title",
  instructions: "Instructions",
  signedBy: "Signed by",
  "photos.required": "Photo required",
  "photos.min": "Photos (at least)",
  quantity: "Quantity",
  nominal: "Nominal",
  "tolerance.type": "Tolerance",
  "tolerance.plus": "Tolerance +",
  "tolerance.minus": "Tolerance −",
  "tolerance.min": "Min",
  "tolerance.max": "Max",
  hazards: "Hazards",
  acknowledgement: "Acknowledgement",
  jointId: "Joint",
  jointType: "Joint type",
  sizeMm: "Size (mm)",
  lengthMm: "Length (mm)",
  position: "Position",
  process: "Process",
  wpsRef: "WPS",
  filler: "Filler metal",
  minPreheatC: "Min preheat (°C)",
  inspection: "Inspection",
  fastener: "Fastener",
  torqueNm: "Torque (N·m)",
  torqueUnit: "Maker's unit",
  tolerancePct: "Torque tolerance (± %)",
  pattern: "Pattern",
  surfacePrep: "Surface preparation",
  product: "Product",
  dewPointMarginC: "Dew-point margin (°C)",
  dftMinUm: "DFT min (µm)",
  dftMaxUm: "DFT max (µm)",
  capture: "Capture",
  scope: "Scope",
  code: "Code or standard",
};

export function fieldLabel(path: string): string {
  return FIELD_LABELS[path] ?? path;
}
