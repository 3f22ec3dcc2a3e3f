/**
 * The design's `transform` key: a discriminated union on `kind`, one strict object per kind.
 * JSON parameter names are a contract (users and tests write them); the parsed spec is SI with
 * unit-suffixed names (see field/transformSpec.ts). Expression maps are compiled later, by
 * parseDesign.
 */
import { z } from "zod";
import { point2, positiveQuantity, quantity } from "./quantitySchema.js";
import { regionSchema } from "./regionSchema.js";

const length = () => positiveQuantity("length");
const cap = z.number().positive().optional();
const innerOffset = quantity("length").refine((v) => v >= 0, { message: "expected a length ≥ 0" }).optional();

/** Add an issue at `path` of the transform object. */
function issue(ctx: z.RefinementCtx, path: string, message: string): void {
  ctx.addIssue({ code: "custom", message, path: [path] });
}

const radialCloak = z
  .object({
    kind: z.literal("radial-cloak"),
    innerRadius: length(),
    outerRadius: length(),
    profile: z.enum(["linear", "quadratic"]).default("linear"),
    center: point2.optional(),
    innerOffset,
    cap,
  })
  .strict()
  .superRefine((t, ctx) => {
    if (!(t.innerRadius < t.outerRadius)) return issue(ctx, "outerRadius", "expected outerRadius > innerRadius");
    if (t.profile === "quadratic" && !(t.outerRadius > 2 * t.innerRadius)) {
      issue(ctx, "profile", `the quadratic profile folds unless outerRadius > 2 × innerRadius (got ${t.outerRadius} m ≤ 2 × ${t.innerRadius} m); use 'linear' or a larger outer radius`);
    }
    if (t.innerOffset !== undefined && !(t.innerOffset < t.outerRadius - t.innerRadius)) {
      issue(ctx, "innerOffset", "expected innerOffset smaller than outerRadius − innerRadius");
    }
  })
  .transform((t) => ({
    kind: t.kind, innerRadiusM: t.innerRadius, outerRadiusM: t.outerRadius, profile: t.profile,
    center: t.center, innerOffsetM: t.innerOffset, cap: t.cap,
  }));

const concentrator = z
  .object({
    kind: z.literal("concentrator"),
    innerRadius: length(),
    compressedRadius: length(),
    outerRadius: length(),
    center: point2.optional(),
    cap,
  })
  .strict()
  .superRefine((t, ctx) => {
    if (!(t.innerRadius < t.compressedRadius)) issue(ctx, "compressedRadius", "expected compressedRadius > innerRadius");
    else if (!(t.compressedRadius < t.outerRadius)) issue(ctx, "outerRadius", "expected outerRadius > compressedRadius");
  })
  .transform((t) => ({
    kind: t.kind, innerRadiusM: t.innerRadius, compressedRadiusM: t.compressedRadius, outerRadiusM: t.outerRadius,
    center: t.center, cap: t.cap,
  }));

const rotator = z
  .object({ kind: z.literal("rotator"), innerRadius: length(), outerRadius: length(), angle: quantity("angle"), center: point2.optional(), cap })
  .strict()
  .superRefine((t, ctx) => {
    if (!(t.innerRadius < t.outerRadius)) issue(ctx, "outerRadius", "expected outerRadius > innerRadius");
  })
  .transform((t) => ({ kind: t.kind, innerRadiusM: t.innerRadius, outerRadiusM: t.outerRadius, angleRad: t.angle, center: t.center, cap: t.cap }));

const beamShifter = z
  .object({ kind: z.literal("beam-shifter"), length: length(), height: length(), shift: quantity("length"), cap })
  .strict()
  .transform((t) => ({ kind: t.kind, lengthM: t.length, heightM: t.height, shiftM: t.shift, cap: t.cap }));

const beamBend = z
  .object({
    kind: z.literal("beam-bend"),
    innerRadius: length(),
    outerRadius: length(),
    angle: quantity("angle"),
    referenceRadius: length(),
    center: point2.optional(),
    cap,
  })
  .strict()
  .superRefine((t, ctx) => {
    if (!(t.innerRadius < t.outerRadius)) issue(ctx, "outerRadius", "expected outerRadius > innerRadius");
    if (!(t.angle > 0 && t.angle <= 2 * Math.PI + 1e-12)) issue(ctx, "angle", "expected an angle between 0 and 360 deg");
  })
  .transform((t) => ({
    kind: t.kind, innerRadiusM: t.innerRadius, outerRadiusM: t.outerRadius, angleRad: Math.min(t.angle, 2 * Math.PI),
    referenceRadiusM: t.referenceRadius, center: t.center, cap: t.cap,
  }));

const sphericalCloak = z
  .object({ kind: z.literal("spherical-cloak"), innerRadius: length(), outerRadius: length(), center: point2.optional(), innerOffset, cap })
  .strict()
  .superRefine((t, ctx) => {
    if (!(t.innerRadius < t.outerRadius)) return issue(ctx, "outerRadius", "expected outerRadius > innerRadius");
    if (t.innerOffset !== undefined && !(t.innerOffset < t.outerRadius - t.innerRadius)) {
      issue(ctx, "innerOffset", "expected innerOffset smaller than outerRadius − innerRadius");
    }
  })
  .transform((t) => ({ kind: t.kind, innerRadiusM: t.innerRadius, outerRadiusM: t.outerRadius, center: t.center, innerOffsetM: t.innerOffset, cap: t.cap }));

