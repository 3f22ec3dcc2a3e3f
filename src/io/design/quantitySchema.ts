/**
 * zod schemas for quantities with units. mathjs is loaded (async) once by `loadDesign` before any
 * schema runs; the schemas then parse synchronously and report failures as zod issues at their
 * JSON path.
 */
import { z } from "zod";
import { InputError } from "../../core/errors.js";
import { getMath } from "../mathjs.js";
import { parseQuantityWith, type Dimension } from "../quantity.js";

let math: any = null;

/** Must be awaited before parsing a design with these schemas. */
export async function prepareQuantities(): Promise<void> {
  math = await getMath();
}

/** A quantity of `dimension`: a number (SI) or a string with a unit; output is the SI number. */
export function quantity(dimension: Dimension) {
  return z.union([z.number(), z.string()]).transform((value, ctx) => {
    if (!math) throw new Error("prepareQuantities() was not awaited");
    try {
      return parseQuantityWith(math, value, dimension, "");
    } catch (err) {
      if (err instanceof InputError) {
        ctx.addIssue({ code: "custom", message: err.issues[0].message });
        return z.NEVER;
      }
      throw err;
    }
  });
}

/** A positive quantity (lengths, frequencies). */
export function positiveQuantity(dimension: Dimension) {
  return quantity(dimension).refine((v) => v > 0, { message: `expected a positive ${dimension}` });
}

/** A point [x, y] of lengths. */
export const point2 = z.tuple([quantity("length"), quantity("length")]);
