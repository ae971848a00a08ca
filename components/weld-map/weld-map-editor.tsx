"use client";
// Placing weld joints on a map by tapping: pick a joint, tap where it is. "Seam line" adds points along the
// seam with each tap. On a desktop a marker can also be dragged with the mouse; a tablet never needs to.
import { useRef, useState } from "react";
import type { MapPoint } from "@/lib/weld-map";
import { WeldMapView, type MapImage, type MapMarker } from "./weld-map-view";

export type EditorSave = (joints: MapMarker[]) => Promise<string | null>;

export function WeldMapEditor({ images, jointIds, initial, onSave, saveLabel = "Save weld map" }: { images: MapImage[]; jointIds: string[]; initial: MapMarker[]; onSave: EditorSave; saveLabel?: string }) {
  const [joints, setJoints] = useState<MapMarker[]>(initial);
  const [selected, setSelected] = useState<string | undefined>(jointIds.find((id) => !initial.some((j) => j.jointId === id)) ?? jointIds[0]);
  const [seam, setSeam] = useState(false);
  const [message, setMessage] = useState<{ ok: boolean; text: string } | null>(null);
  const [busy, setBusy] = useState(false);
  const dragging = useRef<string | null>(null);

  const place = (imageId: string, p: MapPoint) => {
    if (!selected) return;
    if (dragging.current) return;
    setMessage(null);
    setJoints((all) => {
      const current = all.find((j) => j.jointId === selected);
      const rest = all.filter((j) => j.jointId !== selected);
      if (seam && current && current.imageId === imageId) {
        const path = [...(current.path ?? [{ x: current.x, y: current.y }]), p].slice(-24);
        return [...rest, { ...current, path }];
      }
      return [...rest, { jointId: selected, imageId, x: p.x, y: p.y }];
    });
    if (!seam) {
      // After placing one, move on to the next joint not yet placed, so a map is a row of taps.
      const placed = new Set([...joints.map((j) => j.jointId), selected]);
      const next = jointIds.find((id) => !placed.has(id));
      if (next) setSelected(next);
    }
  };

  const onMarkerDown = (jointId: string, e: React.PointerEvent) => {
    if (e.pointerType !== "mouse") return;
    const svg = (e.currentTarget as SVGElement).ownerSVGElement;
    const box = svg?.getBoundingClientRect();
    if (!box) return;
    e.preventDefault();
    dragging.current = jointId;
    const move = (ev: PointerEvent) => {
      const x = Math.min(1, Math.max(0, (ev.clientX - box.left) / box.width));
      const y = Math.min(1, Math.max(0, (ev.clientY - box.top) / box.height));
      setJoints((all) => all.map((j) => (j.jointId === jointId ? { ...j, x: Math.round(x * 10_000) / 10_000, y: Math.round(y * 10_000) / 10_000 } : j)));
    };
    const up = () => {
      window.removeEventListener("pointermove", move);
      window.removeEventListener("pointerup", up);
      // The click that follows the drag must not place the selected joint.
      setTimeout(() => (dragging.current = null), 0);
    };
    window.addEventListener("pointermove", move);
    window.addEventListener("pointerup", up);
  };

  const save = async () => {
    setBusy(true);
    setMessage(null);
    const problem = await onSave(joints);
    setBusy(false);
    setMessage(problem ? { ok: false, text: problem } : { ok: true, text: "Saved." });
  };

  const unplaced = jointIds.filter((id) => !joints.some((j) => j.jointId === id));
  return (
    <div className="space-y-3" data-testid="weld-map-editor">
      <fieldset>
        <legend className="mb-1 font-semibold">Joint to place</legend>
        <div className="flex flex-wrap gap-2">
          {jointIds.map((id) => {
            const placed = joints.some((j) => j.jointId === id);
            return (
              <button
                key={id}
                type="button"
                aria-pressed={selected === id}
                onClick={() => setSelected(id)}
                className={`min-h-12 min-w-16 rounded border-2 px-3 font-bold ${selected === id ? "border-graphite-950 bg-primer-300" : "border-graphite-400 bg-white"}`}
                data-testid={`place-${id}`}
              >
                <span className="figures">{id}</span> <span className="text-sm font-normal">{placed ? "✓ placed" : "○ not placed"}</span>
              </button>
            );
          })}
        </div>
      </fieldset>
      <div className="flex flex-wrap items-center gap-2">
        <button type="button" aria-pressed={seam} onClick={() => setSeam((v) => !v)} className={`min-h-12 rounded border-2 px-3 ${seam ? "border-graphite-950 bg-primer-100 font-bold" : "border-graphite-400 bg-white"}`}>
          {seam ? "◆ Seam line: each tap adds a point" : "Seam line off"}
        </button>
        <button
          type="button"
          className="min-h-12 rounded border-2 border-graphite-400 bg-white px-3"
          disabled={!selected || !joints.some((j) => j.jointId === selected)}
          onClick={() => setJoints((all) => all.filter((j) => j.jointId !== selected))}
        >
          Take {selected ?? "the joint"} off the map
        </button>
      </div>
      <p className="text-sm text-graphite-700" aria-live="polite">
        {selected ? `Tap the image where ${selected} is${seam ? "; each further tap extends its seam line" : ""}.` : "Choose a joint."} {unplaced.length ? `Not placed yet: ${unplaced.join(", ")}.` : "Every joint is placed."}
      </p>
      <WeldMapView images={images} joints={joints} highlight={selected} highlightWord="placing now" onTap={place} onMarkerDown={onMarkerDown} testId="weld-map-edit" />
      <div className="flex items-center gap-3">
        <button type="button" onClick={save} disabled={busy} className="min-h-12 rounded bg-graphite-950 px-5 font-bold text-white" data-testid="weld-map-save">
          {busy ? "Saving…" : saveLabel}
        </button>
        <span className={message?.ok ? "font-semibold text-graphite-950" : "field-error"} data-testid="weld-map-message" role="status">
          {message ? `${message.ok ? "✓" : "⚠"} ${message.text}` : null}
        </span>
      </div>
    </div>
  );
}
