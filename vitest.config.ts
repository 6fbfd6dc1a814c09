import { fileURLToPath } from "node:url";
import { defineConfig } from "vitest/config";

const root = fileURLToPath(new URL(".", import.meta.url));

export default defineConfig({
  resolve: { alias: { "@": root, "server-only": `${root}tests/support/server-only.ts` } },
  test: {
    projects: [
      // Property tests run the simulator hundreds of times; on a loaded two-core machine that takes
      // longer than vitest's 5 s default, which is not what these tests are about.
      { extends: true, test: { name: "unit", include: ["tests/unit/**/*.test.ts"], environment: "node", testTimeout: 60_000 } },
      {
        extends: true,
        test: {
          name: "integration",
          include: ["tests/integration/**/*.test.ts"],
          fileParallelism: false,
          testTimeout: 30_000,
          hookTimeout: 60_000,
        },
      },
      { extends: true, test: { name: "reference", include: ["tests/reference/**/*.test.ts"], testTimeout: 120_000 } },
      {
        extends: true,
        test: {
          name: "e2e",
          include: ["tests/e2e/**/*.test.ts"],
          fileParallelism: false,
          testTimeout: 90_000,
          hookTimeout: 240_000,
        },
      },
      {
        // Each file runs its own copy of the app (scripts/app-instance.ts) and stops parts of it.
        extends: true,
        test: {
          name: "faults",
          include: ["tests/faults/**/*.test.ts"],
          fileParallelism: false,
          testTimeout: 180_000,
          hookTimeout: 240_000,
        },
      },
    ],
  },
});
