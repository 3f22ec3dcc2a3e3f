/**
 * The functional core (core, field, reduce, media, cells, plan, verify, numerics) must not touch the world:
 * no file system, process, console, clock, ink or react. Only io/, cli/ and tui/ may.
 */
import { describe, it, expect } from "vitest";
import { readdirSync, readFileSync, statSync } from "node:fs";
import { join } from "node:path";

const ROOT = join(import.meta.dirname, "..", "..", "src");
const PURE = ["core", "field", "reduce", "media", "cells", "plan", "verify", "numerics"];

function files(dir: string): string[] {
  let out: string[] = [];
  // a missing folder is a failure, not an empty pass (readdirSync throws)
  const entries = readdirSync(dir);
  for (const e of entries) {
    const p = join(dir, e);
    if (statSync(p).isDirectory()) out = out.concat(files(p));
    else if (/\.tsx?$/.test(e)) out.push(p);
  }
  return out;
}

const FORBIDDEN: [RegExp, string][] = [
  [/from\s+["']node:/, "node: module import"],
  [/from\s+["'](fs|path|os|child_process|process)["']/, "node built-in import"],
  [/from\s+["'](ink|react|ink-testing-library)["']/, "ink/react import"],
  [/from\s+["'](\.\.\/)+(io|cli|tui)\//, "import from the shell (io/cli/tui)"],
  [/\bprocess\.(env|argv|exit|stdout|stderr|cwd)/, "process access"],
  [/\bconsole\.(log|error|warn|info)/, "console output"],
  [/\bDate\.now\(|new Date\(/, "clock access"],
  [/from\s+["']mathjs["']/, "static mathjs import (load it lazily at the edge)"],
];

describe("functional core stays pure", () => {
  for (const dir of PURE) {
    it(`src/${dir} imports nothing from the shell or the world`, () => {
      const problems: string[] = [];
      const list = files(join(ROOT, dir));
      expect(list.length, `src/${dir} holds no TypeScript file`).toBeGreaterThan(0);
      for (const f of list) {
        // Type-only imports are erased at compile time, so a core file may name a schema's type.
        const text = readFileSync(f, "utf8")
          .split("\n")
          .filter((line) => !/^\s*import\s+type\s/.test(line))
          .join("\n");
        for (const [re, what] of FORBIDDEN) {
          if (re.test(text)) problems.push(`${f.slice(ROOT.length + 1)}: ${what}`);
        }
      }
      expect(problems).toEqual([]);
    });
  }
});
