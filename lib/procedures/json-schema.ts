// The JSON Schema of the procedure file, generated from its zod schema (z.toJSONSchema) so the two never
// drift. public/schemas/ holds the committed output; a unit test fails when it is out of date.
// Regenerate: npx tsx lib/procedures/json-schema.ts
import { z } from "zod";
import { procedureFileSchema, PROCEDURE_FILE_SCHEMA_PATH } from "./file";

export const JSON_SCHEMA_FILE = `public${PROCEDURE_FILE_SCHEMA_PATH}`;

export function procedureFileJsonSchema(): Record<string, unknown> {
  // "input": what a file may contain (fields with defaults are optional). Cross-field rules (unique keys,
  // ± tolerance needs a nominal, max ≥ min) are not expressible here and are checked on import.
  return z.toJSONSchema(procedureFileSchema, { io: "input", target: "draft-2020-12" }) as Record<string, unknown>;
}

export function procedureFileJsonSchemaText(): string {
  return `${JSON.stringify(procedureFileJsonSchema(), null, 2)}\n`;
}

if (typeof process !== "undefined" && process.argv[1] && import.meta.url === `file://${process.argv[1]}`) {
  const { writeFileSync } = await import("node:fs");
  writeFileSync(JSON_SCHEMA_FILE, procedureFileJsonSchemaText());
  console.log(`wrote ${JSON_SCHEMA_FILE}`);
}
