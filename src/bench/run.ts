/**
 * `npm run bench`: timings of the hot paths, outside the test run. Each bench module prints its
 * own lines; nothing here decides pass or fail. `npm run bench -- WORDS…` runs only the benches
 * whose name holds one of the words ("writer", "plan", "verify").
 */
const benches: { name: string; module: string; fn: string }[] = [
  { name: "tensor engine", module: "./fieldBench.js", fn: "fieldBench" },
  { name: "polygon regions (even-odd row fill)", module: "./polygonBench.js", fn: "polygonBench" },
  { name: "build-list writer against the disk", module: "./buildListBench.js", fn: "buildListBench" },
  { name: "whole plan", module: "./planBench.js", fn: "planBench" },
  { name: "rect-lattice fill tables (solved on first use)", module: "./rectTableBench.js", fn: "rectTableBench" },
  { name: "verify solver (sparse direct, nested dissection)", module: "./solverBench.js", fn: "solverBench" },
  { name: "verify of each demo (default accuracy)", module: "./verifyBench.js", fn: "verifyBench" },
  { name: "verify --sweep on worker threads", module: "./sweepBench.js", fn: "sweepBench" },
];

const log = (line: string): void => {
  process.stdout.write(`${line}\n`);
};

async function main(): Promise<void> {
  log(`cellwright bench — node ${process.version}, ${new Date().toISOString()}`);
  // what the cellwright command runs with (its first line): malloc's large blocks on huge pages
  log(`GLIBC_TUNABLES=${process.env.GLIBC_TUNABLES ?? "(unset: 4 KiB pages; the cellwright command asks for huge pages)"}`);
  const words = process.argv.slice(2).map((w) => w.toLowerCase());
  for (const b of benches.filter((x) => words.length === 0 || words.some((w) => x.name.includes(w)))) {
    log("");
    log(`== ${b.name}`);
    let mod: Record<string, unknown>;
    try {
      mod = await import(b.module);
    } catch {
      log(`(not available: ${b.module})`);
      continue;
    }
    const fn = mod[b.fn] as ((l: (s: string) => void) => Promise<void>) | undefined;
    if (typeof fn !== "function") {
      log(`(no ${b.fn} in ${b.module})`);
      continue;
    }
    await fn(log);
  }
}

main().catch((err) => {
  process.stderr.write(`bench failed: ${(err as Error).stack ?? String(err)}\n`);
  process.exitCode = 1;
});
