/**
 * The tensor engine: for every cell of the device grid, K = ∂G/∂x' (closed form, or compiled
 * derivatives for expression maps), det J = 1/det K, ε' = ε_b J Jᵀ/det J, μ' = μ_b J Jᵀ/det J,
 * principal values and anisotropy ratios. Folding maps (det J ≤ 0) are an InputError naming the
 * first cells; the singular inner boundary of a cloak is handled by `innerOffsetM` (cells closer
 * than that are evaluated at that distance) and/or `cap` (largest principal value), both counted
 * in `capped`. Pure and allocation-free per cell.
 * Source: Pendry, Schurig, Smith, Science 312, 1780 (2006).
 */
import { InputError, ProgrammerError } from "../core/errors.js";
import { cellBudgetProblem, type CellBudget } from "../core/memoryBudget.js";
import type { SymTensorField } from "../core/symTensor.js";
import type { FieldBuffers } from "./fieldBuffers.js";
import type { TensorField, PointEvaluator } from "./tensorField.js";
import type { FieldDesign } from "./transformSpec.js";
import type { Transform } from "./transforms/transform.js";
import { makeTransform } from "./transforms/registry.js";
import { buildDeviceGrid } from "./buildDeviceGrid.js";
import { materialFromK } from "./materialFromK.js";
import { principal3, capPrincipal } from "./principalValues.js";
import { checkExpressionDerivatives } from "./checkExpressionDerivatives.js";
import { describeBadCells, type BadCell } from "./describeBadCells.js";

/** Boundary samples requested from each transform. */
export const BOUNDARY_SAMPLES = 256;
/** Bad cells listed in a folding error. */
const LISTED = 3;

/** Exact material at one physical point for `transform` (no offset, no cap). */
export function pointEvaluator(transform: Transform, epsB: number, muB: number): PointEvaluator {
  const k = new Float64Array(9), s = new Float64Array(6);
  return (x, y, z, epsOut, muOut) => {
    if (!transform.contains(x, y, z)) return NaN;
    transform.jacobianK(k, x, y, z);
    const det = materialFromK(s, k);
    if (!(det > 0) || det === Infinity) return NaN;
    for (let q = 0; q < 6; q++) { epsOut[q] = epsB * s[q]; muOut[q] = muB * s[q]; }
    return 1 / det;
  };
}

/** The per-cell arrays a plan does not read (det J, principal values, anisotropy ratios). */
type Derived = Pick<TensorField, "detJ" | "epsPrincipal" | "muPrincipal" | "epsAnisotropy" | "muAnisotropy">;

export interface FieldOptions {
  /**
   * "eager" (default): det J, principal values and anisotropy ratios are computed with the
   * tensors, in the same pass. "lazy": on first read of any of them, by a second pass of the same arithmetic (same
   * values); a plan never reads them, so it never pays their five fresh 8-byte-per-cell arrays.
   */
  derived?: "eager" | "lazy";
  /**
   * Write the tensors and the grid's indices into these reused buffers instead of fresh arrays
   * (fieldBuffers.ts): no page faults on a second computation, but the field is valid only until
   * the next computation with the same buffers. The derived arrays are always fresh.
   */
  buffers?: FieldBuffers;
}

/**
 * Compute the tensor field of a design. For `imported` designs pass the field read by
 * io/fieldCsv.ts (it is returned as is). With a `budget`, a grid whose estimated memory exceeds
 * it is refused at $.grid.pitch before the per-cell arrays are allocated. `options.derived`: see
 * FieldOptions. Throws InputError (where = "<file>: $.transform…") for
 * folding or undefined maps, and for grids with no cell inside the device.
 */
