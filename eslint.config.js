// One linter for the whole repository. Rules of direction (CONVENTIONS.md) are enforced here.
import js from "@eslint/js";
import tseslint from "typescript-eslint";
import reactHooks from "eslint-plugin-react-hooks";
import { importX } from "eslint-plugin-import-x";
import globals from "globals";

const restrict = (patterns) => ["error", { patterns }];

export default tseslint.config(
  { ignores: ["node_modules", "dist", ".equipot", "drizzle", "coverage", "test-artifacts"] },
  js.configs.recommended,
  ...tseslint.configs.strict,
  {
    languageOptions: {
      ecmaVersion: 2023,
      sourceType: "module",
      globals: { ...globals.browser, ...globals.node },
    },
    plugins: { "import-x": importX },
    rules: {
      "@typescript-eslint/no-explicit-any": "error",
      "@typescript-eslint/ban-ts-comment": "error",
      "@typescript-eslint/no-unused-vars": [
        "error",
        { argsIgnorePattern: "^_", varsIgnorePattern: "^_" },
      ],
      "import-x/no-cycle": "error",
    },
    settings: { "import-x/resolver": { node: { extensions: [".ts", ".tsx", ".js"] } } },
  },
  {
    files: ["src/**/*.{ts,tsx}"],
    plugins: { "react-hooks": reactHooks },
    rules: {
      ...reactHooks.configs.recommended.rules,
      "no-restricted-imports": restrict([
        {
          group: ["**/server/**", "../server", "../../server"],
          message: "The client never imports server code.",
        },
      ]),
    },
  },
  {
    files: ["shared/**/*.ts"],
    rules: {
      "no-restricted-imports": restrict([
        {
          group: ["**/src/**", "**/server/**"],
          message: "shared/ imports neither src/ nor server/.",
        },
        {
          group: [
            "express",
            "pg",
            "drizzle-orm",
            "drizzle-orm/*",
            "react",
            "react-dom",
            "dexie",
            "node:*",
          ],
          message: "shared/ stays free of I/O and UI.",
        },
      ]),
    },
  },
  {
    files: ["server/**/*.ts"],
    rules: {
      "no-restricted-imports": restrict([
        { group: ["**/src/**"], message: "server/ never imports src/." },
      ]),
    },
  },
);
