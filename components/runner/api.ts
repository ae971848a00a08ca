// The runner's only way to the server: the jobs API, JSON in and out, errors as ApiError with the server's
// code, message, field errors and extras (a conflict's `current`, a refusal's `reasons`).
import type { JobRecord } from "@/lib/jobs/record";

export class ApiError extends Error {
  constructor(
    public readonly status: number,
    public readonly code: string,
    message: string,
    public readonly fields: Record<string, string[]> = {},
    public readonly extra: Record<string, unknown> = {},
  ) {
    super(message);
    this.name = "ApiError";
  }
}

function errorFrom(status: number, body: unknown): ApiError {
  const e = (body as { error?: { code?: string; message?: string; fields?: Record<string, string[]> } & Record<string, unknown> })?.error;
  if (e && typeof e.message === "string") {
    const { code, message, fields, ...extra } = e;
    return new ApiError(status, code ?? "error", message, fields ?? {}, extra);
  }
  if (status === 401) return new ApiError(status, "unauthenticated", "Your session ended. Sign in again; what you typed is kept on this tablet.");
  return new ApiError(status, "network", `The server answered ${status}. Nothing was lost on this tablet: try again.`);
}

export async function apiJson<T>(path: string, init: { method?: string; body?: unknown } = {}): Promise<T> {
  let res: Response;
  try {
    res = await fetch(path, {
      method: init.method ?? (init.body === undefined ? "GET" : "POST"),
      headers: init.body === undefined ? {} : { "content-type": "application/json" },
      body: init.body === undefined ? undefined : JSON.stringify(init.body),
      credentials: "same-origin",
      cache: "no-store",
    });
  } catch {
    throw new ApiError(0, "network", "No connection to the shop's server. What you entered stays on this tablet; it is sent when the connection is back.");
  }
  const text = await res.text();
  let body: unknown = null;
  try {
    body = text ? JSON.parse(text) : null;
  } catch {
    body = null;
  }
  if (!res.ok) throw errorFrom(res.status, body);
  return body as T;
}

export type Uploaded = { photoId: string; record: JobRecord };

/** Multipart upload with progress (fetch cannot report upload progress; XHR can). */
export function uploadPhoto(
  jobId: string,
  file: Blob,
  opts: { idempotencyKey: string; stepId?: string; caption?: string; onProgress?: (fraction: number) => void },
): Promise<Uploaded> {
  return new Promise((resolve, reject) => {
    const form = new FormData();
    form.append("file", file, "photo");
    form.append("idempotencyKey", opts.idempotencyKey);
    if (opts.stepId) form.append("stepId", opts.stepId);
    if (opts.caption) form.append("caption", opts.caption);
    const xhr = new XMLHttpRequest();
    xhr.open("POST", `/api/jobs/${jobId}/photos`);
    xhr.withCredentials = true;
    xhr.upload.onprogress = (e) => {
      if (e.lengthComputable) opts.onProgress?.(e.loaded / e.total);
    };
    xhr.onerror = () => reject(new ApiError(0, "network", "The upload broke off. Tap Retry: the photo is sent again without making a copy."));
    xhr.ontimeout = xhr.onerror;
    xhr.onload = () => {
      let body: unknown = null;
      try {
        body = xhr.responseText ? JSON.parse(xhr.responseText) : null;
      } catch {
        body = null;
      }
      if (xhr.status >= 200 && xhr.status < 300) resolve(body as Uploaded);
      else reject(errorFrom(xhr.status, body));
    };
    xhr.timeout = 120_000;
    xhr.send(form);
  });
}

export function newKey(): string {
  return typeof crypto !== "undefined" && "randomUUID" in crypto ? crypto.randomUUID() : `${Date.now().toString(36)}-${Math.random().toString(36).slice(2, 12)}`;
}
