import type { Config } from "tailwindcss";

/**
 * Arcwright's night palette: deep blue-black surfaces and dim, low-blue text so a screen at the
 * telescope does not spoil dark adaptation; one warm accent ("ember") for actions and one cool
 * accent ("glint") for computed values. Loaded by `app/globals.css` through `@config`.
 */
const config: Config = {
  content: ["./app/**/*.{ts,tsx}", "./components/**/*.{ts,tsx}"],
  theme: {
    extend: {
      colors: {
        void: { DEFAULT: "#0b0f17", raised: "#121826", edge: "#222b3d" },
        dusk: { DEFAULT: "#c9c2b4", dim: "#8f8a80" },
        ember: { DEFAULT: "#e0894a", strong: "#f0a266" },
        glint: { DEFAULT: "#7fb7c9", strong: "#a3d2e0" },
        alarm: "#ef6f6c",
      },
      fontFamily: {
        sans: ['"Source Sans 3"', "system-ui", "sans-serif"],
      },
    },
  },
};

export default config;
