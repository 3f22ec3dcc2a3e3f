import { defineConfig } from "vitest/config";

export default defineConfig({
  test: {
    include: ["tests/**/*.test.ts", "tests/**/*.test.tsx"],
    testTimeout: 60_000,
    hookTimeout: 60_000,
    pool: "forks",
    reporters: process.env.CELLWRIGHT_JSON_REPORT
      ? ["default", ["json", { outputFile: process.env.CELLWRIGHT_JSON_REPORT }]]
      : ["default"],
  },
});
