import type { Config } from "tailwindcss";

// Turnstone's palette: shingle greys, a deep tideline teal for actions, a lichen green for
// gains, a rust for losses and a sand highlight. Pairs used for text meet WCAG AA contrast.
const config: Config = {
  content: ["./app/**/*.{ts,tsx}", "./components/**/*.{ts,tsx}"],
  theme: {
    extend: {
      colors: {
        shingle: { 50: "#f6f5f2", 100: "#ebe9e3", 200: "#d6d3ca", 400: "#9a968a", 600: "#5f5c53", 800: "#34322d", 900: "#1f1e1b" },
        tideline: { 50: "#eef6f6", 100: "#d3e9e9", 600: "#1d6a6a", 700: "#155555", 800: "#0f4040" },
        lichen: { 100: "#e4efd8", 700: "#3f6b1f" },
        rust: { 100: "#f6e1d8", 700: "#9a3412" },
        sand: { 100: "#fbf1d9", 300: "#f0cf7a", 800: "#6b4d0a" },
      },
      fontFamily: { sans: ["var(--font-body)", "system-ui", "sans-serif"] },
      minHeight: { tap: "2.75rem" },
      minWidth: { tap: "2.75rem" },
    },
  },
};

export default config;
