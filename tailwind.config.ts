import type { Config } from "tailwindcss";

// Gusset's identity: graphite neutrals, a primer yellow-green accent, and a heat-tint scale
// (straw → bronze → purple → blue) used only for heat-input gauges, always with a word beside it.
const config: Config = {
  content: ["./app/**/*.{ts,tsx}", "./components/**/*.{ts,tsx}"],
  theme: {
    extend: {
      colors: {
        graphite: {
          50: "#f4f5f4",
          100: "#e7e9e8",
          200: "#cdd1cf",
          300: "#a8aeab",
          400: "#7b8380",
          500: "#58605d",
          600: "#424946",
          700: "#303634",
          800: "#222725",
          900: "#171b1a",
          950: "#0e1110",
        },
        primer: {
          100: "#f1f6cf",
          200: "#e2ec9c",
          300: "#d3e26b",
          400: "#c3d543",
          500: "#aec22b",
          600: "#889a1d",
          700: "#5f6c12",
          800: "#46500c",
          900: "#2f3608",
        },
        tint: { straw: "#d8b45a", bronze: "#a4652c", purple: "#6a3f9e", blue: "#2d5aa6" },
        // Text on its own background is at least 7:1 (WCAG 2.x AAA) for shop glare.
        verdict: { fail: "#8a1c14", failbg: "#fbe9e7", warn: "#654400", warnbg: "#fdf1d6", pass: "#2f4a08", passbg: "#eef5d6" },
      },
      fontFamily: {
        sans: ["var(--font-text)", "system-ui", "sans-serif"],
        mono: ["var(--font-figures)", "ui-monospace", "monospace"],
      },
      minHeight: { touch: "48px" },
      minWidth: { touch: "48px" },
    },
  },
};

export default config;
