// Child process for outputSet.test.ts: writes an output set of four files (content tagged with
// argv[3]) into argv[2] with the compiled writer, and at step number argv[4] prints the step
// name and blocks, so the parent can SIGKILL it exactly there. argv[4] = -1: run to the end.
import { writeOutputSet, prepareOutputFolder } from "../../dist/io/outputSet.js";
import { writeSync } from "node:fs";

const [dir, tag, stopText] = process.argv.slice(2);
const stopAt = Number(stopText);
const names = ["build-list.csv", "levels.csv", "report.md", "summary.json"];
const files = names.map((name, k) => ({
  name,
  async produce(write) {
    await write(`header,${tag}\n`);
    for (let r = 0; r < 200 * (k + 1); r++) await write(`${r},${tag}-${name}\n`);
  },
}));
let step = 0;
const folder = await prepareOutputFolder(dir, names);
await writeOutputSet(folder, files, {
  onStep(name) {
    if (step++ === stopAt) {
      writeSync(1, `${name}\n`);
      Atomics.wait(new Int32Array(new SharedArrayBuffer(4)), 0, 0); // block until killed
    }
  },
});
writeSync(1, "done\n");
