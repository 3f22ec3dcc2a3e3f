/** The design's `grid` key: `{ "pitch": "3 mm", "origin"?: [x, y], "slice"?: true }`. */
import { z } from "zod";
import { point2, positiveQuantity } from "./quantitySchema.js";

export const GRID_KEYS = ["pitch", "origin", "slice"];

export const gridSchema = z
  .object({
    /** side of the square (cubic) cells */
    pitch: positiveQuantity("length"),
    /** a point where a cell centre sits (default: the centre of the device's bounding box) */
    origin: point2.optional(),
    /** 3D devices only: grid the z = 0 plane instead of the volume */
    slice: z.boolean().optional(),
  })
  .strict()
  .transform((g) => ({ pitchM: g.pitch, origin: g.origin as [number, number] | undefined, slice: g.slice }));
