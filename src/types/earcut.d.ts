// The one function of the earcut package (npm, ISC) that src/plan/layout/slabFace.ts uses, declared
// here so the type check does not depend on the installed package's own declarations (a checkout
// whose node_modules predates the dependency failed `tsc --noEmit` with TS2307). Same signature
// as earcut 3.2.4's src/earcut.d.ts.
declare module "earcut" {
  /** Triangles (vertex index triplets) of the polygon `data` (flat x, y…), holes starting at `holeIndices`. */
  export default function earcut(data: ArrayLike<number>, holeIndices?: ArrayLike<number> | null, dim?: number): number[];
}
