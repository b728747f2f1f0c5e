import type { Config } from "tailwindcss";

// Loaded by src/styles.css through `@config`, so these names are the utilities the client uses
// (bg-flux-900, text-anneal-600, font-display, text-h2 …). Colour pairs used for text were
// chosen for WCAG AA contrast: anneal-600 / flux-500 / nickel-600 and darker pass on white.
const config = {
  content: ["./index.html", "./src/**/*.{ts,tsx}"],
  theme: {
    extend: {
      colors: {
        // Deep blue-grey of cold-rolled sheet: structure, header, text.
        flux: {
          50: "#f3f6f9",
          100: "#e1e8ef",
          200: "#c5d2de",
          300: "#9fb2c4",
          400: "#7690a8",
          500: "#5a6f84",
          600: "#475a6e",
          700: "#384859",
          800: "#2a3949",
          900: "#1d2834",
          950: "#131b24",
        },
        // Furnace glow of the hydrogen anneal: primary actions and the mark's core.
        anneal: {
          50: "#fff5ec",
          100: "#ffe7d1",
          200: "#fdcba0",
          300: "#f9a867",
          400: "#f5873a",
          500: "#e66a17",
          600: "#b34a0c",
          700: "#923b0c",
          800: "#74310f",
          900: "#5c2a10",
        },
        // Bright-annealed nickel-iron: surfaces and borders.
        nickel: {
          50: "#f7f7f5",
          100: "#efefec",
          200: "#dfdfda",
          300: "#c6c6bf",
          400: "#a0a099",
          500: "#7b7c76",
          600: "#6a6c66",
          700: "#4f504b",
          800: "#383934",
          900: "#242521",
        },
        // Status colours always travel with an icon and a word (see StatusNote).
        ok: { 50: "#edf8f1", 200: "#b5e2c6", 700: "#1f7a45", 900: "#11432a" },
        caution: { 50: "#fdf6e3", 200: "#f3d88a", 700: "#8a5a00", 900: "#4d3300" },
        danger: { 50: "#fdf0ee", 200: "#f5bdb5", 700: "#b42318", 900: "#6b140d" },
      },
      fontFamily: {
        display: ['"Space Grotesk"', "ui-sans-serif", "system-ui", "sans-serif"],
        sans: ['"IBM Plex Sans"', "ui-sans-serif", "system-ui", "sans-serif"],
        mono: ['"IBM Plex Mono"', "ui-monospace", "SFMono-Regular", "Menlo", "monospace"],
      },
      // A 1.25 ratio from a 16px body; nothing a reader must read goes below 15px.
      fontSize: {
        meta: ["0.9375rem", { lineHeight: "1.45" }],
        body: ["1rem", { lineHeight: "1.6" }],
        lead: ["1.125rem", { lineHeight: "1.6" }],
        h4: ["1.25rem", { lineHeight: "1.4", fontWeight: "600" }],
        h3: ["1.5625rem", { lineHeight: "1.3", fontWeight: "600" }],
        h2: ["1.953rem", { lineHeight: "1.2", fontWeight: "600" }],
        h1: ["2.441rem", { lineHeight: "1.1", fontWeight: "600", letterSpacing: "-0.01em" }],
      },
      minHeight: { touch: "2.75rem" },
      minWidth: { touch: "2.75rem" },
      maxWidth: { page: "72rem" },
    },
  },
} satisfies Config;

export default config;
