import { describe, expect, it } from "vitest";
import { bufferIo } from "../../src/cli/cliIo.js";
import { EXIT_INPUT, EXIT_OK, runCli } from "../../src/cli/run.js";
import { expectClose } from "../helpers/close.js";

async function run(argv: string[]) {
  const io = bufferIo();
  const code = await runCli(argv, io);
  return { code, out: io.out(), err: io.err() };
}

describe("cellwright material", () => {
  it("--list --json prints every row with its source", async () => {
    const r = await run(["material", "--list", "--json"]);
    expect(r.code).toBe(EXIT_OK);
    const j = JSON.parse(r.out);
    expect(j.materials.length).toBeGreaterThanOrEqual(25);
    for (const m of j.materials) expect(typeof m.source).toBe("string");
    expect(r.err).toBe("");
  });

  it("--list --class metal filters; human output is a table", async () => {
    const r = await run(["material", "--list", "--class", "metal"]);
    expect(r.code).toBe(EXIT_OK);
    expect(r.out).toMatch(/^id\s+class\s+model/);
    expect(r.out).toMatch(/\ngold\s+metal\s+drude/);
    expect(r.out).not.toMatch(/\nptfe/);
    const bad = await run(["material", "--list", "--class", "metals"]);
    expect(bad.code).toBe(EXIT_INPUT);
    expect(bad.err).toMatch(/--class: expected one of polymer/);
  });

  it("ID --frequency --json gives ε, tan δ, n, inRange and source (PTFE at 10 GHz: Riddle et al. 2003, 2.05 / 0.0002)", async () => {
    const r = await run(["material", "ptfe", "--frequency", "10 GHz", "--json"]);
    expect(r.code).toBe(EXIT_OK);
    const j = JSON.parse(r.out);
    expect(Object.keys(j)).toEqual(expect.arrayContaining(["id", "frequencyHz", "eps", "lossTangent", "n", "inRange", "source"]));
    expect(j.id).toBe("ptfe");
    expectClose(j.frequencyHz, 1e10, { rel: 1e-12 });
    expectClose(j.eps.re, 2.05, { rel: 1e-12 });
    expectClose(j.lossTangent, 0.0002, { rel: 1e-9 });
    expectClose(j.n.re, Math.sqrt(2.05), { rel: 1e-7 });
    expect(j.inRange).toBe(true);
    expect(r.err).toBe("");
  });

  it("--wavelength evaluates optical rows (Malitson 1965: n(587.6 nm) = 1.45846)", async () => {
    const r = await run(["material", "fused-silica-optical", "--wavelength", "587.6 nm", "--json"]);
    expect(r.code).toBe(EXIT_OK);
    expectClose(JSON.parse(r.out).n.re, 1.45846, { abs: 5e-6 });
  });

  it("a frequency outside the model's range is a warning on stderr, inRange false, exit 0", async () => {
    const r = await run(["material", "fused-silica-optical", "--frequency", "10 GHz", "--json"]);
    expect(r.code).toBe(EXIT_OK);
    expect(JSON.parse(r.out).inRange).toBe(false);
    expect(r.err).toMatch(/^warning: fused-silica-optical: 10 GHz is outside the valid range/);
  });

  it("ID alone shows the row; human evaluation names the range status", async () => {
    const row = await run(["material", "gold"]);
    expect(row.code).toBe(EXIT_OK);
    expect(row.out).toMatch(/model\s+drude: eps_inf=1; plasma_hz=/);
    expect(row.out).toMatch(/DC σ\s+41000000 S\/m/);
    const ev = await run(["material", "water", "--frequency", "1 GHz"]);
    expect(ev.out).toMatch(/range\s+inside/);
  });

  it("bad input: unknown id with suggestions, bad frequency, both --list and an id", async () => {
    const unknown = await run(["material", "ptf", "--frequency", "1 GHz"]);
    expect(unknown.code).toBe(EXIT_INPUT);
    expect(unknown.err).toMatch(/unknown material 'ptf'; did you mean ptfe/);
    const badF = await run(["material", "ptfe", "--frequency", "3 mm"]);
    expect(badF.code).toBe(EXIT_INPUT);
    expect(badF.err).toMatch(/--frequency: expected a frequency/);
    const zero = await run(["material", "ptfe", "--frequency", "0"]);
    expect(zero.code).toBe(EXIT_INPUT);
    expect(zero.err).toMatch(/--frequency: expected a frequency > 0/);
    const both = await run(["material", "ptfe", "--list"]);
    expect(both.code).toBe(EXIT_INPUT);
    const none = await run(["material"]);
    expect(none.code).toBe(EXIT_INPUT);
    expect(none.err).toMatch(/expected a material id or --list/);
  });
});
