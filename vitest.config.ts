import { defineConfig } from "vitest/config";

// Three projects, one runner. "pure" needs nothing running (shared/ computations and their
// checks against published sources); "api" and "browser" need the test database cluster that
// scripts/test.sh starts, and "browser" also the built client.
export default defineConfig({
  test: {
    testTimeout: 20_000,
    hookTimeout: 120_000,
    projects: [
      { test: { name: "pure", include: ["tests/unit/**/*.test.{ts,tsx}", "tests/references/**/*.test.ts"] } },
      {
        test: {
          name: "api",
          include: ["tests/api/**/*.test.ts"],
          // a project does not inherit the root's timeouts; several suites at once on a small machine
          testTimeout: 20_000,
          globalSetup: ["tests/support/database-setup.ts"],
        },
      },
      {
        test: {
          name: "browser",
          include: ["tests/browser/**/*.test.ts"],
          globalSetup: ["tests/support/database-setup.ts"],
          fileParallelism: false,
          testTimeout: 60_000,
          // a project does not inherit the root's timeouts: seeding the demo takes more than the default 10 s on a busy machine
          hookTimeout: 120_000,
        },
      },
    ],
  },
});
