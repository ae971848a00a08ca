import { KIND_GLYPHS, KIND_LABELS } from "@/lib/procedures/labels";
import type { StepKind } from "@/lib/procedures/schema";

// Kind by glyph and word; cautions and hold points stand out by a heavier frame, not by colour alone.
export function KindBadge({ kind }: { kind: StepKind }) {
  const strong = kind === "caution" || kind === "hold";
  return (
    <span
      className={`inline-flex shrink-0 items-center gap-1 rounded px-1.5 py-0.5 text-xs font-bold uppercase tracking-wide ${
        strong ? "border-2 border-graphite-900 bg-primer-200 text-graphite-950" : "border border-graphite-400 bg-graphite-50 text-graphite-800"
      }`}
    >
      <span aria-hidden="true">{KIND_GLYPHS[kind]}</span>
      {KIND_LABELS[kind]}
    </span>
  );
}
