"use client";
// Camera capture straight to the job: each photo uploads with a progress bar and its own idempotency key,
// so a retry after a broken upload never makes a second copy. Refusals say why (type, size, damage).
import { useState } from "react";
import type { PhotoView } from "@/lib/jobs/record";
import { PHOTO_MAX_BYTES } from "@/lib/jobs/limits";
import { ApiError, newKey, uploadPhoto } from "./api";
import { useSetRecord } from "./use-job";

type Upload = { key: string; name: string; file: File; preview: string; progress: number; status: "uploading" | "failed"; error?: string; caption: string };

export function PhotoStrip({
  jobId,
  stepId,
  photos,
  needed,
  canAdd,
  canRemove,
  onRemove,
  selectable,
  selected,
  onToggle,
  testId = "photos",
}: {
  jobId: string;
  stepId?: string;
  photos: PhotoView[];
  needed: number;
  canAdd: boolean;
  canRemove: boolean;
  onRemove?: (photoId: string) => Promise<void>;
  selectable?: boolean;
  selected?: string[];
  onToggle?: (photoId: string) => void;
  testId?: string;
}) {
  const setRecord = useSetRecord(jobId);
  const [uploads, setUploads] = useState<Upload[]>([]);
  // A caption typed before the photo is taken goes with it; it is shown under the photo after.
  const [caption, setCaption] = useState("");

  const send = async (u: Upload) => {
    setUploads((all) => all.map((x) => (x.key === u.key ? { ...x, status: "uploading", progress: 0, error: undefined } : x)));
    try {
      const result = await uploadPhoto(jobId, u.file, {
        idempotencyKey: u.key,
        stepId,
        ...(u.caption ? { caption: u.caption } : {}),
        onProgress: (p) => setUploads((all) => all.map((x) => (x.key === u.key ? { ...x, progress: p } : x))),
      });
      setRecord(result.record);
      setUploads((all) => all.filter((x) => x.key !== u.key));
      URL.revokeObjectURL(u.preview);
    } catch (e) {
      const message = e instanceof ApiError ? e.message : "The upload failed.";
      setUploads((all) => all.map((x) => (x.key === u.key ? { ...x, status: "failed", error: message } : x)));
    }
  };

  const onFiles = (files: FileList | null) => {
    for (const file of Array.from(files ?? [])) {
      const u: Upload = { key: newKey(), name: file.name, file, preview: URL.createObjectURL(file), progress: 0, status: "uploading", caption: caption.trim() };
      if (file.size > PHOTO_MAX_BYTES) {
        // Said here at once rather than after sending 20 MB over the shop's wifi; the server refuses it too.
        setUploads((all) => [...all, { ...u, status: "failed", error: `This file is ${(file.size / 1024 / 1024).toFixed(1)} MB; photos are at most 20 MB.` }]);
        continue;
      }
      setUploads((all) => [...all, u]);
      void send(u);
    }
    setCaption("");
  };

  const count = photos.length;
  return (
    <section aria-labelledby={`${testId}-h`} className="space-y-3" data-testid={testId}>
      <div className="flex flex-wrap items-center justify-between gap-2">
        <h3 id={`${testId}-h`} className="text-lg font-bold text-graphite-950">
          Photos{" "}
          <span className="figures font-semibold" data-testid={`${testId}-count`}>
            {needed > 0 ? `${count} of ${needed}` : count}
          </span>
          {needed > 0 ? (count >= needed ? <span className="ml-2 text-verdict-pass">● enough</span> : <span className="ml-2 text-graphite-800">○ {needed - count} to take</span>) : null}
        </h3>
        {canAdd ? (
          <div className="flex flex-wrap gap-2">
            <label className="btn btn-primary min-h-14 cursor-pointer px-5 text-lg">
              <span aria-hidden="true">▣</span> Take photo
              {/* capture="environment" opens the rear camera directly on a tablet. */}
              <input type="file" accept="image/*" capture="environment" className="sr-only" data-testid={`${testId}-camera`} onChange={(e) => { onFiles(e.target.files); e.target.value = ""; }} />
            </label>
            <label className="btn btn-quiet min-h-14 cursor-pointer px-4">
              From files
              <input type="file" accept="image/jpeg,image/png,image/webp,image/heic,image/heif,image/avif" multiple className="sr-only" data-testid={`${testId}-file`} onChange={(e) => { onFiles(e.target.files); e.target.value = ""; }} />
            </label>
          </div>
        ) : null}
      </div>
      {canAdd ? (
        <div className="max-w-xl">
          <label htmlFor={`${testId}-caption`} className="field-label">Caption for the next photo (optional)</label>
          <input id={`${testId}-caption`} className="field-input min-h-12" value={caption} maxLength={200} onChange={(e) => setCaption(e.target.value)} placeholder="e.g. fit-up, tape at the upper toe" data-testid={`${testId}-caption`} />
        </div>
      ) : null}
      {uploads.length ? (
        <ul className="space-y-2" aria-label="Uploads">
          {uploads.map((u) => (
            <li key={u.key} className="flex items-center gap-3 rounded-lg border-2 border-graphite-300 bg-white p-2" data-testid="upload-item">
              {/* eslint-disable-next-line @next/next/no-img-element -- a local preview of the file being sent */}
              <img src={u.preview} alt="" className="h-16 w-16 rounded object-cover" />
              <div className="min-w-0 flex-1">
                {u.status === "uploading" ? (
                  <>
                    <div className="text-sm font-semibold">Sending… <span className="figures">{Math.round(u.progress * 100)} %</span></div>
                    <div className="mt-1 h-3 overflow-hidden rounded bg-graphite-200" role="progressbar" aria-valuemin={0} aria-valuemax={100} aria-valuenow={Math.round(u.progress * 100)} aria-label="Upload progress">
                      <div className="h-full bg-graphite-900" style={{ width: `${Math.round(u.progress * 100)}%` }} />
                    </div>
                  </>
                ) : (
                  <p className="text-sm font-semibold text-[#8a1d15]" data-testid="upload-error"><span aria-hidden="true">✕ </span>{u.error}</p>
                )}
              </div>
              {u.status === "failed" ? (
                <div className="flex gap-2">
                  <button type="button" className="btn btn-quiet min-h-12" onClick={() => void send(u)}>Retry</button>
                  <button type="button" className="btn btn-quiet min-h-12" onClick={() => setUploads((all) => all.filter((x) => x.key !== u.key))}>Dismiss</button>
                </div>
              ) : null}
            </li>
          ))}
        </ul>
      ) : null}
      {photos.length ? (
        <ul className="grid grid-cols-3 gap-3 sm:grid-cols-4" aria-label="Photos taken">
          {photos.map((p) => {
            const isSelected = selected?.includes(p.id) ?? false;
            return (
              <li key={p.id} className="space-y-2" data-testid="photo-thumb">
                {selectable ? (
                  <button type="button" aria-pressed={isSelected} onClick={() => onToggle?.(p.id)} className={`block w-full overflow-hidden rounded-lg border-4 ${isSelected ? "border-graphite-950" : "border-transparent"}`}>
                    {/* eslint-disable-next-line @next/next/no-img-element -- served by the photos API to members only */}
                    <img src={p.thumbUrl} alt={`Photo by ${p.uploadedBy.name}`} className="aspect-square w-full object-cover" />
                    <span className="block bg-white py-1 text-sm font-semibold">{isSelected ? "● Attached" : "○ Attach"}</span>
                  </button>
                ) : (
                  <a href={p.url} target="_blank" rel="noreferrer" className="block overflow-hidden rounded-lg border-2 border-graphite-300">
                    {/* eslint-disable-next-line @next/next/no-img-element -- served by the photos API to members only */}
                    <img src={p.thumbUrl} alt={`Photo by ${p.uploadedBy.name}, ${p.uploadedAt.slice(11, 16)} UTC`} className="aspect-square w-full object-cover" />
                  </a>
                )}
                {p.caption ? <p className="text-sm font-semibold text-graphite-950" data-testid="photo-caption">{p.caption}</p> : null}
                {canRemove && onRemove && !selectable ? (
                  <button type="button" className="btn btn-quiet min-h-12 w-full" onClick={() => void onRemove(p.id)}>Remove photo</button>
                ) : null}
              </li>
            );
          })}
        </ul>
      ) : uploads.length === 0 ? (
        <p className="text-graphite-800">No photos yet.</p>
      ) : null}
    </section>
  );
}
