"use client";
// The draft's weld map: add an image (upload a photo or drawing, or make a plain drawing here), then place
// each weld joint on it by tapping.
import { useRouter } from "next/navigation";
import { useState } from "react";
import { WeldMapEditor, type EditorSave } from "@/components/weld-map/weld-map-editor";
import type { MapImage, MapMarker } from "@/components/weld-map/weld-map-view";
import { axleBracketDrawing } from "@/lib/weld-map";

async function problemOf(res: Response): Promise<string | null> {
  if (res.ok) return null;
  const body = (await res.json().catch(() => null)) as { error?: { message?: string } } | null;
  return body?.error?.message ?? `The server answered ${res.status}.`;
}

export function ProcedureMapEditor({ base, images, jointIds, joints }: { base: string; images: MapImage[]; jointIds: string[]; joints: MapMarker[] }) {
  const router = useRouter();
  const [problem, setProblem] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  const add = async (init: RequestInit) => {
    setBusy(true);
    setProblem(null);
    const res = await fetch(`${base}/weld-map/images`, { method: "POST", credentials: "same-origin", ...init });
    setBusy(false);
    const p = await problemOf(res);
    if (p) setProblem(p);
    else router.refresh();
  };

  const save: EditorSave = async (next) => {
    const res = await fetch(`${base}/weld-map`, {
      method: "PUT",
      credentials: "same-origin",
      headers: { "content-type": "application/json" },
      body: JSON.stringify({ imageIds: images.map((i) => i.id), joints: next }),
    });
    const p = await problemOf(res);
    if (!p) router.refresh();
    return p;
  };

  return (
    <div className="space-y-4">
      <section className="rounded border border-graphite-300 bg-graphite-50 p-3" aria-labelledby="add-image-h">
        <h2 id="add-image-h" className="font-semibold">Add an image</h2>
        <p className="text-sm text-graphite-700">A photo or drawing of the part as PNG or JPEG, a PDF drawing (its first page is used), or a plain drawing made here. SVG files are not taken.</p>
        <div className="mt-2 flex flex-wrap items-center gap-3">
          <label className="inline-flex min-h-12 cursor-pointer items-center rounded border-2 border-graphite-400 bg-white px-3">
            Upload a photo or drawing
            <input
              type="file"
              accept="image/png,image/jpeg,image/webp,application/pdf"
              className="sr-only"
              data-testid="weld-map-upload"
              onChange={(e) => {
                const file = e.target.files?.[0];
                if (!file) return;
                const form = new FormData();
                form.set("file", file);
                void add({ body: form });
                e.target.value = "";
              }}
            />
          </label>
          <button
            type="button"
            disabled={busy}
            className="min-h-12 rounded border-2 border-graphite-400 bg-white px-3"
            data-testid="weld-map-draw"
            onClick={() => void add({ headers: { "content-type": "application/json" }, body: JSON.stringify({ drawing: axleBracketDrawing() }) })}
          >
            Make a plain drawing (tube and bracket)
          </button>
          <button
            type="button"
            disabled={busy}
            className="min-h-12 rounded border-2 border-graphite-400 bg-white px-3"
            onClick={() => void add({ headers: { "content-type": "application/json" }, body: JSON.stringify({ drawing: { title: "Sketch", shapes: [] } }) })}
          >
            Blank sheet
          </button>
        </div>
        <p className="field-error" role="status">{problem}</p>
      </section>
      {images.length ? (
        <WeldMapEditor images={images} jointIds={jointIds} initial={joints} onSave={save} />
      ) : (
        <p>No image yet: add one above, then tap to place each joint.</p>
      )}
    </div>
  );
}
