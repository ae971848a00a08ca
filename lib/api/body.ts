// Reading request bodies without trusting them: the size is counted while the bytes arrive (a chunked body
// has no Content-Length to refuse it by), JSON nesting is measured before JSON.parse builds anything, and
// text with control characters is refused with the field it was found in, before PostgreSQL refuses it
// with an error nobody can act on.
import { AppError } from "@/lib/errors";
import { jsonDepthExceeds, MAX_JSON_DEPTH } from "@/lib/procedures/json-scan";
import { controlCharacterIn, controlCharacterMessage, controlCharacterPaths } from "@/lib/text-safety";

export const MAX_JSON_BYTES = 1024 * 1024;

function sizeLabel(bytes: number): string {
  return bytes >= 1024 * 1024 ? `${Math.round(bytes / 1024 / 1024)} MB` : `${Math.round(bytes / 1024)} KB`;
}

function tooLarge(limit: number, message?: string): AppError {
  return new AppError("payload_too_large", message ?? `The request is larger than ${sizeLabel(limit)}; nothing was saved.`);
}

/**
 * The body's bytes, at most `limit` of them. A declared Content-Length over the limit is refused before
 * anything is read; otherwise bytes are counted as they stream in and reading stops at the first byte past
 * the limit, so a body without a length (chunked) never costs more than `limit` of memory.
 */
export async function readBodyBytes(req: Request, limit: number, message?: string): Promise<Uint8Array<ArrayBuffer>> {
  const declared = Number(req.headers.get("content-length") ?? "0");
  if (Number.isFinite(declared) && declared > limit) throw tooLarge(limit, message);
  if (!req.body) return new Uint8Array(0);
  const reader = req.body.getReader();
  const chunks: Uint8Array[] = [];
  let size = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    size += value.byteLength;
    if (size > limit) {
      // Stop reading; the rest is never held. The stream is left for the server to discard (cancelling it
      // would close the connection before the 413 is written).
      reader.releaseLock();
      throw tooLarge(limit, message);
    }
    chunks.push(value);
  }
  const out = new Uint8Array(size);
  let at = 0;
  for (const c of chunks) {
    out.set(c, at);
    at += c.byteLength;
  }
  return out;
}

export async function readBodyText(req: Request, limit: number, message?: string): Promise<string> {
  return new TextDecoder("utf-8").decode(await readBodyBytes(req, limit, message));
}

function mediaType(req: Request): string {
  return (req.headers.get("content-type") ?? "").split(";")[0]!.trim().toLowerCase();
}

export function isJsonMediaType(type: string): boolean {
  return type === "application/json" || (type.startsWith("application/") && type.endsWith("+json"));
}

// A browser form can send text/plain across origins without asking first; JSON routes take only JSON.
export function assertJsonContentType(req: Request): void {
  if (!isJsonMediaType(mediaType(req))) {
    throw new AppError("unsupported_media_type", "Send the request as JSON with the header Content-Type: application/json.");
  }
}

function fieldName(path: (string | number)[]): string {
  return path.length ? path.join(".") : "_";
}

// Field errors for every string (and member name) in a parsed JSON value that holds a control character.
export function controlCharacterFields(value: unknown): Record<string, string[]> | null {
  const found = controlCharacterPaths(value);
  if (!found.length) return null;
  const fields: Record<string, string[]> = {};
  for (const f of found) (fields[fieldName(f.path)] ??= []).push(controlCharacterMessage(f.code));
  return fields;
}

function assertNoControlCharacters(value: unknown): void {
  const fields = controlCharacterFields(value);
  if (fields) throw new AppError("bad_request", "Some text holds an invisible control character; nothing was saved.", fields);
}

// Parses JSON text that came from outside: bounded nesting first (JSON.parse and every recursive walk after
// it would otherwise pay for whatever depth the sender chose), then the text itself.
export function parseUntrustedJson(text: string): unknown {
  if (!text.trim()) throw new AppError("bad_request", "The request has no JSON body.");
  if (jsonDepthExceeds(text, MAX_JSON_DEPTH)) {
    throw new AppError("bad_request", `The JSON is nested more than ${MAX_JSON_DEPTH} levels deep.`);
  }
  let value: unknown;
  try {
    value = JSON.parse(text);
  } catch {
    throw new AppError("bad_request", "The request body is not valid JSON.");
  }
  assertNoControlCharacters(value);
  return value;
}

export async function readJson(req: Request, maxBytes = MAX_JSON_BYTES): Promise<unknown> {
  assertJsonContentType(req);
  return parseUntrustedJson(await readBodyText(req, maxBytes));
}

/**
 * A multipart form read with the same streaming limit, then parsed from the bytes already held. Text
 * fields are checked for control characters like JSON strings are.
 */
export async function readMultipart(req: Request, limit: number, message?: string): Promise<FormData> {
  const type = req.headers.get("content-type") ?? "";
  if (!type.toLowerCase().startsWith("multipart/form-data")) {
    throw new AppError("unsupported_media_type", "Send the upload as multipart/form-data.");
  }
  const bytes = await readBodyBytes(req, limit, message);
  let form: FormData;
  try {
    form = await new Response(bytes, { headers: { "content-type": type } }).formData();
  } catch {
    throw new AppError("bad_request", "The upload could not be read as a form.");
  }
  const fields: Record<string, string[]> = {};
  for (const [name, v] of form.entries()) {
    const code = typeof v === "string" ? controlCharacterIn(v) : null;
    if (code) (fields[name] ??= []).push(controlCharacterMessage(code));
  }
  if (Object.keys(fields).length) throw new AppError("bad_request", "Some text holds an invisible control character; nothing was saved.", fields);
  return form;
}

// The same check for a server action's form: field name → messages, or null when every field is clean.
export function formControlCharacterFields(formData: FormData): Record<string, string[]> | null {
  const fields: Record<string, string[]> = {};
  for (const [name, v] of formData.entries()) {
    // Next's own action fields ($ACTION_...) are framework data, not text a person typed.
    if (name.startsWith("$ACTION")) continue;
    const code = typeof v === "string" ? controlCharacterIn(v) : null;
    if (code) (fields[name] ??= []).push(controlCharacterMessage(code));
  }
  return Object.keys(fields).length ? fields : null;
}
