// Fonts for the traveller, registered once per process. react-pdf embeds (and subsets) registered
// fonts, which PDF/A needs. The .woff files in public/fonts are the source; they are unwrapped to plain
// OpenType in memory first (see ./woff for the fontkit fault that avoids) and handed over as data URLs.
import { readFileSync } from "node:fs";
import path from "node:path";
import { Font } from "@react-pdf/renderer";
import { woffToSfnt } from "./woff";

export const TEXT_FONT = "GussetText";
export const FIGURE_FONT = "GussetFigures";

let registered = false;

export function registerTravellerFonts(fontDir = path.join(process.cwd(), "public", "fonts")): void {
  if (registered) return;
  const file = (name: string) => `data:font/ttf;base64,${woffToSfnt(readFileSync(path.join(fontDir, name))).toString("base64")}`;
  Font.register({
    family: TEXT_FONT,
    fonts: [
      { src: file("inter-latin-400-normal.woff"), fontWeight: 400 },
      { src: file("inter-latin-500-normal.woff"), fontWeight: 500 },
      { src: file("inter-latin-600-normal.woff"), fontWeight: 600 },
      { src: file("inter-latin-700-normal.woff"), fontWeight: 700 },
    ],
  });
  Font.register({
    family: FIGURE_FONT,
    fonts: [
      { src: file("ibm-plex-mono-latin-400-normal.woff"), fontWeight: 400 },
      { src: file("ibm-plex-mono-latin-500-normal.woff"), fontWeight: 500 },
      { src: file("ibm-plex-mono-latin-600-normal.woff"), fontWeight: 600 },
    ],
  });
  // Record text must print exactly as signed: no hyphens inserted into names, VINs, hashes or URLs.
  Font.registerHyphenationCallback((word) => [word]);
  registered = true;
}
