// Lint: Next.js's recommended rules (core web vitals, TypeScript through typescript-eslint), the
// one-way layers of the code base, and no import cycles. Formatting is Prettier's job
// (eslint-config-prettier turns off the rules that would fight it).
import { defineConfig, globalIgnores } from "eslint/config";
import nextVitals from "eslint-config-next/core-web-vitals";
import nextTs from "eslint-config-next/typescript";
import prettier from "eslint-config-prettier/flat";

// Layers, outermost first: app → server → db and lib. components is the UI beside app: it may
// use lib (pure) but never the server layer or the database.
const layers = [
  {
    target: "./lib",
    from: ["./server", "./db", "./app", "./components"],
    message: "lib/ holds pure domain code: it imports neither the server layer, the database, nor the UI.",
  },
  { target: "./db", from: ["./server", "./app", "./components"], message: "db/ (schema, client, migrations, seed) imports only db/ and pure lib/." },
  { target: "./server", from: ["./app", "./components"], message: "The server layer never imports pages, route handlers or UI components." },
  { target: "./components", from: ["./server", "./db", "./app"], message: "UI components talk to the server over HTTP; their types come from lib/dto." },
  // Inside the server layer: data access queries and authorizes; it does not render, mail or run jobs.
  {
    target: "./server/access",
    from: ["./server/images", "./server/mail", "./server/jobs", "./server/http"],
    message: "Data access only reads and writes rows; rendering, mail and jobs call it, not the other way round.",
  },
];

export default defineConfig([
  ...nextVitals,
  ...nextTs,
  prettier,
  {
    settings: { "import/ignore": ["node_modules"] },
    rules: {
      "import/no-restricted-paths": ["error", { zones: layers }],
      "import/no-cycle": ["error", { ignoreExternal: true }],
      // A leading underscore marks a value taken on purpose and not used (a prop kept off the DOM).
      "@typescript-eslint/no-unused-vars": ["error", { argsIgnorePattern: "^_", varsIgnorePattern: "^_", ignoreRestSiblings: true }],
      // Small files, one job each.
      "max-lines": ["error", { max: 300 }],
      "react-hooks/exhaustive-deps": "error",
    },
  },
  {
    // Tests may reach across layers to set up what they check.
    files: ["**/*.test.ts", "tests/**", "scripts/**"],
    rules: { "import/no-restricted-paths": "off", "max-lines": "off" },
  },
  globalIgnores([".next/**", "node_modules/**", "storage/**", "test-results/**", "playwright-report/**", "next-env.d.ts", "db/migrations/**"]),
]);
