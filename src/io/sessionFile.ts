/**
 * The session file: the designer's choices from an interactive session (which design, and what
 * they changed from it), small enough to read, and enough for `cellwright plan --session FILE` to
 * reproduce exactly what the session exported.
 *
 * Format (JSON):
 * ```json
 * {
 *   "cellwrightSession": 1,
 *   "design": "../demo-designs/cloak.json",
 *   "overrides": { "scheme": "unit-mu", "levels": 8, "tolerance": 0.03 },
 *   "view": { "screen": "map", "mapQuantity": "relError", "cursorI": 12, "cursorJ": 7 }
 * }
 * ```
 * `design` is stored relative to the session file's folder when the design sits in it or one level
 * up (so the pair can move together), else absolute; it is returned absolute. `overrides` holds only the settings the designer changed;
 * anything absent comes from the design file. `view` (optional) is where the designer was looking;
 * the command line ignores it.
 */
import { promises as fs } from "node:fs";
import { dirname, isAbsolute, relative, resolve, sep } from "node:path";
import { z } from "zod";
import { InputError, type InputIssue } from "../core/errors.js";
import type { PlanOverrides } from "../plan/planTypes.js";
import { writeFileAtomic } from "./atomicWrite.js";

/** Version written in `cellwrightSession`; files of a newer version are refused with a message. */
export const SESSION_FILE_VERSION = 1;

/** Default file name of a session file inside an output folder. */
export const SESSION_FILE_NAME = "session.json";

const overridesSchema = z
  .object({
    polarization: z.enum(["Ez", "Hz"]),
    scheme: z.enum(["full", "unit-mu", "non-magnetic", "isotropic", "matched"]),
    unitAxis: z.enum(["larger", "smaller"]),
    backgroundIndex: z.number().positive().finite(),
    levels: z.number().int().min(1).max(256).nullable(),
    tolerance: z.number().positive().max(1),
    materials: z.array(z.string().min(1)).min(1).nullable(),
    families: z.array(z.string().min(1)).min(1).nullable(),
    process: z.string().min(1).nullable(),
    lattice: z.enum(["square", "hex", "rect", "cubic"]).nullable(),
    aspect: z.number().positive().finite().nullable(),
    maxAnisotropy: z.number().min(1).finite(),
    lossBudgetDb: z.number().nonnegative().finite().nullable(),
    bandwidth: z.number().positive().max(2).nullable(),
  })
  .partial()
  .strict();

const viewSchema = z
  .object({
    screen: z.string().max(40).optional(),
    mapQuantity: z.string().max(80).optional(),
    cursorI: z.number().int().min(0).optional(),
    cursorJ: z.number().int().min(0).optional(),
  })
  .strict();

const sessionSchema = z
  .object({
    cellwrightSession: z.literal(SESSION_FILE_VERSION),
    design: z.string().min(1),
    overrides: overridesSchema,
    view: viewSchema.optional(),
  })
  .strict();

/** Where the designer was looking; restored on reopening, ignored by the command line. */
export type SessionView = z.infer<typeof viewSchema>;

export interface SessionFileContents {
  /** absolute path of the design file */
  designPath: string;
  /** settings that differ from the design file */
  overrides: PlanOverrides;
  view?: SessionView;
}

/** "$.overrides.materials[2]" from a zod issue path. */
function jsonPath(path: readonly PropertyKey[]): string {
  let out = "$";
  for (const p of path) out += typeof p === "number" ? `[${p}]` : `.${String(p)}`;
  return out;
}

/**
 * Read and validate a session file. Returns the design path made absolute (relative paths are
 * taken from the session file's folder) and the overrides.
 * Throws InputError naming the file (and the JSON path) when it is missing, not JSON, or invalid.
 * Example: await loadSessionFile("out/session.json") → { designPath: "/…/cloak.json", overrides: { levels: 8 } }
 */
export async function loadSessionFile(path: string): Promise<SessionFileContents> {
  let text: string;
  try {
    text = await fs.readFile(path, "utf8");
  } catch (err) {
    const code = (err as NodeJS.ErrnoException).code;
    throw new InputError({
      where: path,
      message: code === "ENOENT" ? "session file not found" : `cannot read the session file (${code ?? "error"})`,
    });
  }
  let raw: unknown;
  try {
    raw = JSON.parse(text);
  } catch (err) {
    throw new InputError({ where: path, message: `expected valid json: ${(err as Error).message.toLowerCase()}` });
  }
  if (raw && typeof raw === "object" && "cellwrightSession" in raw) {
    const v = (raw as { cellwrightSession: unknown }).cellwrightSession;
    if (typeof v === "number" && v > SESSION_FILE_VERSION) {
      throw new InputError({
        where: `${path}: $.cellwrightSession`,
        message: `session file version ${v} is newer than this cellwright understands (${SESSION_FILE_VERSION})`,
      });
    }
  }
  const parsed = sessionSchema.safeParse(raw);
  if (!parsed.success) {
    const issues: InputIssue[] = parsed.error.issues.map((i) => ({
      where: `${path}: ${jsonPath(i.path)}`,
      message: i.message.toLowerCase(),
    }));
    throw new InputError(issues);
  }
  const data = parsed.data;
  const designPath = isAbsolute(data.design) ? data.design : resolve(dirname(resolve(path)), data.design);
  const overrides = data.overrides as PlanOverrides;
  return data.view ? { designPath, overrides, view: data.view } : { designPath, overrides };
}

/** Keys in a fixed order, so saved files diff cleanly. */
const KEY_ORDER: (keyof PlanOverrides)[] = [
  "polarization",
  "scheme",
  "unitAxis",
  "backgroundIndex",
  "levels",
  "tolerance",
  "materials",
  "families",
  "process",
  "lattice",
  "maxAnisotropy",
  "lossBudgetDb",
  "bandwidth",
];

/** The JSON text of a session file written at `path` (design path made relative to its folder). */
export function sessionFileText(path: string, contents: SessionFileContents): string {
  const folder = dirname(resolve(path));
  // relative when the design sits in or near the folder (at most one level up), else absolute
  let design = relative(folder, resolve(contents.designPath));
  if (design === "" || isAbsolute(design) || design.startsWith(`..${sep}..${sep}`)) design = resolve(contents.designPath);
  design = design.split(sep).join("/");
  const overrides: Record<string, unknown> = {};
  for (const k of KEY_ORDER) {
    const v = contents.overrides[k];
    if (v !== undefined) overrides[k] = Array.isArray(v) ? [...v] : v;
  }
  const check = overridesSchema.safeParse(overrides);
  if (!check.success) {
    const i = check.error.issues[0];
    throw new InputError({ where: `${path}: ${jsonPath(["overrides", ...i.path])}`, message: i.message.toLowerCase() });
  }
  const body: Record<string, unknown> = { cellwrightSession: SESSION_FILE_VERSION, design, overrides };
  if (contents.view && Object.keys(contents.view).length > 0) body.view = contents.view;
  return JSON.stringify(body, null, 2) + "\n";
}

/**
 * Write a session file atomically (temporary file, then rename). The design path is stored
 * relative to the file's folder. Throws InputError naming the path if an override is invalid.
 */
export async function saveSessionFile(path: string, contents: SessionFileContents): Promise<void> {
  const text = sessionFileText(path, contents);
  await writeFileAtomic(path, text);
}
