// The Gusset procedure file ("gusset-procedure"): what export writes, import reads and templates/ holds.
// formatVersion 1 is steps only; formatVersion 2 adds the weld map and its images (base64), and is what a
// version with a map exports as. Zod schemas define both; public/schemas/ carries the JSON Schemas generated
// from them. Version-1 files are read as they always were.
import { z } from "zod";
import { duplicateMembers, formatPath, jsonDepthExceeds, MAX_JSON_DEPTH, type JsonPath } from "./json-scan";
import { controlCharacterMessage, controlCharacterPaths } from "@/lib/text-safety";
import { procedureMetaSchema, versionContentSchema, versionContentV1Schema, type VersionContent } from "./schema";

export const PROCEDURE_FILE_FORMAT = "gusset-procedure";
export const PROCEDURE_FILE_VERSION = 2;
/** A file without images; one carrying weld-map images (formatVersion 2) may be up to PROCEDURE_FILE_MAX_BYTES_WITH_IMAGES. */
export const PROCEDURE_FILE_MAX_BYTES = 1024 * 1024;
export const PROCEDURE_FILE_MAX_BYTES_WITH_IMAGES = 16 * 1024 * 1024;
export const PROCEDURE_FILE_SCHEMA_PATH = "/schemas/gusset-procedure-2.schema.json";
export const PROCEDURE_FILE_V1_SCHEMA_PATH = "/schemas/gusset-procedure-1.schema.json";
export const PROCEDURE_FILE_EXTENSION = ".gusset-procedure.json";

// Where an exported file came from. Informational: an import never trusts it, it only compares the hash.
const procedureFileSourceSchema = z
  .object({
    shop: z.string().max(200).optional(),
    procedureId: z.string().max(100).optional(),
    version: z.number().int().min(1).optional(),
    status: z.enum(["draft", "published", "retired"]).optional(),
    contentHash: z.string().regex(/^[0-9a-f]{64}$/, "contentHash is 64 lower-case hex digits.").optional(),
    changeNote: z.string().max(2000).optional(),
    publishedAt: z.string().max(40).optional(),
    exportedAt: z.string().max(40).optional(),
  })
  .strict()
  .meta({ description: "Where an exported file came from. Ignored on import, except that its contentHash is compared." });

const FILE_DESCRIPTION =
  "A Gusset procedure: title, scope, the code or standard it follows, and its sections of ordered steps. " +
  "Step keys and weld joint ids are unique across the file. Importing creates a new draft.";

export const procedureFileV1Schema = z
  .object({
    $schema: z.string().max(500).optional(),
    format: z.literal(PROCEDURE_FILE_FORMAT, { message: `format must be "${PROCEDURE_FILE_FORMAT}".` }),
    formatVersion: z.literal(1, { message: "formatVersion must be 1 or 2." }),
    procedure: procedureMetaSchema,
    content: versionContentV1Schema,
    source: procedureFileSourceSchema.optional(),
  })
  .strict()
  .meta({ title: "Gusset procedure file", description: FILE_DESCRIPTION });

/** An image of the weld map carried in the file: its bytes as base64, named by the id the map uses. */
export const procedureFileImageSchema = z
  .object({
    id: z.uuid("An image id is a UUID."),
    contentType: z.enum(["image/jpeg", "image/png"], { message: "contentType is image/jpeg or image/png." }),
    data: z.string().regex(/^[A-Za-z0-9+/]*={0,2}$/, "data is the image's bytes as base64.").max(PROCEDURE_FILE_MAX_BYTES_WITH_IMAGES),
  })
  .strict();

export const procedureFileV2Schema = z
  .object({
    $schema: z.string().max(500).optional(),
    format: z.literal(PROCEDURE_FILE_FORMAT, { message: `format must be "${PROCEDURE_FILE_FORMAT}".` }),
    formatVersion: z.literal(2, { message: "formatVersion must be 1 or 2." }),
    procedure: procedureMetaSchema,
    content: versionContentSchema,
    /** the weld map's images; every image the map names is here */
    images: z.array(procedureFileImageSchema).max(8).default([]),
    source: procedureFileSourceSchema.optional(),
  })
  .strict()
  .superRefine((f, ctx) => {
    const have = new Set(f.images.map((i) => i.id));
    f.content.weldMap?.images.forEach((img, i) => {
      if (!have.has(img.id)) ctx.addIssue({ code: "custom", path: ["content", "weldMap", "images", i, "id"], message: "The weld map names an image the file does not carry (images[])." });
    });
  })
  .meta({ title: "Gusset procedure file (version 2, with the weld map)", description: `${FILE_DESCRIPTION} The weld map's images travel in images[] as base64.` });

