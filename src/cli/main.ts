#!/usr/bin/env node
/** Process entry of the `cellwright` bin. */
import { processIo } from "./cliIo.js";
import { runCli } from "./run.js";

runCli(process.argv.slice(2), processIo()).then(
  (code) => {
    process.exitCode = code;
  },
  (err) => {
    process.stderr.write(`internal error: ${(err as Error)?.message ?? String(err)}\n`);
    process.exitCode = 3;
  },
);
