import typography from "@tailwindcss/typography";
import type { Config } from "tailwindcss";

// Benchplate's palette: warm paper, graphite ink, a copper accent for heat and a verdigris for measured figures.
const config = {
  content: ["./app/**/*.{ts,tsx}", "./components/**/*.{ts,tsx}", "./content/**/*.mdx"],
  theme: {
    extend: {
      colors: {
        paper: { DEFAULT: "#f6f3ec", raised: "#fffdf8", sunk: "#ebe6da" },
        ink: { DEFAULT: "#1f232b", soft: "#454b57", faint: "#5c6270" },
        rule: "#d6cfbf",
        copper: { DEFAULT: "#a5481f", deep: "#7c3414", wash: "#f3e1d4" },
        verdigris: { DEFAULT: "#2c6e68", deep: "#1d4f4a", wash: "#dcebe7" },
        verdict: {
          meets: "#2d6a3e",
          above: "#a5481f",
          below: "#30509a",
          inconclusive: "#7a6420",
        },
      },
      fontFamily: {
        serif: ['"Source Serif 4"', "Georgia", "serif"],
        sans: ['"Public Sans"', "system-ui", "sans-serif"],
        mono: ['"IBM Plex Mono"', "ui-monospace", "monospace"],
      },
      fontSize: {
        "display": ["2.75rem", { lineHeight: "1.1", letterSpacing: "-0.01em" }],
      },
    },
  },
  plugins: [typography],
} satisfies Config;

export default config;
