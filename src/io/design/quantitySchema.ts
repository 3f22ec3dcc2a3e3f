/**
 * zod schemas for quantities with units. Plain numbers and the common units parse without mathjs;
 * when a design holds any other quantity string, `parseDesign` loads mathjs (async, once) and
 * parses again. The schemas parse synchronously and report failures as zod issues at their JSON
 * path.
 */
import { z } from "zod";
import { InputError } from "../../core/errors.js";
import { getMath } from "../mathjs.js";
import { NeedsMathjs, parseQuantityWith, type Dimension } from "../quantity.js";

let math: any = null;
let neededMath = false;

/** Load mathjs for the schemas (needed only when `quantitiesNeedMath()` says so after a parse). */
export async function prepareQuantities(): Promise<void> {
  math = await getMath();
}

/** Start a parse: forget whether an earlier parse needed mathjs. */
export function resetQuantityNeeds(): void {
  neededMath = false;
}

/**
 * True when the last parse met a quantity the fast path does not take while mathjs was not loaded:
 * its result is then not valid; call `prepareQuantities()` and parse again.
 */
export function quantitiesNeedMath(): boolean {
  return neededMath;
}

/** A quantity of `dimension`: a number (SI) or a string with a unit; output is the SI number. */
export function quantity(dimension: Dimension) {
  return z.union([z.number(), z.string()]).transform((value, ctx) => {
    try {
      return parseQuantityWith(math, value, dimension, "");
    } catch (err) {
      if (err instanceof NeedsMathjs) {
        neededMath = true; // this parse is discarded and repeated with mathjs loaded
        return 1;
      }
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
