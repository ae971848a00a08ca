// Words for visual inspections, shared by the job page, the verify page, the traveller and the CSV.
// Pure (no server imports) so browser components can use them too.
import type { VisualCriteria, VisualItem } from "@/lib/welding";

export const CRITERIA_LABELS: Record<VisualCriteria, string> = {
  "aws-d1.1-static": "AWS D1.1:2020 Table 8.1, statically loaded nontubular",
  "iso5817-B": "ISO 5817:2014 quality level B",
  "iso5817-C": "ISO 5817:2014 quality level C",
  "iso5817-D": "ISO 5817:2014 quality level D",
};

export const criteriaLabel = (c: string) => CRITERIA_LABELS[c as VisualCriteria] ?? c;

export const ITEM_LABELS: Record<VisualItem, string> = {
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
