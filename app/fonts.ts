import localFont from "next/font/local";

// Subset to the characters the screens use (scripts/subset-fonts.ts). Two weights: font-bold falls to 600.
// Only the text face is preloaded (two files); fallbacks are metric-adjusted so the swap moves nothing.
export const textFace = localFont({
  variable: "--font-text",
  display: "swap",
  adjustFontFallback: "Arial",
  src: [
    { path: "../public/fonts/inter-latin-400-normal.woff2", weight: "400", style: "normal" },
    { path: "../public/fonts/inter-latin-600-normal.woff2", weight: "600", style: "normal" },
  ],
});

export const figureFace = localFont({
  variable: "--font-figures",
  display: "swap",
  preload: false,
  adjustFontFallback: "Arial",
  src: [
    { path: "../public/fonts/ibm-plex-mono-latin-400-normal.woff2", weight: "400", style: "normal" },
    { path: "../public/fonts/ibm-plex-mono-latin-600-normal.woff2", weight: "600", style: "normal" },
  ],
});
