#!/usr/bin/env -S GLIBC_TUNABLES=glibc.malloc.hugetlb=1 node
/**
 * Process entry of the `cellwright` bin.
 *
 * The first line starts node with glibc's malloc asking the kernel for transparent huge pages
 * (2 MiB) for its large blocks (`madvise` mode, the default of many kernels, grants them only on
 * request). A 10⁶-cell plan writes about 200 MiB of fresh per-cell arrays; with 4 KiB pages that is
 * 50 000 page faults, and on a virtual machine each can cost 10–15 µs. Measured on the project's
 * 2-core VM: the whole 10⁶-cell plan takes about a fifth less CPU (DEVELOPERS.md, Speed). Where
 * glibc or the kernel does not know the setting it is ignored (same bytes, same results).
 */
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
