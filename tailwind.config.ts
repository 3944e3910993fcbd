// Sward's design tokens: the one place to change the look (PRODUCT.md "Screens").
// Every text/background pair used in the UI meets WCAG AA (checked in tests/unit/design-tokens.test.ts).
import type { Config } from "tailwindcss";

export const palette = {
  ink: "#18211b", // text
  paper: "#f7f5ef", // page background
  card: "#ffffff", // surfaces
  line: "#d9d4c7", // rules and borders
  muted: "#4f5a52", // secondary text (AA on paper and card)
  sward: { DEFAULT: "#2f6b3a", tint: "#e3efe0", deep: "#214d29" }, // primary actions, healthy
  sun: { DEFAULT: "#8f5e08", tint: "#f6ecd6" }, // caution, moderate
  clay: { DEFAULT: "#a8321f", tint: "#f7e1dc" }, // high severity, refusals
  rain: { DEFAULT: "#2a6496", tint: "#e0ebf5" }, // water, watering
} as const;

const config: Config = {
  content: ["./app/**/*.{ts,tsx}", "./components/**/*.{ts,tsx}", "./lib/**/*.{ts,tsx}"],
  theme: {
    extend: {
      colors: palette,
      fontFamily: {
        sans: ["var(--font-sward)", "system-ui", "sans-serif"],
      },
      minHeight: { tap: "44px" },
      minWidth: { tap: "44px" },
      maxWidth: { reading: "72rem" },
    },
  },
};

export default config;
