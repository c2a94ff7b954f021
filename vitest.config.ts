import { defineConfig } from "vitest/config";

// Tests run without the React Router Vite plugin; the end-to-end project builds and serves the
// real app instead. Three projects: unit (pure), integration (real PostgreSQL), e2e (Chromium).
export default defineConfig({
  resolve: { tsconfigPaths: true },
  test: {
    reporters: ["default", ["json", { outputFile: ".data/test-report.json" }]],
    projects: [
      {
        extends: true,
        test: { name: "unit", include: ["tests/unit/**/*.test.ts"], setupFiles: ["tests/support/console-guard.ts"] },
      },
      {
        extends: true,
        test: {
          name: "integration",
          include: ["tests/integration/**/*.test.ts"],
          globalSetup: ["tests/support/global-database.ts"],
          setupFiles: ["tests/support/console-guard.ts"],
          testTimeout: 20_000,
          hookTimeout: 60_000,
        },
      },
      {
        extends: true,
        test: {
          name: "e2e",
          include: ["tests/e2e/**/*.test.ts"],
          globalSetup: ["tests/support/global-app.ts"],
          setupFiles: ["tests/support/console-guard.ts"],
          testTimeout: 60_000,
          hookTimeout: 120_000,
          fileParallelism: false,
        },
      },
    ],
  },
});