export function computeTensorField(design: FieldDesign, importedField?: TensorField, budget?: CellBudget, options: FieldOptions = {}): TensorField {
  const spec = design.transform;
  if (spec.kind === "imported") {
    if (!importedField) throw new ProgrammerError("imported designs need their field: use loadFieldForDesign");
    return importedField;
  }
  const file = design.sourcePath;
  let transform: Transform;
  try {
    transform = makeTransform(spec);
  } catch (err) {
    // computed maps (field/maps) name their JSON path; the file is known here
    if (err instanceof InputError && err.issues.every((i) => i.where.startsWith("$"))) {
      throw new InputError(err.issues.map((i) => ({ where: `${file}: ${i.where}`, message: i.message })));
    }
    throw err;
  }
  const dimension = transform.dimension === 3 && !design.grid.slice ? 3 : 2;
  const grid = buildDeviceGrid(transform.bounds, transform.contains, {
    pitchM: design.grid.pitchM, origin: design.grid.origin, dimension, where: `${file}: $.grid.pitch`, buffers: options.buffers,
  }, transform.containsRow);
  const n = grid.count;
  // estimate before allocating the per-cell arrays: refuse what the machine cannot hold
  const tooMany = budget ? cellBudgetProblem(n, design.grid.pitchM, dimension, budget) : null;
  if (tooMany !== null) throw new InputError({ where: `${file}: $.grid.pitch`, message: tooMany });
  if (n === 0) {
    throw new InputError({ where: `${file}: $.grid`, message: "no cell centre lies inside the device; expected a pitch smaller than the device (or another origin)" });
  }
  if (spec.kind === "expression") checkExpressionDerivatives(spec, grid, `${file}: $.transform.virtual`);

  const epsB = design.background.eps, muB = design.background.mu, ratio = muB / epsB;
  if (spec.cap !== undefined && spec.cap < Math.max(epsB, muB)) {
    // far from the singular boundary the material is the background: such a cap would clip every cell
    throw new InputError({
      where: `${file}: $.transform.cap`,
      message: `a cap of ${spec.cap} is below the background (ε_b = ${epsB}, μ_b = ${muB}) and would cap every cell; expected a largest allowed principal value above ${Math.max(epsB, muB)}, e.g. 10 to 100`,
    });
  }
  // Memory (and page faults) dominate at 1e6 cells, so arrays that must be equal are shared:
  // μ' = (μ_b/ε_b)·ε', hence with μ_b = ε_b every μ array is the ε array; a 2D map (invariant
  // along z) has ε'_xz = ε'_yz = 0, one zero array serves both. Fields are read-only downstream.
  const sameMaterial = ratio === 1;
  const planar = transform.dimension === 2;
  // every component array is written for every cell (or the map is refused); the shared zero
  // array and the capped flags are zeroed
  const buffers = options.buffers;
  const f64 = (name: string, zeroed: boolean): Float64Array => (buffers ? buffers.f64(name, n, zeroed) : new Float64Array(n));
  const sym = (name: string): SymTensorField => {
    const xx = f64(`${name}.xx`, false), yy = f64(`${name}.yy`, false), zz = f64(`${name}.zz`, false), xy = f64(`${name}.xy`, false);
    if (planar) { const zero = f64("zero", true); return { xx, yy, zz, xy, xz: zero, yz: zero }; }
    return { xx, yy, zz, xy, xz: f64(`${name}.xz`, false), yz: f64(`${name}.yz`, false) };
  };
  const eps = sym("eps");
  const mu = sameMaterial ? eps : sym("mu");
  const capped = buffers ? buffers.u8("capped", n, true) : new Uint8Array(n);
  const cap = spec.cap ?? null;
  const offset = "innerOffsetM" in spec && spec.innerOffsetM !== undefined && spec.innerOffsetM > 0 && transform.clampToInnerOffset
    ? spec.innerOffsetM : 0;

  const k = new Float64Array(9), te = new Float64Array(6), tm = new Float64Array(6), s = new Float64Array(6);
  const ve = new Float64Array(3), vm = new Float64Array(3), pt = new Float64Array(3);
  /** det K and the capped/offset flag of the cell last evaluated */
  const state = new Float64Array(2);
  // cell centres from the lattice indices, the same doubles as grid.xM… (made only if read)
  const { i: gi, j: gj, k: gk, originXM: x0, originYM: y0, originZM: z0, pitchM: pitch } = grid;
  const volume = grid.dimension === 3;
  /**
   * One cell into te, tm (tensors), ve, vm (principal values) and state; returns 0, or 1 for a
   * folding or undefined map (det K ≤ 0 or not finite), 2 for values beyond the double range.
   * The same arithmetic for both passes below, so the derived arrays match the tensors exactly.
   */
  const evaluate = (c: number): number => {
    let x = x0 + gi[c] * pitch, y = y0 + gj[c] * pitch, z = volume ? z0 + gk[c] * pitch : 0;
    let flagged = 0;
    if (offset > 0) {
      pt[0] = x; pt[1] = y; pt[2] = z;
      if (transform.clampToInnerOffset!(pt, offset)) { x = pt[0]; y = pt[1]; z = pt[2]; flagged = 1; }
    }
    transform.jacobianK(k, x, y, z);
    const det = materialFromK(s, k);
    state[0] = det;
    if (!(det > 0) || det === Infinity) return 1;
    // with μ_b = ε_b the μ tensor is the ε tensor (one set of arrays): tm and vm are not made
    if (sameMaterial) for (let q = 0; q < 6; q++) te[q] = epsB * s[q];
    else for (let q = 0; q < 6; q++) { te[q] = epsB * s[q]; tm[q] = muB * s[q]; }
    if (k[2] === 0 && k[5] === 0 && k[6] === 0 && k[7] === 0) {
      // z decouples: the in-plane pair has det = (ε_b K_zz)² exactly, so the smaller value is
      // taken as det/larger instead of mean − half, which cancels near a singular boundary.
      const mean = 0.5 * (te[0] + te[1]), d = 0.5 * (te[0] - te[1]);
      const big = mean + Math.sqrt(d * d + te[3] * te[3]);
      const small = (epsB * k[8]) * (epsB * k[8]) / big;
      const zz = te[2];
      if (zz <= small) { ve[0] = zz; ve[1] = small; ve[2] = big; }
      else if (zz <= big) { ve[0] = small; ve[1] = zz; ve[2] = big; }
      else { ve[0] = small; ve[1] = big; ve[2] = zz; }
    } else {
      principal3(ve, te);
    }
    // a component beyond the double range (e.g. a shift of 1e300 m): no material to report
    if (!(ve[2] < Infinity && ve[0] > -Infinity)) return 2;
    if (!sameMaterial) { vm[0] = ratio * ve[0]; vm[1] = ratio * ve[1]; vm[2] = ratio * ve[2]; }
    if (cap !== null) {
      if (capPrincipal(te, ve, cap)) flagged = 1;
      if (!sameMaterial && capPrincipal(tm, vm, cap)) flagged = 1;
    }
    state[1] = flagged;
    return 0;
  };

  /** Fresh arrays for det J, the principal values and the anisotropy ratios of every cell. */
  const allocateDerived = (): Derived => {
    const epsPrincipal: [Float64Array, Float64Array, Float64Array] = [new Float64Array(n), new Float64Array(n), new Float64Array(n)];
    const epsAnisotropy = new Float64Array(n);
    return {
      detJ: new Float64Array(n),
      epsPrincipal,
      muPrincipal: sameMaterial ? epsPrincipal : [new Float64Array(n), new Float64Array(n), new Float64Array(n)],
      epsAnisotropy,
      muAnisotropy: sameMaterial ? epsAnisotropy : new Float64Array(n),
    };
  };
  /** The derived arrays of one field as the loop writes them (μ's are ε's when the materials are one). */
  interface DerivedTargets { det: Float64Array; e0: Float64Array; e1: Float64Array; e2: Float64Array; ea: Float64Array; m0: Float64Array; m1: Float64Array; m2: Float64Array; ma: Float64Array }
  const targets = (d: Derived): DerivedTargets => ({
    det: d.detJ, e0: d.epsPrincipal[0], e1: d.epsPrincipal[1], e2: d.epsPrincipal[2], ea: d.epsAnisotropy,
    m0: d.muPrincipal[0], m1: d.muPrincipal[1], m2: d.muPrincipal[2], ma: d.muAnisotropy,
  });
  /** det J, principal values and anisotropy of the cell `evaluate` last computed, into `t` at c. */
  const storeDerived = (t: DerivedTargets, c: number): void => {
    t.det[c] = 1 / state[0];
    t.e0[c] = ve[0]; t.e1[c] = ve[1]; t.e2[c] = ve[2];
    t.ea[c] = ve[2] / ve[0];
    if (!sameMaterial) {
      t.m0[c] = vm[0]; t.m1[c] = vm[1]; t.m2[c] = vm[2];
      t.ma[c] = vm[2] / vm[0];
    }
  };
  // eager: the derived arrays are written in the same pass as the tensors (one evaluation per
  // cell); lazy: by a second pass on first read
  const out = options.derived !== "lazy" ? allocateDerived() : null;
  const eagerTargets = out ? targets(out) : null;
  const bad: BadCell[] = [];
  let badCount = 0, overflowCount = 0, firstOverflow = -1;
  // hoisted array references: the hot loop touches only locals
  const { xx: exx, yy: eyy, zz: ezz, xy: exy, xz: exz, yz: eyz } = eps;
  const { xx: mxx, yy: myy, zz: mzz, xy: mxy, xz: mxz, yz: myz } = mu;
  for (let c = 0; c < n; c++) {
    const status = evaluate(c);
    if (status === 1) {
      if (bad.length < LISTED) bad.push({ cell: c, detK: state[0] });
      badCount++;
      continue;
    }
    if (status === 2) {
      if (firstOverflow < 0) firstOverflow = c;
      overflowCount++;
      continue;
    }
    exx[c] = te[0]; eyy[c] = te[1]; ezz[c] = te[2]; exy[c] = te[3];
    if (!planar) { exz[c] = te[4]; eyz[c] = te[5]; }
    if (!sameMaterial) {
      mxx[c] = tm[0]; myy[c] = tm[1]; mzz[c] = tm[2]; mxy[c] = tm[3];
      if (!planar) { mxz[c] = tm[4]; myz[c] = tm[5]; }
    }
    if (state[1] !== 0) capped[c] = 1;
    if (eagerTargets !== null) storeDerived(eagerTargets, c);
  }
  if (badCount > 0) {
    const where = spec.kind === "expression" ? `${file}: $.transform.virtual` : `${file}: $.transform`;
    const clip = (t: string): string => (t.length > 60 ? `${t.slice(0, 57)}…` : t);
    const what = spec.kind === "expression" ? ` (x = '${clip(spec.virtual.x)}', y = '${clip(spec.virtual.y)}')` : "";
    throw new InputError({ where, message: describeBadCells(bad, badCount, grid, what, transform.clampToInnerOffset !== undefined) });
  }
  if (overflowCount > 0) {
    const c = firstOverflow;
    throw new InputError({
      where: `${file}: $.transform`,
      message: `the material overflows the number range in ${overflowCount} cell${overflowCount === 1 ? "" : "s"} (first at x = ${grid.xM[c]} m, y = ${grid.yM[c]} m); expected transform parameters of a buildable scale`,
    });
  }

  /** det J, principal values and anisotropy ratios of every cell: the lazy path's second pass. */
  const derive = (): Derived => {
    const d = allocateDerived();
    const t = targets(d);
    for (let c = 0; c < n; c++) {
      evaluate(c); // 0 for every cell: the first pass threw otherwise
      storeDerived(t, c);
    }
    return d;
  };
  let derived: Derived | null = out;
  const get = (): Derived => (derived ??= derive());
  return {
    source: spec.kind,
    grid,
    background: { eps: epsB, mu: muB },
    eps, mu,
    get detJ() { return get().detJ; },
    get epsPrincipal() { return get().epsPrincipal; },
    get muPrincipal() { return get().muPrincipal; },
    get epsAnisotropy() { return get().epsAnisotropy; },
    get muAnisotropy() { return get().muAnisotropy; },
    capped,
    capValue: cap,
    outerBoundary: transform.sampleOuterBoundary(BOUNDARY_SAMPLES),
    evaluateAt: pointEvaluator(transform, epsB, muB),
    volumeDevice: transform.dimension === 3,
    ...(transform.computedMap ? { map: transform.computedMap } : {}),
  };
}
