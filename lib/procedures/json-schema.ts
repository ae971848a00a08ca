// The JSON Schemas of the procedure file, generated from its zod schemas (z.toJSONSchema) so they never
// drift. public/schemas/ holds the committed output (version 1 and version 2); a unit test fails when either
// is out of date. Regenerate: npx tsx lib/procedures/json-schema.ts
import { z } from "zod";
import { procedureFileV1Schema, procedureFileV2Schema, PROCEDURE_FILE_SCHEMA_PATH, PROCEDURE_FILE_V1_SCHEMA_PATH } from "./file";

export const JSON_SCHEMA_FILE = `public${PROCEDURE_FILE_V1_SCHEMA_PATH}`;
export const JSON_SCHEMA_FILE_V2 = `public${PROCEDURE_FILE_SCHEMA_PATH}`;

// "input": what a file may contain (fields with defaults are optional). Cross-field rules (unique keys,
// ± tolerance needs a nominal, max ≥ min, markers name real joints and images) are checked on import.
export function procedureFileJsonSchema(version: 1 | 2 = 1): Record<string, unknown> {
  return z.toJSONSchema(version === 1 ? procedureFileV1Schema : procedureFileV2Schema, { io: "input", target: "draft-2020-12" }) as Record<string, unknown>;
}

export function procedureFileJsonSchemaText(version: 1 | 2 = 1): string {
  return `${JSON.stringify(procedureFileJsonSchema(version), null, 2)}\n`;
}

if (typeof process !== "undefined" && process.argv[1] && import.meta.url === `file://${process.argv[1]}`) {
  const { writeFileSync } = await import("node:fs");
  writeFileSync(JSON_SCHEMA_FILE, procedureFileJsonSchemaText(1));
  writeFileSync(JSON_SCHEMA_FILE_V2, procedureFileJsonSchemaText(2));
  console.log(`wrote ${JSON_SCHEMA_FILE} and ${JSON_SCHEMA_FILE_V2}`);
}