/** What import reads: either version, chosen by formatVersion. */
export const procedureFileSchema = z.union([procedureFileV1Schema, procedureFileV2Schema]);

export type ProcedureFile = z.output<typeof procedureFileV1Schema> | z.output<typeof procedureFileV2Schema>;

type FileProblem = { path: string; where: string; message: string };
type FileParse =
  | { ok: true; file: ProcedureFile }
  | { ok: false; status: 400 | 413 | 422; message: string; problems: FileProblem[] };

function describeWhere(data: unknown, path: JsonPath): string {
  const parts: string[] = [];
  let used = 0;
  const sections = (data as { content?: { sections?: unknown } } | null)?.content?.sections;
  if (path[0] === "content" && path[1] === "sections" && typeof path[2] === "number" && Array.isArray(sections)) {
    const section = sections[path[2]] as { title?: unknown; steps?: unknown } | undefined;
    const title = typeof section?.title === "string" && section.title.trim() ? ` “${section.title.trim().slice(0, 60)}”` : "";
    parts.push(`section ${path[2] + 1}${title}`);
    used = 3;
    if (path[3] === "steps" && typeof path[4] === "number" && Array.isArray(section?.steps)) {
      const step = section.steps[path[4]] as { title?: unknown } | undefined;
      const stepTitle = typeof step?.title === "string" && step.title.trim() ? ` “${step.title.trim().slice(0, 60)}”` : "";
      parts.push(`step ${path[4] + 1}${stepTitle}`);
      used = 5;
    }
  } else if (path[0] === "procedure") {
    parts.push("procedure details");
    used = 1;
  }
  const field = path.slice(used);
  if (field.length) parts.push(formatPath(field));
  return parts.join(", ") || "the whole file";
}

// zod runs the whole-file rules (unique keys and joints) only once every field parses; a file with other
// problems too should still hear about its duplicates, so they are looked for in the raw data as well.
function rawDuplicates(data: unknown): { path: JsonPath; message: string }[] {
  const found: { path: JsonPath; message: string }[] = [];
  const sections = (data as { content?: { sections?: unknown } } | null)?.content?.sections;
  if (!Array.isArray(sections)) return found;
  const sectionKeys = new Set<string>();
  const stepKeys = new Map<string, string>();
  const joints = new Set<string>();
  sections.forEach((section: unknown, si) => {
    const sec = section as { key?: unknown; steps?: unknown } | null;
    if (typeof sec?.key === "string") {
      if (sectionKeys.has(sec.key)) found.push({ path: ["content", "sections", si, "key"], message: `Duplicate section key "${sec.key}".` });
      sectionKeys.add(sec.key);
    }
    if (!Array.isArray(sec?.steps)) return;
    sec.steps.forEach((step: unknown, ti) => {
      const st = step as { key?: unknown; kind?: unknown; jointId?: unknown } | null;
      if (typeof st?.key === "string") {
        if (stepKeys.has(st.key)) found.push({ path: ["content", "sections", si, "steps", ti, "key"], message: `Duplicate step key "${st.key}" (also in ${stepKeys.get(st.key)}).` });
        stepKeys.set(st.key, typeof sec.key === "string" ? sec.key : `section ${si + 1}`);
      }
      if (st?.kind === "weld" && typeof st.jointId === "string") {
        if (joints.has(st.jointId)) found.push({ path: ["content", "sections", si, "steps", ti, "jointId"], message: `Duplicate weld joint "${st.jointId}".` });
        joints.add(st.jointId);
      }
    });
  });
  return found;
}

function utf8Length(text: string): number {
  return new TextEncoder().encode(text).length;
}

