// `npx tsx scripts/subset-fonts.ts`: cuts the web fonts in public/fonts down to the characters Gusset shows.
// The full files come from @fontsource (a dev dependency); the subsets are committed. Run again after adding
// words with a character not yet covered (a new symbol in a label, say). The .woff files beside them stay
// whole: the PDF traveller embeds them and prints names and notes people typed.
//
// Needs fontTools and brotli for Python (Debian: python3-fonttools python3-brotli).
import { spawnSync } from "node:child_process";
import fs from "node:fs";
import path from "node:path";

const root = path.resolve(import.meta.dirname, "..");
const SOURCES = ["app", "components", "lib", "templates", "db/seed"];
const EXTENSIONS = new Set([".ts", ".tsx", ".md", ".json", ".css"]);

/** The web faces and weights the screens use (tailwind's font-semibold and font-bold; bold falls to 600). */
const FACES = [
  { pkg: "@fontsource/inter", file: "inter-latin-400-normal.woff2" },
  { pkg: "@fontsource/inter", file: "inter-latin-600-normal.woff2" },
  { pkg: "@fontsource/ibm-plex-mono", file: "ibm-plex-mono-latin-400-normal.woff2" },
  { pkg: "@fontsource/ibm-plex-mono", file: "ibm-plex-mono-latin-600-normal.woff2" },
];

function walk(dir: string, out: string[]) {
  if (!fs.existsSync(dir)) return;
  for (const entry of fs.readdirSync(dir, { withFileTypes: true })) {
    const full = path.join(dir, entry.name);
    if (entry.isDirectory()) walk(full, out);
    else if (EXTENSIONS.has(path.extname(entry.name))) out.push(full);
  }
}

/** Code points to keep: printable ASCII and Latin-1 (names typed by people) plus every other one in the sources. */
export function usedCodePoints(): number[] {
  const points = new Set<number>();
  for (let c = 0x20; c <= 0x7e; c++) points.add(c);
  for (let c = 0xa0; c <= 0xff; c++) points.add(c);
  const files: string[] = [];
  for (const d of SOURCES) walk(path.join(root, d), files);
  for (const f of files) {
    for (const ch of fs.readFileSync(f, "utf8")) {
      const c = ch.codePointAt(0)!;
      // Skip controls, private use and emoji-range pictographs no UI text uses.
      if (c > 0xff && c < 0xe000 && !(c >= 0xd800 && c <= 0xdfff)) points.add(c);
    }
  }
  return [...points].sort((a, b) => a - b);
}

function main() {
  const points = usedCodePoints();
  const unicodes = points.map((c) => `U+${c.toString(16).toUpperCase().padStart(4, "0")}`).join(",");
  for (const face of FACES) {
    const input = path.join(root, "node_modules", face.pkg, "files", face.file);
    const output = path.join(root, "public/fonts", face.file);
    const r = spawnSync(
      "/usr/bin/python3",
      ["-m", "fontTools.subset", input, `--unicodes=${unicodes}`, "--flavor=woff2", `--output-file=${output}`, "--layout-features=kern,liga,calt,tnum,cv11,case", "--no-hinting", "--desubroutinize"],
      { stdio: "inherit" },
    );
    if (r.status !== 0) throw new Error(`subsetting ${face.file} failed`);
    console.log(`${face.file}: ${fs.statSync(input).size} → ${fs.statSync(output).size} bytes`);
  }
  console.log(`${points.length} characters kept`);
}

main();
