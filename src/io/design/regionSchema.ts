/** The `region` of an expression map: exactly one of circle, annulus, rectangle, polygon. */
import { z } from "zod";
import { point2, positiveQuantity } from "./quantitySchema.js";
import { polygonArea2, type RegionSpec } from "../../field/region.js";

const circle = z.object({ center: point2.optional(), radius: positiveQuantity("length") }).strict();
const annulus = z
  .object({ center: point2.optional(), innerRadius: positiveQuantity("length"), outerRadius: positiveQuantity("length") })
  .strict()
  .refine((a) => a.innerRadius < a.outerRadius, { message: "expected innerRadius < outerRadius", path: ["outerRadius"] });
const rectangle = z
  .object({ min: point2, max: point2 })
  .strict()
  .refine((r) => r.min[0] < r.max[0] && r.min[1] < r.max[1], { message: "expected min below and left of max", path: ["max"] });
const polygon = z
  .array(point2)
  .min(3, { message: "expected at least 3 points [x, y]" })
  .refine((pts) => polygonArea2(pts as [number, number][]) !== 0, { message: "expected a polygon with non-zero area" });

export const REGION_SHAPES = ["circle", "annulus", "rectangle", "polygon"] as const;

export const regionSchema = z
  .object({ circle: circle.optional(), annulus: annulus.optional(), rectangle: rectangle.optional(), polygon: polygon.optional() })
  .strict()
  .superRefine((r, ctx) => {
    const given = REGION_SHAPES.filter((s) => r[s] !== undefined);
    if (given.length !== 1) {
      ctx.addIssue({ code: "custom", message: `expected exactly one of ${REGION_SHAPES.join(", ")}${given.length ? `, got ${given.join(" and ")}` : ""}` });
    }
  })
  .transform((r): RegionSpec => {
    if (r.circle) return { shape: "circle", centerM: r.circle.center ?? [0, 0], radiusM: r.circle.radius };
    if (r.annulus) {
      return { shape: "annulus", centerM: r.annulus.center ?? [0, 0], innerRadiusM: r.annulus.innerRadius, outerRadiusM: r.annulus.outerRadius };
    }
    if (r.rectangle) return { shape: "rectangle", minM: r.rectangle.min, maxM: r.rectangle.max };
    return { shape: "polygon", pointsM: r.polygon as [number, number][] };
  });
