import type { Config } from "tailwindcss";

// Shoal's own palette: water greens for the main actions, a warm reed ochre for
// highlights, silt neutrals for text and surfaces. Shades were picked so that
// text on surfaces meets WCAG 2.2 AA contrast (4.5:1 for body text).
const config: Config = {
  content: ["./app/**/*.{ts,tsx}", "./components/**/*.{ts,tsx}"],
  theme: {
    extend: {
      colors: {
        lagoon: {
          50: "#eef8f6",
          100: "#d3eee9",
          200: "#a7dcd3",
          300: "#72c3b7",
          400: "#3fa597",
          500: "#23877b",
          600: "#176d64",
          700: "#135851",
          800: "#114742",
          900: "#0d3733",
          950: "#062220",
        },
        reed: {
          50: "#fdf7ec",
          100: "#f9e8c9",
          200: "#f2d08f",
          300: "#e9b356",
          400: "#de9730",
          500: "#c27a1c",
          600: "#9d5f16",
          700: "#7a4815",
          800: "#5f3915",
          900: "#4b2e13",
        },
        silt: {
          50: "#f7f6f3",
          100: "#ecebe5",
          200: "#d9d6cb",
          300: "#bdb8a8",
          400: "#9a9482",
          // Darkened from #7b7565 so small grey text also reaches 4.5:1 on the page ground (silt-50) and lagoon-50.
          500: "#757060",
          600: "#615c4f",
          700: "#4d4940",
          800: "#3a3731",
          900: "#26241f",
          950: "#171612",
        },
        clay: {
          50: "#fdf2f0",
          100: "#fbe1dc",
          500: "#c4452f",
          600: "#a73521",
          700: "#862a1b",
        },
      },
      fontFamily: {
        sans: ["var(--font-body)", "system-ui", "sans-serif"],
        display: ["var(--font-display)", "var(--font-body)", "system-ui", "sans-serif"],
      },
      // A modular type scale (ratio ~1.2) tuned for small phone screens.
      fontSize: {
        "2xs": ["0.6875rem", { lineHeight: "1rem" }],
        xs: ["0.75rem", { lineHeight: "1.1rem" }],
        sm: ["0.875rem", { lineHeight: "1.3rem" }],
        base: ["1rem", { lineHeight: "1.55rem" }],
        lg: ["1.2rem", { lineHeight: "1.75rem" }],
        xl: ["1.44rem", { lineHeight: "1.95rem" }],
        "2xl": ["1.728rem", { lineHeight: "2.2rem" }],
        "3xl": ["2.074rem", { lineHeight: "2.5rem" }],
        "4xl": ["2.488rem", { lineHeight: "2.9rem" }],
      },
      borderRadius: {
        card: "0.875rem",
      },
      boxShadow: {
        card: "0 1px 2px rgb(23 22 18 / 0.06), 0 4px 16px rgb(23 22 18 / 0.06)",
      },
    },
  },
};

export default config;