// Reads a file's text. Every problem found is listed; nothing is kept from a file that has any.
export function parseProcedureFile(text: string): FileParse {
  const bytes = utf8Length(text);
  const tooBig = (limit: number): FileParse => ({
    ok: false,
    status: 413,
    message: `The file is ${Math.ceil(bytes / 1024)} KB; a procedure file is at most ${limit / 1024} KB${limit === PROCEDURE_FILE_MAX_BYTES ? " (more only with weld-map images, formatVersion 2)" : ""}.`,
    problems: [{ path: "", where: "the whole file", message: `Over the ${limit / 1024} KB limit.` }],
  });
  if (bytes > PROCEDURE_FILE_MAX_BYTES_WITH_IMAGES) return tooBig(PROCEDURE_FILE_MAX_BYTES_WITH_IMAGES);
  // Only images may take a file past 1 MB: the steps themselves stay small.
  if (bytes > PROCEDURE_FILE_MAX_BYTES && !/"formatVersion"\s*:\s*2\b/.test(text) ) return tooBig(PROCEDURE_FILE_MAX_BYTES);
  const body = text.charCodeAt(0) === 0xfeff ? text.slice(1) : text;
  if (!body.trim()) {
    return { ok: false, status: 400, message: "The file is empty.", problems: [{ path: "", where: "the whole file", message: "The file is empty." }] };
  }
  // Measured before JSON.parse: nesting no procedure needs would otherwise cost every step after it.
  if (jsonDepthExceeds(body, MAX_JSON_DEPTH)) {
    const message = `Arrays and objects are nested more than ${MAX_JSON_DEPTH} levels deep; a procedure file never needs that.`;
    return { ok: false, status: 400, message: `The file is not a Gusset procedure file: ${message}`, problems: [{ path: "", where: "the whole file", message }] };
  }
  let data: unknown;
  try {
    data = JSON.parse(body);
  } catch (error) {
    const detail = error instanceof Error ? error.message : "not JSON";
    return {
      ok: false,
      status: 400,
      message: "The file is not JSON; a Gusset procedure file is a JSON document.",
      problems: [{ path: "", where: "the whole file", message: `Not valid JSON: ${detail}` }],
    };
  }
  const problems: FileProblem[] = duplicateMembers(body).map((d) => ({
    path: formatPath(d.path),
    where: describeWhere(data, d.path.slice(0, -1)),
    message: `"${d.name}" appears more than once in the same object; keep one.`,
  }));
  for (const c of controlCharacterPaths(data)) {
    problems.push({ path: formatPath(c.path), where: describeWhere(data, c.path), message: controlCharacterMessage(c.code) });
  }
  const version = (data as { formatVersion?: unknown } | null)?.formatVersion;
  const parsed = (version === 2 ? procedureFileV2Schema : procedureFileV1Schema).safeParse(data);
  if (!parsed.success) {
    for (const issue of parsed.error.issues) {
      problems.push({ path: formatPath(issue.path), where: describeWhere(data, issue.path as JsonPath), message: issue.message });
    }
    for (const d of rawDuplicates(data)) {
      const path = formatPath(d.path);
      if (!problems.some((p) => p.path === path && p.message === d.message)) problems.push({ path, where: describeWhere(data, d.path), message: d.message });
    }
  }
  if (problems.length || !parsed.success) {
    return {
      ok: false,
      status: 422,
      message: `The file is not a valid Gusset procedure file: ${problems.length} ${problems.length === 1 ? "problem" : "problems"}. Nothing was saved.`,
      problems,
    };
  }
  return { ok: true, file: parsed.data };
}

export function problemFields(problems: readonly FileProblem[]): Record<string, string[]> {
  const fields: Record<string, string[]> = {};
  for (const p of problems) (fields[p.path || "_"] ??= []).push(p.message);
  return fields;
}

/**
 * The file of a version. With a weld map it is formatVersion 2 and carries the map's images (base64); without
 * one it stays formatVersion 1, so files of versions without a map read anywhere version-1 files do.
 */
export function toProcedureFile(
  v: { title: string; scope: string; code: string; content: VersionContent },
  source?: z.input<typeof procedureFileSourceSchema>,
  schemaUrl?: string,
  images: z.input<typeof procedureFileImageSchema>[] = [],
): z.input<typeof procedureFileV1Schema> | z.input<typeof procedureFileV2Schema> {
  const withMap = Boolean(v.content.weldMap);
  const base = {
    format: PROCEDURE_FILE_FORMAT,
    procedure: { title: v.title, scope: v.scope, code: v.code },
    ...(source ? { source } : {}),
  } as const;
  if (!withMap) {
    const { weldMap: _omit, ...content } = v.content;
    return { $schema: schemaUrl ?? PROCEDURE_FILE_V1_SCHEMA_PATH, ...base, formatVersion: 1, content };
  }
  return { $schema: schemaUrl ?? PROCEDURE_FILE_SCHEMA_PATH, ...base, formatVersion: 2, content: v.content, images };
}

export function fileNameFor(title: string, number: number): string {
  const slug =
    title
      .toLowerCase()
      .normalize("NFKD")
      .replace(/[^a-z0-9]+/g, "-")
      .replace(/^-+|-+$/g, "")
      .slice(0, 60) || "procedure";
  return `${slug}-v${number}${PROCEDURE_FILE_EXTENSION}`;
}
