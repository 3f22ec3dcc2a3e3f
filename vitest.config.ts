import { defineConfig } from "vitest/config";

export default defineConfig({
  test: {
    include: ["tests/**/*.test.ts", "tests/**/*.test.tsx"],
    testTimeout: 60_000,
    hookTimeout: 60_000,
    pool: "forks",
    // the run gets its own temporary folder (TMPDIR, inherited by workers and spawned commands);
    // anything a test leaves in it fails the run (tests/setup/runTempDir.ts, tests/helpers/tempDir.ts)
    globalSetup: ["tests/setup/runTempDir.ts"],
    // the STL reader's helper package ships ES modules with extensionless imports, which Node's
    // loader refuses; vite's resolver (inline) takes them
    server: { deps: { inline: ["@amandaghassaei/stl-parser", "@amandaghassaei/3d-mesh-utils"] } },
    reporters: process.env.CELLWRIGHT_JSON_REPORT
      ? ["default", ["json", { outputFile: process.env.CELLWRIGHT_JSON_REPORT }]]
      : ["default"],
  },
});
