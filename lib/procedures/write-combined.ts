// Rewrites templates/06-…start-to-finish from the five parts, after one of them changed.
// Run: npx tsx lib/procedures/write-combined.ts (a unit test fails while the file is out of step).
import fs from "node:fs";
import path from "node:path";
import { combineProcedures } from "./combine";
import { parseProcedureFile, toProcedureFile } from "./file";
import { COMBINED_CODE, COMBINED_PARTS, COMBINED_TITLE, TEMPLATE_FILE_NAMES } from "./templates";

const dir = path.resolve(import.meta.dirname, "../../templates");
const parts = COMBINED_PARTS.map((slug) => {
  const r = parseProcedureFile(fs.readFileSync(path.join(dir, TEMPLATE_FILE_NAMES[slug]), "utf8"));
  if (!r.ok) throw new Error(`${slug}: ${r.problems.map((p) => `${p.where}: ${p.message}`).join("; ")}`);
  return r.file;
});
const file = toProcedureFile(combineProcedures(COMBINED_TITLE, COMBINED_CODE, parts), undefined, "../public/schemas/gusset-procedure-1.schema.json");
const out = path.join(dir, TEMPLATE_FILE_NAMES["lateral-link-bracket-start-to-finish"]);
fs.writeFileSync(out, `${JSON.stringify(file, null, 2)}\n`);
console.log(`wrote ${path.relative(process.cwd(), out)}`);
