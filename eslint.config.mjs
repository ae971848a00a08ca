import { defineConfig, globalIgnores } from "eslint/config";
import nextVitals from "eslint-config-next/core-web-vitals";
import nextTs from "eslint-config-next/typescript";
import drizzle from "eslint-plugin-drizzle";

export default defineConfig([
  ...nextVitals,
  ...nextTs,
  globalIgnores([".next/**", ".next*/**", ".data/**", "node_modules/**", "next-env.d.ts", "test-results/**", "playwright-report/**", "db/migrations/**"]),
  {
    plugins: { drizzle },
    rules: {
      // An update or delete without `where` would touch every row of a table.
      "drizzle/enforce-delete-with-where": ["error", { drizzleObjectName: ["db", "tx"] }],
      "drizzle/enforce-update-with-where": ["error", { drizzleObjectName: ["db", "tx"] }],
      "@typescript-eslint/no-unused-vars": ["error", { argsIgnorePattern: "^_", varsIgnorePattern: "^_" }],
    },
  },
  {
    // The floors import only downward: routes (app/) → workflows → db/ (schema, SQL) and lib/ (pure rules).
    // Shared UI (components/) sits beside the routes and never reaches into them. docs/architecture.md.
    rules: {
      "import/no-restricted-paths": [
        "error",
        {
          zones: [
            { target: ["./db", "./lib"], from: "./app", message: "db/ and lib/ sit below the routes: move the shared piece into lib/<domain>." },
            { target: ["./db", "./lib"], from: "./components", message: "db/ and lib/ never import UI: move the shared pure piece into lib/." },
            { target: "./components", from: "./app", message: "components/ never import from a route: move the shared piece into lib/ or components/." },
          ],
        },
      ],
    },
  },
  {
    // A cycle between query or domain modules hides which one owns a rule. Checked where cycles were found;
    // the check walks every import, so it is kept off the larger UI folders.
    files: ["db/**", "lib/**"],
    rules: { "import/no-cycle": ["error", { ignoreExternal: true }] },
  },
  {
    // Tests read loosely typed JSON answers on purpose.
    files: ["tests/**"],
    rules: { "@typescript-eslint/no-explicit-any": "off" },
  },
]);
