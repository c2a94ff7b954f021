import { defineConfig } from "vitest/config";

// Tests run without the React Router Vite plugin; the global setup builds and serves the real
// app instead (tests/support/global-stack.ts). Projects: unit (pure), integration (real PostgreSQL), e2e (Chromium),
// faults (a stack of its own, broken on purpose), start (the start command from a fresh clone), and hostile
// (generated bad input against the served app; runs after the others, one file at a time, so the row counts
// it compares are its own and the connections it cuts serve nobody else).
export default defineConfig({
  resolve: { tsconfigPaths: true },
  test: {
    reporters: ["default", ["json", { outputFile: ".data/test-report.json" }]],
    globalSetup: ["tests/support/global-stack.ts"],
    // Node 20 is this project's platform; the storage SDK's notice about its future needs is not news.
    env: { AWS_SDK_JS_NODE_VERSION_SUPPORT_WARNING_DISABLED: "true" },
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
          // Generous: on a busy machine a test may take several times its usual time; tests wait for
          // states, so these only bound a test that hangs.
          testTimeout: 180_000,
          hookTimeout: 180_000,
        },
      },
      {
        extends: true,
        test: {
          name: "e2e",
          include: ["tests/e2e/**/*.test.ts"],
          setupFiles: ["tests/support/console-guard.ts"],
          testTimeout: 300_000,
          hookTimeout: 300_000,
          fileParallelism: false,
        },
      },
      {
        extends: true,
        test: {
          // Faults on a stack of its own: the server killed, PostgreSQL restarted, search gone.
          name: "faults",
          include: ["tests/faults/**/*.test.ts"],
          setupFiles: ["tests/support/console-guard.ts"],
          testTimeout: 300_000,
          hookTimeout: 300_000,
        },
      },
      {
        extends: true,
        test: {
          // The README's start command from a fresh clone: several starts, each a minute or two on a busy machine.
          name: "start",
          include: ["tests/start/**/*.test.ts"],
          setupFiles: ["tests/support/console-guard.ts"],
          testTimeout: 1_200_000,
          hookTimeout: 120_000,
        },
      },
      {
        extends: true,
        test: {
          name: "hostile",
          include: ["tests/hostile/**/*.test.ts"],
          setupFiles: ["tests/support/console-guard.ts"],
          testTimeout: 300_000,
          hookTimeout: 300_000,
          fileParallelism: false,
          sequence: { groupOrder: 1 },
        },
      },
    ],
  },
});
