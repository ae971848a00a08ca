// A weld map drawn on screen: each image once, each joint's marker over it (shape by state, labelled with
// its joint id and state word, so colour is never the only sign). Tapping the image reports where, in
// image-relative coordinates, for the editors.
import { markerShapePath, MARKER_LOOK, relativePoint, seamPath, type MapPoint, type MarkerState } from "@/lib/weld-map/marker";

export type MapImage = { id: string; url: string; width: number; height: number; label?: string };
export type MapMarker = { jointId: string; imageId: string; x: number; y: number; path?: MapPoint[] | undefined };

const SHAPE_CHAR: Record<MarkerState, string> = { planned: "○", welding: "●", awaiting_inspection: "◆", repair: "▲", accepted: "■" };

export function markerWord(state: MarkerState): string {
  return MARKER_LOOK[state].word;
}

export function WeldMapView({
  images,
  joints,
  states = {},
  highlight,
  onTap,
  onMarkerDown,
  testId = "weld-map",
  maxHeight,
  highlightWord = "this step",
}: {
  images: MapImage[];
  joints: MapMarker[];
  states?: Record<string, MarkerState>;
  highlight?: string | undefined;
  onTap?: (imageId: string, p: MapPoint) => void;
  onMarkerDown?: (jointId: string, e: React.PointerEvent) => void;
  testId?: string;
  /** a CSS length the drawn image may not exceed in height (e.g. "45vh"), so a map beside a form leaves room for it */
  maxHeight?: string;
  /** what the highlighted joint's entry in the list says about it */
  highlightWord?: string;
}) {
  return (
    <div className="space-y-3" data-testid={testId}>
      {images.map((img, n) => {
        const on = joints.filter((j) => j.imageId === img.id);
        const r = Math.max(img.width, img.height) * 0.016;
        const font = r * 1.9;
        return (
          <figure key={img.id} className="rounded border border-graphite-300 bg-white p-2">
            <div
              className={`relative w-full select-none ${onTap ? "cursor-crosshair touch-manipulation" : ""}`}
              style={{ aspectRatio: `${img.width} / ${img.height}`, ...(maxHeight ? { maxWidth: `calc(${maxHeight} * ${img.width} / ${img.height})` } : {}) }}
              data-testid={`${testId}-image-${n + 1}`}
              onClick={
                onTap
                  ? (e) => {
                      const box = e.currentTarget.getBoundingClientRect();
                      onTap(img.id, relativePoint(e.clientX - box.left, e.clientY - box.top, box.width, box.height));
                    }
                  : undefined
              }
            >
              {/* eslint-disable-next-line @next/next/no-img-element -- a stored image of this shop, served by the API with its own cache headers */}
              <img src={img.url} alt={img.label ? `Weld map: ${img.label}` : `Weld map image ${n + 1}`} className="absolute inset-0 h-full w-full" draggable={false} />
              <svg viewBox={`0 0 ${img.width} ${img.height}`} className="absolute inset-0 h-full w-full" aria-hidden="true">
                {on.map((j) => (j.path ? <path key={`s-${j.jointId}`} d={seamPath(j.path, img.width, img.height)} fill="none" stroke="#171b1a" strokeWidth={r * 0.45} strokeDasharray={`${r} ${r * 0.6}`} /> : null))}
                {on.map((j) => {
                  const state = states[j.jointId] ?? "planned";
                  const cx = j.x * img.width;
                  const cy = j.y * img.height;
                  const lit = highlight === j.jointId;
                  return (
                    <g key={j.jointId} onPointerDown={onMarkerDown ? (e) => onMarkerDown(j.jointId, e) : undefined}>
                      {lit ? <circle cx={cx} cy={cy} r={r * 2.3} fill="none" stroke="#aec22b" strokeWidth={r * 0.7} /> : null}
                      <path d={markerShapePath(MARKER_LOOK[state].shape, cx, cy, lit ? r * 1.35 : r)} fill={state === "accepted" ? "#171b1a" : "#ffffff"} stroke="#171b1a" strokeWidth={r * 0.35} />
                      <text x={cx + r * 1.8} y={cy - r * 1.1} fontSize={font} fontWeight={700} fill="#171b1a" stroke="#ffffff" strokeWidth={font * 0.18} paintOrder="stroke">
                        {j.jointId}
                      </text>
                    </g>
                  );
                })}
              </svg>
            </div>
            {img.label ? <figcaption className="mt-1 text-sm text-graphite-700">{img.label}</figcaption> : null}
          </figure>
        );
      })}
      <ul className="flex flex-wrap gap-2 text-sm" aria-label="Weld joints on the map">
        {[...joints]
          .sort((a, b) => Number(a.jointId.slice(1)) - Number(b.jointId.slice(1)))
          .map((j) => {
            const state = states[j.jointId] ?? "planned";
            return (
              <li
                key={j.jointId}
                data-testid={`${testId}-joint-${j.jointId}`}
                className={`inline-flex items-center gap-1 rounded border px-2 py-1 ${highlight === j.jointId ? "border-graphite-950 bg-primer-100 font-bold" : "border-graphite-300 bg-white"}`}
              >
                <span aria-hidden="true">{SHAPE_CHAR[state]}</span>
                <span className="figures font-semibold">{j.jointId}</span>
                <span>{markerWord(state)}</span>
                {highlight === j.jointId ? <span className="font-normal">({highlightWord})</span> : null}
              </li>
            );
          })}
      </ul>
    </div>
  );
}

/** Marker states of a job's joints from its record (welding, waiting for inspection, sent back, accepted). */
export function jointStates(steps: readonly { spec: { kind: string; jointId?: string }; joint: { state: MarkerState } | null }[]): Record<string, MarkerState> {
  const out: Record<string, MarkerState> = {};
  for (const s of steps) if (s.spec.kind === "weld" && s.spec.jointId) out[s.spec.jointId] = s.joint?.state ?? "welding";
  return out;
}
