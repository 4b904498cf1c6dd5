// One linter for the whole repository. Rules of direction (CONVENTIONS.md) are enforced here.
import js from "@eslint/js";
import tseslint from "typescript-eslint";
import reactHooks from "eslint-plugin-react-hooks";
import { createNodeResolver, importX } from "eslint-plugin-import-x";
import { readdirSync } from "node:fs";
import globals from "globals";

const restrict = (patterns) => ["error", { patterns }];
const noServer = {
  group: ["**/server/**", "../server", "../../server"],
  message: "The client never imports server code.",
};
const features = readdirSync("src/features");

// A feature never imports another feature or src/app: routes in src/app compose them.
const featureBlocks = features.map((feature) => ({
  files: [`src/features/${feature}/**/*.{ts,tsx}`],
  rules: {
    "no-restricted-imports": restrict([
      noServer,
      {
        regex: `^(\\.\\./)+(features/)?(?!${feature}/)(${features.join("|")})/`,
        message: "A feature never imports another feature: compose them in src/app.",
      },
      { regex: "^(\\.\\./)+app/", message: "Features never import src/app." },
    ]),
  },
}));

export default tseslint.config(
  {
    ignores: [
      "node_modules",
      "dist",
      ".equipot",
      "drizzle",
      "coverage",
      "test-artifacts",
      "bench/.build",
    ],
  },
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
      "import-x/no-cycle": ["error", { ignoreExternal: true }],
    },
    settings: {
      "import-x/resolver-next": [createNodeResolver({ extensions: [".ts", ".tsx", ".js"] })],
    },
  },
  {
    files: ["src/**/*.{ts,tsx}"],
    plugins: { "react-hooks": reactHooks },
    rules: {
      ...reactHooks.configs.recommended.rules,
      "no-restricted-imports": restrict([noServer]),
    },
  },
  ...featureBlocks,
  {
    files: ["src/{lib,components,config,db,sync}/**/*.{ts,tsx}"],
    rules: {
      "no-restricted-imports": restrict([
        noServer,
        {
          regex: "^(\\.\\./)+(features|app)/",
          message: "Shared client code never imports features or src/app.",
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
