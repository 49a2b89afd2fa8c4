// ESLint 9 flat config: Next's own rules (core web vitals) and TypeScript's recommended rules.
// The Next plugins do not support ESLint 10 yet, hence the pin to 9 in package.json.
import { defineConfig, globalIgnores } from "eslint/config";
import nextVitals from "eslint-config-next/core-web-vitals";
import nextTs from "eslint-config-next/typescript";

export default defineConfig([
  ...nextVitals,
  ...nextTs,
  {
    rules: {
      // A leading underscore marks a value left unused on purpose (a rest sibling, a callback slot).
      "@typescript-eslint/no-unused-vars": ["warn", { argsIgnorePattern: "^_", varsIgnorePattern: "^_", ignoreRestSiblings: true }],
    },
  },
  globalIgnores([".next/**", ".data/**", "node_modules/**", "public/sw.js", "public/swe-worker-*.js", "next-env.d.ts", "coverage/**"]),
]);
