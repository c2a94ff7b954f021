import { defineConfig } from "vitest/config";

// Tests run without the React Router Vite plugin; the global setup builds and serves the real
// app instead (tests/support/global-stack.ts). Four projects: unit (pure), integration (real PostgreSQL), e2e (Chromium),
// hostile (generated bad input against the served app; runs after the others, one file at a time, so the
// row counts it compares are its own and the connections it cuts serve nobody else).
export default defineConfig({
  resolve: { tsconfigPaths: true },
  test: {
    reporters: ["default", ["json", { outputFile: ".data/test-report.json" }]],
    globalSetup: ["tests/support/global-stack.ts"],
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
          setupFiles: ["tests/support/console-guard.ts"],
          testTimeout: 40_000,
          hookTimeout: 60_000,
        },
      },
      {
        extends: true,
        test: {
          name: "e2e",
          include: ["tests/e2e/**/*.test.ts"],
          setupFiles: ["tests/support/console-guard.ts"],
          testTimeout: 60_000,
          hookTimeout: 120_000,
          fileParallelism: false,
        },
      },
      {
        extends: true,
        test: {
          name: "hostile",
          include: ["tests/hostile/**/*.test.ts"],
          setupFiles: ["tests/support/console-guard.ts"],
          testTimeout: 120_000,
          hookTimeout: 60_000,
          fileParallelism: false,
          sequence: { groupOrder: 1 },
        },
      },
    ],
  },
});