const expression = z
  .object({
    kind: z.literal("expression"),
    virtual: z.object({ x: z.string().min(1), y: z.string().min(1) }).strict(),
    region: regionSchema,
    cap,
  })
  .strict();

/** One side of a quasi-conformal domain, as written; which keys fit which side is checked below. */
const sideSchema = z
  .object({
    x: z.string().min(1).optional(),
    y: z.string().min(1).optional(),
    points: z.array(point2).min(2).optional(),
  })
  .strict();

export const QUAD_SIDE_NAMES = ["bottom", "right", "top", "left"] as const;

const quasiConformal = z
  .object({
    kind: z.literal("quasi-conformal"),
    virtual: z
      .object({
        rectangle: z.object({ min: point2, max: point2 }).strict(),
        fit: z.enum(["none", "module"]).default("none"),
      })
      .strict(),
    sides: z
      .object({ bottom: sideSchema.optional(), right: sideSchema.optional(), top: sideSchema.optional(), left: sideSchema.optional() })
      .strict()
      .default({}),
    nodes: z.tuple([z.number().int().min(5).max(2001), z.number().int().min(5).max(2001)]).optional(),
    cap,
  })
  .strict()
  .superRefine((t, ctx) => {
    const [x0, y0] = t.virtual.rectangle.min, [x1, y1] = t.virtual.rectangle.max;
    if (!(x1 > x0 && y1 > y0)) {
      ctx.addIssue({ code: "custom", message: "expected max above and right of min", path: ["virtual", "rectangle", "max"] });
    }
    for (const name of QUAD_SIDE_NAMES) {
      const side = t.sides[name];
      if (!side) continue;
      const across = name === "bottom" || name === "top" ? "y" : "x";
      const keys = Object.keys(side).sort().join(",");
      const fits = keys === across || keys === "x,y" || keys === "points";
      if (!fits) {
        ctx.addIssue({
          code: "custom", path: ["sides", name],
          message: `expected { "${across}": "<expression of ${across === "y" ? "x" : "y"}>" }, { "x": "<expression of t>", "y": "<expression of t>" } or { "points": [[x, y], …] }, got keys ${keys || "none"}`,
        });
      }
    }
  });

const closedCurve = z.object({ r: z.string().min(1).optional(), points: z.array(point2).min(3).optional() }).strict()
  .refine((c) => (c.r === undefined) !== (c.points === undefined), { message: 'expected { "r": "<expression of theta>" } or { "points": [[x, y], …] }' });

const laplaceShell = z
  .object({
    kind: z.literal("laplace-shell"),
    center: point2.default([0, 0]),
    inner: closedCurve,
    outer: closedCurve,
    innerScale: z.number().nonnegative().default(0),
    nodes: z.tuple([z.number().int().min(8).max(4001), z.number().int().min(3).max(1001)]).optional(),
    innerOffset,
    cap,
  })
  .strict()
  .superRefine((t, ctx) => {
    if (t.innerScale > 0 && t.innerScale <= 1) issue(ctx, "innerScale", "expected 0 (a cloak) or more than 1 (a concentrator's magnification)");
    if (t.innerOffset !== undefined && t.innerScale > 0) issue(ctx, "innerOffset", "only a cloak (innerScale 0) has a singular inner boundary");
  });

const imported = z.object({ kind: z.literal("imported"), file: z.string().min(1) }).strict();

export const transformSchema = z.discriminatedUnion("kind", [
  radialCloak, concentrator, rotator, beamShifter, beamBend, sphericalCloak, expression, quasiConformal, laplaceShell, imported,
]);

/** JSON keys accepted by each kind, for "did you mean" messages. */
export const TRANSFORM_KEYS: Record<string, string[]> = {
  "radial-cloak": ["kind", "innerRadius", "outerRadius", "profile", "center", "innerOffset", "cap"],
  concentrator: ["kind", "innerRadius", "compressedRadius", "outerRadius", "center", "cap"],
  rotator: ["kind", "innerRadius", "outerRadius", "angle", "center", "cap"],
  "beam-shifter": ["kind", "length", "height", "shift", "cap"],
  "beam-bend": ["kind", "innerRadius", "outerRadius", "angle", "referenceRadius", "center", "cap"],
  "spherical-cloak": ["kind", "innerRadius", "outerRadius", "center", "innerOffset", "cap"],
  expression: ["kind", "virtual", "region", "cap"],
  "quasi-conformal": ["kind", "virtual", "sides", "nodes", "cap"],
  "laplace-shell": ["kind", "center", "inner", "outer", "innerScale", "nodes", "innerOffset", "cap"],
  imported: ["kind", "file"],
};

export type ParsedTransform = z.output<typeof transformSchema>;
