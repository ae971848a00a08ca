// The Gusset procedure file ("gusset-procedure", formatVersion 1): what export writes, import reads and
// templates/ holds. One zod schema defines it; public/schemas/ carries the JSON Schema generated from it.
import { z } from "zod";
import { duplicateMembers, formatPath, jsonDepthExceeds, MAX_JSON_DEPTH, type JsonPath } from "./json-scan";
import { controlCharacterMessage, controlCharacterPaths } from "@/lib/text-safety";
import { procedureMetaSchema, versionContentSchema, type VersionContent } from "./schema";

export const PROCEDURE_FILE_FORMAT = "gusset-procedure";
export const PROCEDURE_FILE_VERSION = 1;
export const PROCEDURE_FILE_MAX_BYTES = 1024 * 1024;
export const PROCEDURE_FILE_SCHEMA_PATH = "/schemas/gusset-procedure-1.schema.json";
const PROCEDURE_FILE_EXTENSION = ".gusset-procedure.json";

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

export const procedureFileSchema = z
  .object({
    $schema: z.string().max(500).optional(),
    format: z.literal(PROCEDURE_FILE_FORMAT, { message: `format must be "${PROCEDURE_FILE_FORMAT}".` }),
    formatVersion: z.literal(PROCEDURE_FILE_VERSION, { message: `formatVersion must be ${PROCEDURE_FILE_VERSION}.` }),
    procedure: procedureMetaSchema,
    content: versionContentSchema,
    source: procedureFileSourceSchema.optional(),
  })
  .strict()
  .meta({
    title: "Gusset procedure file",
    description:
      "A Gusset procedure: title, scope, the code or standard it follows, and its sections of ordered steps. " +
      "Step keys and weld joint ids are unique across the file. Importing creates a new draft.",
  });

export type ProcedureFile = z.output<typeof procedureFileSchema>;

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
  if (bytes > PROCEDURE_FILE_MAX_BYTES) {
    return {
      ok: false,
      status: 413,
      message: `The file is ${Math.ceil(bytes / 1024)} KB; a procedure file is at most ${PROCEDURE_FILE_MAX_BYTES / 1024} KB.`,
      problems: [{ path: "", where: "the whole file", message: `Over the ${PROCEDURE_FILE_MAX_BYTES / 1024} KB limit.` }],
    };
  }
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
  const parsed = procedureFileSchema.safeParse(data);
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

export function toProcedureFile(
  v: { title: string; scope: string; code: string; content: VersionContent },
  source?: z.input<typeof procedureFileSourceSchema>,
  schemaUrl: string = PROCEDURE_FILE_SCHEMA_PATH,
): z.input<typeof procedureFileSchema> {
  return {
    $schema: schemaUrl,
    format: PROCEDURE_FILE_FORMAT,
    formatVersion: PROCEDURE_FILE_VERSION,
    procedure: { title: v.title, scope: v.scope, code: v.code },
    content: v.content,
    ...(source ? { source } : {}),
  };
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
