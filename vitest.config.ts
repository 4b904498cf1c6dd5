import { defineConfig } from "vitest/config";

// Three tiers (CONVENTIONS.md): unit, integration (real PostgreSQL), e2e (real Chromium).
// The PostgreSQL cluster for tests is started once for the whole run by tests/setup/postgres.ts.
export default defineConfig({
  test: {
    globalSetup: ["tests/setup/postgres.ts"],
    projects: [
      {
        test: {
          name: "unit",
          include: ["tests/unit/**/*.test.{ts,tsx}"],
          environment: "node",
        },
      },
      {
        test: {
          name: "integration",
          include: ["tests/integration/**/*.test.ts"],
          environment: "node",
          testTimeout: 30_000,
          hookTimeout: 60_000,
        },
      },
      {
        test: {
          name: "e2e",
          include: ["tests/e2e/**/*.test.ts"],
          environment: "node",
          testTimeout: 120_000,
          hookTimeout: 120_000,
          fileParallelism: false,
        },
      },
    ],
  },
});
