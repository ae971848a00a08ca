"use client";
// Moves the job's weld map onto a photo of this axle: take the photo here, then tap each joint where it is
// on it (the markers start where the procedure's map had them). Sealed with the job when it is released.
import dynamic from "next/dynamic";
import { useState } from "react";
import type { EditorSave } from "@/components/weld-map/weld-map-editor";
import type { JobRecord } from "@/lib/jobs/record";
import { apiJson, ApiError, newKey, uploadPhoto } from "./api";
import { useSetRecord } from "./use-job";

// The editor only comes down once there is a photo to place the joints on: most welders never open it.
const WeldMapEditor = dynamic(() => import("@/components/weld-map/weld-map-editor").then((m) => m.WeldMapEditor), {
  loading: () => <p role="status">Opening the editor…</p>,
});

export function RebaseWeldMap({ record }: { record: JobRecord }) {
  const setRecord = useSetRecord(record.job.id);
  const [photo, setPhoto] = useState<{ id: string; width: number; height: number } | null>(null);
  const [problem, setProblem] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const map = record.weldMap;
  if (!map) return null;
  const jointIds = record.steps.flatMap((s) => (s.spec.kind === "weld" ? [s.spec.jointId] : []));

  const take = async (file: File) => {
    setBusy(true);
    setProblem(null);
    try {
      const up = await uploadPhoto(record.job.id, file, { idempotencyKey: newKey(), caption: "Weld map: photo of this axle" });
      const p = up.record.photos.find((x) => x.id === up.photoId);
      if (p) setPhoto({ id: p.id, width: p.width, height: p.height });
    } catch (error) {
      setProblem(error instanceof ApiError ? error.message : "The photo could not be sent.");
    } finally {
      setBusy(false);
    }
  };

  const save: EditorSave = async (joints) => {
    if (!photo) return "Take the photo first.";
    try {
      const res = await apiJson<{ record: JobRecord }>(`/api/jobs/${record.job.id}/weld-map`, {
        method: "PUT",
        body: { photoId: photo.id, joints: joints.map((j) => ({ jointId: j.jointId, x: j.x, y: j.y, ...(j.path ? { path: j.path } : {}) })) },
      });
      setRecord(res.record);
      setPhoto(null);
      return null;
    } catch (error) {
      return error instanceof ApiError ? error.message : "The map could not be saved.";
    }
  };

  return (
    <details className="rounded-lg border-2 border-graphite-300 bg-white p-3">
      <summary className="min-h-12 cursor-pointer py-2 font-semibold">Put the weld map on a photo of this axle</summary>
      {!photo ? (
        <div className="mt-2 space-y-2">
          <label className="inline-flex min-h-12 cursor-pointer items-center rounded border-2 border-graphite-950 px-3 font-semibold">
            {busy ? "Sending the photo…" : "Take a photo of the axle"}
            <input type="file" accept="image/*" capture="environment" className="sr-only" onChange={(e) => e.target.files?.[0] && void take(e.target.files[0])} data-testid="rebase-photo" />
          </label>
          <p className="field-error" role="status">{problem}</p>
        </div>
      ) : (
        <WeldMapEditor
          images={[{ id: "rebase", url: `/api/photos/${photo.id}`, width: photo.width, height: photo.height, label: "Photo of this axle" }]}
          jointIds={jointIds}
          initial={map.joints.map((j) => ({ ...j, imageId: "rebase" }))}
          onSave={save}
          saveLabel="Use this photo for the weld map"
        />
      )}
    </details>
  );
}
