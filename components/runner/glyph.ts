import { KIND_GLYPHS } from "@/lib/procedures/labels";
import type { StepKind } from "@/lib/procedures/schema";

// The text faces have no pause sign (U+23F8), so a tablet falls back to an emoji; a double bar reads the same.
export function kindGlyph(kind: StepKind): string {
  return kind === "hold" ? "‖" : KIND_GLYPHS[kind];
}
