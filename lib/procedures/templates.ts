// The starter procedures in templates/, seeded as published version 1 for the demo shop and offered when a
// lead starts a new procedure. Each file is checked by the same schema an import uses (tests/unit).
import removeBracket from "@/templates/01-remove-lateral-link-bracket.gusset-procedure.json";
import prepareTube from "@/templates/02-prepare-axle-tube.gusset-procedure.json";
import fitWeld from "@/templates/03-fit-weld-lateral-link-bracket.gusset-procedure.json";
import coatRepair from "@/templates/04-coat-repaired-area.gusset-procedure.json";
import reassemble from "@/templates/05-reassemble-torque-road-test.gusset-procedure.json";
import startToFinish from "@/templates/06-lateral-link-bracket-start-to-finish.gusset-procedure.json";
import { procedureFileV1Schema, type ProcedureFile } from "./file";

export const COMBINED_TITLE = "Lateral-link bracket replacement, start to finish";
export const COMBINED_CODE =
  "AWS D1.1 visual acceptance, statically loaded; welds to shop WPS GUS-GMAW-02; SSPC-SP 11 and SSPC-PA 2 for the coating; vehicle maker's torque and alignment data";

export const TEMPLATE_FILES = {
  "remove-lateral-link-bracket": removeBracket,
  "prepare-axle-tube": prepareTube,
  "fit-weld-lateral-link-bracket": fitWeld,
  "coat-repaired-area": coatRepair,
  "reassemble-torque-road-test": reassemble,
  "lateral-link-bracket-start-to-finish": startToFinish,
} as const;

type TemplateSlug = keyof typeof TEMPLATE_FILES;

export const TEMPLATE_FILE_NAMES: Record<TemplateSlug, string> = {
  "remove-lateral-link-bracket": "01-remove-lateral-link-bracket.gusset-procedure.json",
  "prepare-axle-tube": "02-prepare-axle-tube.gusset-procedure.json",
  "fit-weld-lateral-link-bracket": "03-fit-weld-lateral-link-bracket.gusset-procedure.json",
  "coat-repaired-area": "04-coat-repaired-area.gusset-procedure.json",
  "reassemble-torque-road-test": "05-reassemble-torque-road-test.gusset-procedure.json",
  "lateral-link-bracket-start-to-finish": "06-lateral-link-bracket-start-to-finish.gusset-procedure.json",
};
export const TEMPLATE_SLUGS = Object.keys(TEMPLATE_FILES) as TemplateSlug[];
// The parts the combined procedure runs, in order.
export const COMBINED_PARTS: TemplateSlug[] = [
  "remove-lateral-link-bracket",
  "prepare-axle-tube",
  "fit-weld-lateral-link-bracket",
  "coat-repaired-area",
  "reassemble-torque-road-test",
];

export function isTemplateSlug(value: unknown): value is TemplateSlug {
  return typeof value === "string" && Object.prototype.hasOwnProperty.call(TEMPLATE_FILES, value);
}

// Parsed with the file schema, so defaults are applied exactly as an import would apply them.
export function starterTemplate(slug: TemplateSlug): ProcedureFile {
  return procedureFileV1Schema.parse(TEMPLATE_FILES[slug]);
}

export function starterTemplates(): { slug: TemplateSlug; file: ProcedureFile }[] {
  return TEMPLATE_SLUGS.map((slug) => ({ slug, file: starterTemplate(slug) }));
}
