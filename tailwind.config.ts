// Loomwright's visual identity: warm paper, slate ink, a copper accent, and plain signal colours.
import type { Config } from "tailwindcss";

const config: Config = {
  content: ["./app/**/*.{ts,tsx}", "./components/**/*.{ts,tsx}", "./lib/client/**/*.{ts,tsx}"],
  theme: {
    extend: {
      colors: {
        paper: { DEFAULT: "#f7f5f0", deep: "#ece8df" },
        ink: { DEFAULT: "#1d2433", soft: "#4a5366", faint: "#7b8496" },
        copper: { DEFAULT: "#b5541c", dark: "#8f3f12", light: "#f3dccb" },
        line: { DEFAULT: "#d9d4c8", strong: "#b9b2a3" },
        pass: { DEFAULT: "#1f7a4d", light: "#dcefe4" },
        warn: { DEFAULT: "#9a6400", light: "#f8ecd0" },
        fail: { DEFAULT: "#b42318", light: "#f9dedb" },
      },
      fontFamily: {
        sans: ["var(--font-inter)", "system-ui", "sans-serif"],
        mono: ["var(--font-mono)", "ui-monospace", "monospace"],
      },
      fontSize: {
        // The type scale: 12 / 14 / 16 / 20 / 25 / 31 px (a 1.25 ratio from 16).
        xs: ["0.75rem", { lineHeight: "1rem" }],
        sm: ["0.875rem", { lineHeight: "1.25rem" }],
        base: ["1rem", { lineHeight: "1.5rem" }],
        lg: ["1.25rem", { lineHeight: "1.75rem" }],
        xl: ["1.5625rem", { lineHeight: "2rem" }],
        "2xl": ["1.953rem", { lineHeight: "2.4rem" }],
      },
    },
  },
};

export default config;
