// `npm run bench`: runs every benchmark module listed below and prints its figures.
// A module that is not there yet (another developer's, still to come) is skipped with a note; a module
// that is there but fails, or misses its target, makes the run exit non-zero.
import fs from "node:fs";
import path from "node:path";
import { pathToFileURL } from "node:url";

type Figure = { name: string; ms: number; detail?: string; targetMs?: number };

/** The one list of benchmark modules: file beside this one, the function it exports, its target. */
const BENCHES: { file: string; fn: string; targetMs?: number }[] = [
  // DESIGN.md: 1,000 heave points × 50 candidate holes under 20 ms.
  { file: "geometry.ts", fn: "benchGeometry", targetMs: 20 },
  // The best heights are worked out on every keystroke in the calculator: reported, no target set yet.
  { file: "geometry.ts", fn: "benchOptimum" },
  { file: "traveller.ts", fn: "benchTraveller" },
  // With 10,000 jobs, at most 3× the time at the demo's size (each figure carries its own target).
  { file: "quality.ts", fn: "benchQuality" },
];

function isFigure(x: unknown): x is Figure {
  return typeof x === "object" && x !== null && typeof (x as Figure).name === "string" && typeof (x as Figure).ms === "number";
}

async function main() {
  const here = import.meta.dirname;
  let failed = 0;
  for (const bench of BENCHES) {
    const file = path.join(here, bench.file);
    if (!fs.existsSync(file)) {
      console.log(`- ${bench.file}: not present, skipped`);
      continue;
    }
    try {
      const mod = (await import(pathToFileURL(file).href)) as Record<string, unknown>;
      const run = mod[bench.fn];
      if (typeof run !== "function") throw new Error(`${bench.file} does not export ${bench.fn}()`);
      const out: unknown = await run();
      const figures = (Array.isArray(out) ? out : [out]).filter(isFigure);
      if (figures.length === 0) {
        console.log(`- ${bench.fn}: ${JSON.stringify(out)}`);
        continue;
      }
      for (const f of figures) {
        const target = f.targetMs ?? bench.targetMs;
        const over = target !== undefined && f.ms > target;
        if (over) failed++;
        const verdict = target === undefined ? "" : over ? `  ✕ over the ${target} ms target` : `  ● within ${target} ms`;
        console.log(`- ${f.name}: ${f.ms.toFixed(3)} ms${f.detail ? ` (${f.detail})` : ""}${verdict}`);
      }
    } catch (error) {
      failed++;
      console.log(`- ${bench.file}: failed: ${(error as Error).message}`);
    }
  }
  process.exit(failed ? 1 : 0);
}

void main();
