/**
 * The session's plans (src/tui/planSession.ts through createSessionServices) check
 * `reduction.backgroundMaterial` as `cellwright plan` does, on the session's own thread and on its
 * worker thread (the compiled one the real session uses): a refused background makes the plan
 * request fail with the same InputError, which the session shows as it shows a design error. An
 * overriding background index from the session file is checked too, and named there. Design:
 * tests/verify/fixtures/silica-graded-block.json (index 1.4440318, Malitson's fused silica at
 * 193.5 THz: Malitson, JOSA 55, 1205 (1965)).
 */
import { describe, expect, it } from "vitest";
import { existsSync, readFileSync, writeFileSync } from "node:fs";
import { join, resolve } from "node:path";
import { pathToFileURL } from "node:url";
import { InputError } from "../../src/core/errors.js";
import { createSessionServices } from "../../src/tui/sessionServices.js";
import { tempDir } from "../helpers/tempDir.js";

const FIXTURE = JSON.parse(readFileSync(resolve("tests/verify/fixtures/silica-graded-block.json"), "utf8"));
const BUILT_SERVICES = resolve("dist/tui/sessionServices.js");

function designFile(dir: string, reduction: Record<string, unknown>): string {
  const path = join(dir, "design.json");
  writeFileSync(path, JSON.stringify({ ...FIXTURE, reduction: { ...FIXTURE.reduction, ...reduction } }));
  return path;
}

type Services = ReturnType<typeof createSessionServices>;
async function issuesOf(services: Services, overrides: Record<string, unknown>): Promise<{ where: string; message: string }[]> {
  try {
    await services.open();
    const plan = await services.plan(overrides, () => undefined);
    return plan ? [] : [{ where: "no plan", message: "" }];
  } catch (err) {
    // the compiled services throw the compiled InputError: same shape, another class
    expect(err instanceof InputError || (err as Error).constructor?.name === "InputError", String(err)).toBe(true);
    return (err as InputError).issues;
  } finally {
    await services.close();
  }
}

describe("session plans check reduction.backgroundMaterial", () => {
  it("a mistyped id: the plan request fails at the JSON path (session thread and worker)", async () => {
    expect(existsSync(BUILT_SERVICES), "dist/ is missing: run npm run build").toBe(true);
    const built = (await import(pathToFileURL(BUILT_SERVICES).href)) as { createSessionServices: typeof createSessionServices };
    const dir = tempDir("cw-sess-bg-");
    const design = designFile(dir, { backgroundMaterial: "fused-silca" });
    const opts = { designPath: design, cwd: dir, outDir: join(dir, "out"), sessionPath: join(dir, "out", "session.json") };
    const here = await issuesOf(createSessionServices({ ...opts, useWorker: false }), {});
    const worker = await issuesOf(built.createSessionServices({ ...opts, useWorker: true }), {});
    expect(here.map((i) => i.where)).toEqual([`${design}: $.reduction.backgroundMaterial`]);
    expect(here[0].message).toMatch(/^unknown material 'fused-silca'; did you mean fused-silica\b/);
    expect(worker).toEqual(here);
  }, 60_000);

  it("a metal and an index 10.8 % off are refused; the design as given plans", async () => {
    const dir = tempDir("cw-sess-bg-");
    const opts = (design: string) => ({ designPath: design, cwd: dir, outDir: join(dir, "out"), sessionPath: join(dir, "out", "session.json"), useWorker: false });
    const metal = await issuesOf(createSessionServices(opts(designFile(dir, { backgroundMaterial: "gold" }))), {});
    expect(metal.map((i) => i.message)).toEqual(["'gold' is a metal: a background must be a dielectric the wave travels in"]);
    const off = await issuesOf(createSessionServices(opts(designFile(dir, { backgroundIndex: 1.6 }))), {});
    expect(off).toHaveLength(1);
    expect(off[0].message).toContain(`the device's background index is 1.6000 (${join(dir, "design.json")}: $.reduction.backgroundIndex): expected them equal within 1 %`);
    expect(await issuesOf(createSessionServices(opts(designFile(dir, {}))), {})).toEqual([]);
  }, 60_000);

  it("an overriding background index from the session file is checked against the material and named there", async () => {
    const dir = tempDir("cw-sess-bg-");
    const sessionPath = join(dir, "out", "session.json");
    const services = createSessionServices({ designPath: designFile(dir, {}), cwd: dir, outDir: join(dir, "out"), sessionPath, useWorker: false });
    const issues = await issuesOf(services, { backgroundIndex: 1.5 });
    expect(issues).toHaveLength(1);
    expect(issues[0].where).toBe(`${join(dir, "design.json")}: $.reduction.backgroundMaterial`);
    expect(issues[0].message).toContain(`the device's background index is 1.5000 (${sessionPath}: $.overrides.backgroundIndex)`);
  }, 60_000);
});
