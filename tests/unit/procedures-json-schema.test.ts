import fs from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { JSON_SCHEMA_FILE, procedureFileJsonSchema, procedureFileJsonSchemaText } from "@/lib/procedures/json-schema";

describe("published JSON Schema of the procedure file", () => {
  it("the committed file is what z.toJSONSchema generates now (regenerate: npx tsx lib/procedures/json-schema.ts)", () => {
    const committed = fs.readFileSync(path.resolve(import.meta.dirname, "../..", JSON_SCHEMA_FILE), "utf8");
    expect(committed).toBe(procedureFileJsonSchemaText());
  });

  it("is a draft 2020-12 schema that pins the format name and version and lists the nine step kinds", () => {
    const s = procedureFileJsonSchema() as { $schema: string; properties: Record<string, { const?: unknown }> };
    expect(s.$schema).toBe("https://json-schema.org/draft/2020-12/schema");
    expect(s.properties.format!.const).toBe("gusset-procedure");
    expect(s.properties.formatVersion!.const).toBe(1);
    const kinds = [...JSON.stringify(s).matchAll(/"kind":\{"type":"string","const":"([a-z]+)"\}/g)].map((m) => m[1]);
    expect(kinds).toEqual(["check", "measure", "photo", "caution", "weld", "hold", "torque", "coating", "geometry"]);
  });
});
