import { defineConfig } from "vitest/config";

export default defineConfig({
  test: {
    include: ["test/**/*.test.ts"],
    testTimeout: 120_000,
    hookTimeout: 180_000,
    pool: "forks",
    // The shipped atlas, built once for every test that only reads it.
    globalSetup: ["test/helpers/globalSetup.ts"],
  },
});
