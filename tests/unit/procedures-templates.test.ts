import fs from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { publishReadiness } from "@/lib/procedures/checks";
import { combineProcedures } from "@/lib/procedures/combine";
import { parseProcedureFile } from "@/lib/procedures/file";
import { COMBINED_CODE, COMBINED_PARTS, COMBINED_TITLE, starterTemplate, TEMPLATE_FILE_NAMES, TEMPLATE_FILES, TEMPLATE_SLUGS } from "@/lib/procedures/templates";

const dir = path.resolve(import.meta.dirname, "../../templates");
const files = fs.readdirSync(dir).filter((f) => f.endsWith(".json")).sort();
const NOTE = /supports, and never replaces, the vehicle maker's specifications[^.]*local codes and qualified or licensed practice/;

describe("starter templates in templates/", () => {
  it("there are at least six: the five bracket-job procedures and the combined one", () => {
    expect(files.length).toBeGreaterThanOrEqual(6);
    const titles = files.map((f) => JSON.parse(fs.readFileSync(path.join(dir, f), "utf8")).procedure.title as string);
    expect(titles).toEqual(
      expect.arrayContaining([
        "Removing a welded lateral-link bracket from an axle tube",
        "Preparing an axle tube for welding",
        "Fitting and welding a weld-in lateral-link bracket at ride height",
        "Coating the repaired area",
        "Reassembly, torque, geometry check and road test",
        COMBINED_TITLE,
      ]),
    );
  });

  it.each(files)("%s imports with the same parser the import uses", (file) => {
    const r = parseProcedureFile(fs.readFileSync(path.join(dir, file), "utf8"));
    expect(r.ok ? [] : r.problems).toEqual([]);
  });

  it.each(files)("%s carries cautions, the safety note and nothing that blocks publishing", (file) => {
    const r = parseProcedureFile(fs.readFileSync(path.join(dir, file), "utf8"));
    if (!r.ok) throw new Error("invalid template");
    const steps = r.file.content.sections.flatMap((s) => s.steps);
    expect(steps.filter((s) => s.kind === "caution").length).toBeGreaterThanOrEqual(1);
    expect(r.file.procedure.scope).toMatch(NOTE);
    expect(publishReadiness({ ...r.file.procedure, content: r.file.content }).blockers).toEqual([]);
  });

  it("every file is a template the app offers and seeds, under the name it is listed by", () => {
    expect(Object.values(TEMPLATE_FILE_NAMES).sort()).toEqual(files);
    for (const slug of TEMPLATE_SLUGS) {
      expect(JSON.parse(fs.readFileSync(path.join(dir, TEMPLATE_FILE_NAMES[slug]), "utf8"))).toEqual(TEMPLATE_FILES[slug]);
    }
  });

  it("the fitting procedure checks the bracket's pitch against the existing mounts, within ±1°", () => {
    const fit = starterTemplate("fit-weld-lateral-link-bracket");
    const pitch = fit.content.sections.flatMap((s) => s.steps).find((s) => s.key === "fit-pitch");
    expect(pitch?.kind).toBe("measure");
    if (pitch?.kind !== "measure") return;
    expect(pitch.quantity).toBe("angle");
    expect(pitch.tolerance).toEqual({ type: "plusMinus", plus: 1, minus: 1 });
  });

  it("the fitting procedure holds for an inspector after fit-up and after welding", () => {
    const steps = starterTemplate("fit-weld-lateral-link-bracket").content.sections.flatMap((s) => s.steps);
    const firstWeld = steps.findIndex((s) => s.kind === "weld");
    const holds = steps.map((s, i) => (s.kind === "hold" ? i : -1)).filter((i) => i >= 0);
    expect(holds.some((i) => i < firstWeld)).toBe(true);
    expect(holds.some((i) => i > firstWeld)).toBe(true);
    expect(steps.filter((s) => s.kind === "hold").every((s) => s.signedBy === "inspector")).toBe(true);
  });

  // SSPC-PA 2: spot readings may go to 80 % of the specified minimum and 120 % of the maximum.
  it("the coating procedure's spot limits are 80 % and 120 % of the 100–180 µm area range (SSPC-PA 2)", () => {
    const dft = starterTemplate("coat-repaired-area").content.sections.flatMap((s) => s.steps).find((s) => s.key === "coat-total-dft");
    expect(dft?.kind === "measure" && dft.tolerance).toEqual({ type: "range", min: 80, max: 216 });
  });

  it("the combined procedure runs the five procedures' sections in order and stays in step with them (npx tsx lib/procedures/write-combined.ts)", () => {
    const combined = combineProcedures(COMBINED_TITLE, COMBINED_CODE, COMBINED_PARTS.map(starterTemplate));
    const file = starterTemplate("lateral-link-bracket-start-to-finish");
    expect(file.procedure).toEqual({ title: combined.title, scope: combined.scope, code: combined.code });
    expect(file.content).toEqual(combined.content);
    expect(file.content.sections[0]!.title).toMatch(/^Part 1 · /);
    expect(file.content.sections.at(-1)!.title).toMatch(/^Part 5 · /);
  });
});
