// How a weld map's markers and seams are drawn, shared by the screen and the printed traveller. No schemas here:
// the runner loads this, and the checks that come with lib/weld-map's schemas stay on the server.

/** A point on an image, as fractions of its width and height (0–1). */
export type MapPoint = { x: number; y: number };

// ── Marker looks: state by word and by shape, never by colour alone ─────────────────────────────────────

export type MarkerState = "welding" | "awaiting_inspection" | "repair" | "accepted" | "planned";
export const MARKER_LOOK: Record<MarkerState, { word: string; shape: "circle" | "diamond" | "triangle" | "square" | "ring" }> = {
  planned: { word: "not started", shape: "ring" },
  welding: { word: "welding", shape: "circle" },
  awaiting_inspection: { word: "waiting for inspection", shape: "diamond" },
  repair: { word: "sent back", shape: "triangle" },
  accepted: { word: "accepted", shape: "square" },
};

/** SVG path of a marker's shape centred on (cx, cy) with "radius" r, so the screen and the print draw the same shapes. */
export function markerShapePath(shape: (typeof MARKER_LOOK)[MarkerState]["shape"], cx: number, cy: number, r: number): string {
  const f = (n: number) => Number(n.toFixed(2));
  switch (shape) {
    case "diamond":
      return `M${f(cx)} ${f(cy - r * 1.2)} L${f(cx + r * 1.2)} ${f(cy)} L${f(cx)} ${f(cy + r * 1.2)} L${f(cx - r * 1.2)} ${f(cy)} Z`;
    case "triangle":
      return `M${f(cx)} ${f(cy - r * 1.25)} L${f(cx + r * 1.15)} ${f(cy + r * 0.85)} L${f(cx - r * 1.15)} ${f(cy + r * 0.85)} Z`;
    case "square":
      return `M${f(cx - r)} ${f(cy - r)} L${f(cx + r)} ${f(cy - r)} L${f(cx + r)} ${f(cy + r)} L${f(cx - r)} ${f(cy + r)} Z`;
    default: {
      // A circle as two arcs (react-pdf and browsers both draw arcs in paths).
      return `M${f(cx - r)} ${f(cy)} A${f(r)} ${f(r)} 0 1 0 ${f(cx + r)} ${f(cy)} A${f(r)} ${f(r)} 0 1 0 ${f(cx - r)} ${f(cy)} Z`;
    }
  }
}

/** A seam line as an SVG path over an image w × h. */
export function seamPath(points: readonly MapPoint[], w: number, h: number): string {
  return points.map((p, i) => `${i ? "L" : "M"}${Number((p.x * w).toFixed(2))} ${Number((p.y * h).toFixed(2))}`).join(" ");
}

/** A tap at client (px, py) inside a box of size w × h, as image-relative coordinates clamped to the image. */
export function relativePoint(px: number, py: number, w: number, h: number): MapPoint {
  const clamp = (v: number) => Math.min(1, Math.max(0, v));
  const r = (v: number) => Math.round(clamp(v) * 10_000) / 10_000;
  return { x: r(w > 0 ? px / w : 0), y: r(h > 0 ? py / h : 0) };
}
