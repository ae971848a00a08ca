// Words for visual inspections, shared by the job page, the verify page, the traveller and the CSV.
// Pure (no server imports) so browser components can use them too.
import type { VisualItem } from "@/lib/welding";

const ITEM_LABELS: Record<VisualItem, string> = {
  cracks: "cracks",
  fusion: "fusion",
  craters: "craters",
  profile: "weld profile",
  undersize: "undersize",
  undercut: "undercut",
  porosity: "porosity",
  "arc-strikes": "arc strikes",
  spatter: "spatter",
};

export const itemLabel = (i: string) => ITEM_LABELS[i as VisualItem] ?? i;

export const MATERIAL_KIND_LABELS = { base: "Base metal", filler: "Filler metal", other: "Other" } as const;
