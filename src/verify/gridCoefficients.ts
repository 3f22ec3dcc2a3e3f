/**
 * Resample a scene onto the FDFD grid: the operator coefficients where the staggered scheme needs
 * them — b (out-of-plane constant) at nodes, A_xx = (T/det T)_xx on x-faces (i+½, j), A_yy on
 * y-faces (i, j+½), A_xy at cell centres (i+½, j+½) — sampled at the solver's own locations, so the
 * result does not depend on how finely the device was described.
 *
 * Sub-pixel averaging (Farjadpour et al., Opt. Lett. 31, 2972 (2006); Kottke, Farjadpour & Johnson,
 * Phys. Rev. E 77, 036611 (2008), eqs. 4–6 in 2D). Every location averages s × s samples over the
 * h × h box around it (s = 4, raised to FINE_SAMPLES = 10 where the samples differ, so the fill of
 * a box cut by an interface is known to about 1 %):
 *  - b (the field along z is tangential to every in-plane interface): arithmetic mean;
 *  - T (in-plane tensor): in the frame (n, t) of the local interface normal n, the Kottke map
 *    τ(T) = [−1/T_nn, T_nt/T_nn, T_tt − T_nt²/T_nn] is averaged and inverted, i.e. the normal
 *    component takes the harmonic mean and the tangential ones the arithmetic mean — exact for a
 *    laminate whose layers are normal to n. n is the least-squares gradient direction of tr T over
 *    the samples; with no gradient every sample is equal and the plain mean is used.
 * In a smooth graded medium the box mean differs from the point value by O(h²), so the scheme stays
 * second order; at a jump the error drops from O(h) (staircase) to about O(h²).
 * A scene that knows its geometry exactly (the drawn structure, geometryScene.ts) offers `boxParts`:
 * each material's exact area fraction in the box, and, where the box holds a single disc boundary
 * and nothing else, that boundary's exact normal (discBoxNormal.ts: the mean outward normal of the
 * arc inside the box). Then b is the parts' exact arithmetic mean, a box with one material takes it
 * without sampling, and a box whose parts differ in T takes the Kottke average of the parts weighted
 * by their exact fractions about that normal — closed form, no sampling. A box with several
 * interfaces (two discs, a disc and a cell or level boundary, a layer's two faces; the scene writes
 * no normal) keeps the exact fractions and takes its normal from the least-squares gradient of tr T
 * over FINE_SAMPLES² points (the only sampled quantity left); a straight interface along a grid axis
 * gets its axis that way exactly (the samples are symmetric). A box within reach of a conductor is
 * sampled point by point as before (boxParts answers 0 there).
 * Point sampling alone leaves errors that do not vanish with the step on a lattice whose discs all
 * sit alike on the grid: the 4 × 4 first look misses a disc that only clips a box's rim, and 10 × 10
 * points give a disc's area to about 1 %. Measured on a drawn air hole in ε 10.2, Ez, against the
 * exact series (tests/verify/drawnEzConvergence.test.ts): errors 4.2e-3, 1.1e-3, 2.6e-4 at 3, 6, 12
 * steps across the radius (second order), where point sampling gave 1.9e-4, 2.0e-4, 1.5e-4 (and
 * 1.5e-3 at 4 and 8).
 * The cross term of such scenes lives on the faces: A_xy of each x-face and y-face from that face's
 * own box (the average computed there for A_xx or A_yy anyway), half of 2 A_xy u_x u_y on each family
 * (stencil.ts), instead of A_xy at the cell centres from a box shifted by h/2 from every face's.
 * At an interface A_xy is non-zero only within about h of it, so the shifted boxes misplace it by
 * O(1) in a band of width h: with the cell-centre cross term the Hz ladders of a drawn rod stayed
 * irregular at 0.3–1 % (with exact fractions and normals too), with no cross term at all they are
 * clean first order at 1.2–1.7 % (16 steps across the radius), and with it on the faces they fall
 * at every rung, at first order with a small constant (an ε 9.6 rod: 2.5e-3, 2.1e-3, 1.4e-3,
 * 1.1e-3 at 6, 8, 12, 16 steps across the radius; tests/verify/drawnHzConvergence.test.ts). Near a
 * conductor (within 0.75 h of a face or centre) the cell-centre cross term is kept, so the
 * conductor treatments below are unchanged. Scenes without `boxParts` (the smooth maps, the
 * cylinder scenes) keep the cell-centre cross term: their results are unchanged.
 *
 * Perfect conductors listed in `scene.conductors` are placed between nodes, not on them:
 *  - Ez (u = E_z = 0 on the surface, Dirichlet): nodes inside are held at zero total field; a link
 *    from an outside node to an inside one is cut where the surface crosses it, at a fraction θ of
 *    the step, and its face coefficient becomes A/θ — the symmetric cut-link discretization of Gibou,
 *    Fedkiw, Cheng & Kang, J. Comput. Phys. 176, 205 (2002), second-order accurate in the solution.
 *  - Hz (∂u/∂n = 0 on the surface, Neumann): each node's control volume [i±½] × [j±½] keeps only its
 *    open part — b is scaled by the open area fraction and each face coefficient by the open length
 *    of the dual edge it crosses (the finite-volume "cut cell" or conformal treatment, Dey & Mittra,
 *    IEEE Microw. Guided Wave Lett. 7, 273 (1997), in frequency-domain form). No flux enters the
 *    conductor, and the boundary is seen where it is rather than at the nearest cell edge.
 * Points sample() calls PEC outside every listed conductor fall back to whole-cell treatment.
 */
import { crossingFraction, openFraction, unionDistance, type Conductor } from "./conductor.js";
import type { FdfdGrid } from "./fdfdGrid.js";
import { backgroundCoefficients, BOX_MAX_PARTS, BOX_PART, SAMPLE_BACKGROUND, SAMPLE_LENGTH, SAMPLE_PEC, S_B, S_TXX, S_TXY, S_TYY, type Scene } from "./scene.js";

/** Complex coefficient arrays on the grid (index i + nx·j for every location kind). */
export interface GridCoefficients {
  bRe: Float64Array; bIm: Float64Array;
  axxRe: Float64Array; axxIm: Float64Array;
  ayyRe: Float64Array; ayyIm: Float64Array;
  axyRe: Float64Array; axyIm: Float64Array;
  /**
   * A_xy on the x-faces (i+½, j) and y-faces (i, j+½) (index i + nx·j), for scenes whose boxes are
   * known exactly (boxParts): each face carries half the cross term with its own box's average
   * (stencil.ts). Absent: the cross term lives at the cell centres only (axyRe, axyIm).
   */
  axyXRe?: Float64Array; axyXIm?: Float64Array;
  axyYRe?: Float64Array; axyYIm?: Float64Array;
  /** 1 where the node is inside a perfect conductor (held at zero total field) */
  pecNode: Uint8Array;
  /** 1 where a node, face or centre next to the node differs from the background (device mask) */
  deviceNode: Uint8Array;
}

/** Smallest cut fraction θ of an Ez link (a node closer to the surface is treated as at 1 % of h). */
export const MIN_CUT_FRACTION = 0.01;
/** Samples per side where a box straddles an interface (the coarse layout found a difference). */
const FINE_SAMPLES = 10;
/** Samples per side of the Hz open-area estimate of a node cut by a conductor. */
const AREA_SAMPLES = 16;

/** Coefficients of the background everywhere (no scatterer). */
export function backgroundGridCoefficients(g: FdfdGrid, scene: Pick<Scene, "polarization" | "background">): GridCoefficients {
  const n = g.nx * g.ny;
  const { b, t } = backgroundCoefficients(scene);
  return {
    bRe: new Float64Array(n).fill(b), bIm: new Float64Array(n),
    axxRe: new Float64Array(n).fill(1 / t), axxIm: new Float64Array(n),
    ayyRe: new Float64Array(n).fill(1 / t), ayyIm: new Float64Array(n),
    axyRe: new Float64Array(n), axyIm: new Float64Array(n),
    pecNode: new Uint8Array(n),
    deviceNode: new Uint8Array(n),
  };
}

/**
 * The averaged material of one h × h box: complex b and A = T/det T. Allocation-free: the sampler
 * keeps its scratch arrays and writes into `avg` (bRe, bIm, axxRe, axxIm, ayyRe, ayyIm, axyRe, axyIm).
 * Returns the number of open (not conductor) samples, −1 when every sample is background.
 */
function boxSampler(scene: Scene, sCoarse: number) {
  const { b: bBg, t: tBg } = backgroundCoefficients(scene);
  const buf = new Float64Array(SAMPLE_LENGTH);
  const sFine = Math.max(sCoarse, FINE_SAMPLES);
  const mMax = sFine * sFine;
  const dx = new Float64Array(mMax), dy = new Float64Array(mMax);
  const kind = new Uint8Array(mMax);
  const v = new Float64Array(8 * mMax); // b, txx, tyy, txy (re, im) per sample
  const avg = new Float64Array(8);
  let s = sCoarse, m = s * s;
  const layout = (side: number): void => {
    s = side; m = side * side;
    for (let p = 0; p < s; p++) for (let q = 0; q < s; q++) { dx[p + s * q] = (p + 0.5) / s - 0.5; dy[p + s * q] = (q + 0.5) / s - 0.5; }
  };
  /** true when every sample of the current layout is the same (kind, and value unless the medium is smooth) */
  const smooth = scene.smoothMedium === true;
  const uniform = (): boolean => {
    for (let k = 1; k < m; k++) {
      if (kind[k] !== kind[0]) return false;
      if (smooth) continue;
      for (let q = 0; q < 8; q++) if (v[8 * k + q] !== v[q]) return false;
    }
    return true;
  };
  const partsOf = scene.boxParts;
  const parts = new Float64Array(BOX_MAX_PARTS * BOX_PART);
  const normal = new Float64Array(2);
  function average(xc: number, yc: number, h: number): number {
    if (partsOf) {
      const k = partsOf(xc, yc, h, parts, normal);
      if (k > 0) return fromParts(k, xc, yc, h);
    }
    layout(sCoarse);
    fill(xc, yc, h);
    if (sFine > sCoarse && !uniform()) { layout(sFine); fill(xc, yc, h); }
    return reduceSamples();
  }
  /**
   * The box from the scene's exact parts: b is their area-weighted (arithmetic) mean, exact; T is
   * the parts' common value, or — where T differs between them (Hz: ε across an interface) — the
   * Kottke average of the parts weighted by their exact fractions, about the scene's exact normal
   * when it wrote one (a single disc boundary), else about the sampled normal (sampledNormal, over
   * FINE_SAMPLES² points). Nothing allocated. Returns 1 (every part is open).
   */
  function fromParts(k: number, xc: number, yc: number, h: number): number {
    let bRe = 0, bIm = 0, medium = false, sameT = true;
    for (let p = 0; p < k; p++) {
      const o = BOX_PART * p, f = parts[o];
      if (parts[o + 1] !== SAMPLE_BACKGROUND) medium = true;
      bRe += f * parts[o + 2 + S_B]; bIm += f * parts[o + 2 + S_B + 1];
      for (let q = S_TXX; q < SAMPLE_LENGTH; q++) if (parts[o + 2 + q] !== parts[2 + q]) sameT = false;
    }
    if (!medium) {
      avg[0] = bBg; avg[1] = 0; avg[2] = 1 / tBg; avg[3] = 0; avg[4] = 1 / tBg; avg[5] = 0; avg[6] = 0; avg[7] = 0;
      return -1;
    }
    if (sameT) writeA(parts[2 + S_TXX], parts[2 + S_TXX + 1], parts[2 + S_TYY], parts[2 + S_TYY + 1], parts[2 + S_TXY], parts[2 + S_TXY + 1]);
    else {
      let withNormal = normal[0] !== 0 || normal[1] !== 0, nx = normal[0], ny = normal[1];
      if (!withNormal) {
        // several interfaces (or one the scene cannot place): the normal from the samples, the fractions exact
        layout(sFine); fill(xc, yc, h);
        withNormal = sampledNormal();
        nx = gradient[0]; ny = gradient[1];
      }
      kottkeMean(withNormal, nx, ny, parts, BOX_PART, 2 + S_TXX, null, k, tMean, 0);
      writeA(tMean[0], tMean[1], tMean[2], tMean[3], tMean[4], tMean[5]);
    }
    avg[0] = bRe; avg[1] = bIm;
    return 1;
  }
  let open = 0, medium = 0;
  function fill(xc: number, yc: number, h: number): void {
    open = 0; medium = 0;
    for (let k = 0; k < m; k++) {
      const kd = scene.sample(xc + dx[k] * h, yc + dy[k] * h, buf);
      kind[k] = kd;
      const o = 8 * k;
      if (kd === SAMPLE_PEC) { for (let q = 0; q < 8; q++) v[o + q] = 0; continue; }
      open++;
      if (kd === SAMPLE_BACKGROUND) {
        v[o] = bBg; v[o + 1] = 0; v[o + 2] = tBg; v[o + 3] = 0; v[o + 4] = tBg; v[o + 5] = 0; v[o + 6] = 0; v[o + 7] = 0;
      } else {
        medium++;
        v[o] = buf[S_B]; v[o + 1] = buf[S_B + 1];
        v[o + 2] = buf[S_TXX]; v[o + 3] = buf[S_TXX + 1];
        v[o + 4] = buf[S_TYY]; v[o + 5] = buf[S_TYY + 1];
        v[o + 6] = buf[S_TXY]; v[o + 7] = buf[S_TXY + 1];
      }
    }
  }
  const tMean = new Float64Array(6);
  /** unit normal of the sampled box: the least-squares gradient of tr T over the open samples, in `gradient`; false (and (1, 0)) without one */
  const gradient = new Float64Array(2);
  function sampledNormal(): boolean {
    let gMean = 0, count = 0;
    for (let k = 0; k < m; k++) {
      if (kind[k] === SAMPLE_PEC) continue;
      gMean += v[8 * k + 2] + v[8 * k + 4]; count++;
    }
    gMean /= Math.max(1, count);
    let gx = 0, gy = 0, gAbs = 0;
    for (let k = 0; k < m; k++) {
      if (kind[k] === SAMPLE_PEC) continue;
      const d = v[8 * k + 2] + v[8 * k + 4] - gMean;
      gx += dx[k] * d; gy += dy[k] * d; gAbs += Math.abs(d);
    }
    const gn = Math.hypot(gx, gy);
    const ok = gn > 1e-9 * (gAbs + 1e-300);
    gradient[0] = ok ? gx / gn : 1; gradient[1] = ok ? gy / gn : 0;
    return ok;
  }
  function reduceSamples(): number {
    if (medium === 0) {
      avg[0] = bBg; avg[1] = 0; avg[2] = 1 / tBg; avg[3] = 0; avg[4] = 1 / tBg; avg[5] = 0; avg[6] = 0; avg[7] = 0;
      return open === m ? -1 : open;
    }
    if (open === 0) return 0;
    // b: arithmetic mean; normal from the gradient of tr T
    let bRe = 0, bIm = 0;
    for (let k = 0; k < m; k++) {
      if (kind[k] === SAMPLE_PEC) continue;
      bRe += v[8 * k]; bIm += v[8 * k + 1];
    }
    bRe /= open; bIm /= open;
    const withNormal = sampledNormal();
    kottkeMean(withNormal, gradient[0], gradient[1], v, 8, 2, kind, m, tMean, -1);
    avg[0] = bRe; avg[1] = bIm;
    writeA(tMean[0], tMean[1], tMean[2], tMean[3], tMean[4], tMean[5]);
    return open;
  }
  /** avg[2..7] = A = T / det T (complex). */
  function writeA(txxRe: number, txxIm: number, tyyRe: number, tyyIm: number, txyRe: number, txyIm: number): void {
    const dRe = txxRe * tyyRe - txxIm * tyyIm - (txyRe * txyRe - txyIm * txyIm);
    const dIm = txxRe * tyyIm + txxIm * tyyRe - 2 * txyRe * txyIm;
    const dd = dRe * dRe + dIm * dIm;
    const iRe = dRe / dd, iIm = -dIm / dd;
    avg[2] = txxRe * iRe - txxIm * iIm; avg[3] = txxRe * iIm + txxIm * iRe;
    avg[4] = tyyRe * iRe - tyyIm * iIm; avg[5] = tyyRe * iIm + tyyIm * iRe;
    avg[6] = txyRe * iRe - txyIm * iIm; avg[7] = txyRe * iIm + txyIm * iRe;
  }
  return { average, avg };
}

/**
 * Kottke mean of in-plane tensors about the normal n = (nx, ny) (see file comment), written into
 * out as T_xx, T_yy, T_xy (re, im pairs): entry k has T_xx, T_yy, T_xy (re, im) at
 * src[base + stride·k …] and is skipped where skip[k] is SAMPLE_PEC; its weight is
 * src[weightAt + stride·k] (an area fraction), or 1 for every entry when weightAt < 0. Without a
 * normal (withNormal false) the plain (weighted) mean.
 */
function kottkeMean(withNormal: boolean, nx: number, ny: number, src: Float64Array, stride: number, base: number, skip: Uint8Array | null, count: number, out: Float64Array, weightAt: number): Float64Array {
  let sw = 0;
  let t1Re = 0, t1Im = 0, t2Re = 0, t2Im = 0, t3Re = 0, t3Im = 0;
  for (let k = 0; k < count; k++) {
    if (skip && skip[k] === SAMPLE_PEC) continue;
    const o = base + stride * k;
    const w = weightAt < 0 ? 1 : src[weightAt + stride * k];
    sw += w;
    const xr = src[o], xi = src[o + 1], yr = src[o + 2], yi = src[o + 3], cr = src[o + 4], ci = src[o + 5];
    if (!withNormal) { t1Re += w * xr; t1Im += w * xi; t2Re += w * yr; t2Im += w * yi; t3Re += w * cr; t3Im += w * ci; continue; }
    // rotate into (n, t), t = (−ny, nx)
    const nnRe = nx * nx * xr + ny * ny * yr + 2 * nx * ny * cr, nnIm = nx * nx * xi + ny * ny * yi + 2 * nx * ny * ci;
    const ttRe = ny * ny * xr + nx * nx * yr - 2 * nx * ny * cr, ttIm = ny * ny * xi + nx * nx * yi - 2 * nx * ny * ci;
    const ntRe = -nx * ny * xr + nx * ny * yr + (nx * nx - ny * ny) * cr, ntIm = -nx * ny * xi + nx * ny * yi + (nx * nx - ny * ny) * ci;
    // τ = [−1/T_nn, T_nt/T_nn, T_tt − T_nt²/T_nn]
    const d2 = nnRe * nnRe + nnIm * nnIm;
    const iRe = nnRe / d2, iIm = -nnIm / d2;
    t1Re -= w * iRe; t1Im -= w * iIm;
    const qRe = ntRe * iRe - ntIm * iIm, qIm = ntRe * iIm + ntIm * iRe;
    t2Re += w * qRe; t2Im += w * qIm;
    t3Re += w * (ttRe - (qRe * ntRe - qIm * ntIm)); t3Im += w * (ttIm - (qRe * ntIm + qIm * ntRe));
  }
  t1Re /= sw; t1Im /= sw; t2Re /= sw; t2Im /= sw; t3Re /= sw; t3Im /= sw;
  if (!withNormal) { out[0] = t1Re; out[1] = t1Im; out[2] = t2Re; out[3] = t2Im; out[4] = t3Re; out[5] = t3Im; return out; }
  // invert τ: T_nn = −1/⟨τ1⟩, T_nt = ⟨τ2⟩ T_nn, T_tt = ⟨τ3⟩ + ⟨τ2⟩² T_nn
  const d2 = t1Re * t1Re + t1Im * t1Im;
  const nnRe = -t1Re / d2, nnIm = t1Im / d2;
  const ntRe = t2Re * nnRe - t2Im * nnIm, ntIm = t2Re * nnIm + t2Im * nnRe;
  const ttRe = t3Re + (t2Re * ntRe - t2Im * ntIm), ttIm = t3Im + (t2Re * ntIm + t2Im * ntRe);
  // back to (x, y): T = T_nn n nᵀ + T_tt t tᵀ + T_nt (n tᵀ + t nᵀ)
  out[0] = nx * nx * nnRe + ny * ny * ttRe - 2 * nx * ny * ntRe; out[1] = nx * nx * nnIm + ny * ny * ttIm - 2 * nx * ny * ntIm;
  out[2] = ny * ny * nnRe + nx * nx * ttRe + 2 * nx * ny * ntRe; out[3] = ny * ny * nnIm + nx * nx * ttIm + 2 * nx * ny * ntIm;
  out[4] = nx * ny * (nnRe - ttRe) + (nx * nx - ny * ny) * ntRe; out[5] = nx * ny * (nnIm - ttIm) + (nx * nx - ny * ny) * ntIm;
  return out;
}

/** Open fraction of the h × h square centred at (xc, yc), by AREA_SAMPLES² point tests. */
function openArea(conductors: readonly Conductor[], xc: number, yc: number, h: number): number {
  let open = 0;
  for (let q = 0; q < AREA_SAMPLES; q++) {
    for (let p = 0; p < AREA_SAMPLES; p++) {
      if (unionDistance(conductors, xc + ((p + 0.5) / AREA_SAMPLES - 0.5) * h, yc + ((q + 0.5) / AREA_SAMPLES - 0.5) * h) >= 0) open++;
    }
  }
  return open / (AREA_SAMPLES * AREA_SAMPLES);
}

/**
 * Sample `scene` onto grid `g` with s × s points per location (s ≥ 1; see file comment). Only
 * locations inside the scene's bounds (plus one step) are sampled; the rest keep the background.
 */
export function gridCoefficients(g: FdfdGrid, scene: Scene, subsamples = 4): GridCoefficients {
  const c = backgroundGridCoefficients(g, scene);
  const s = Math.max(1, Math.floor(subsamples));
  const { average, avg } = boxSampler(scene, s);
  const cond = scene.conductors ?? [];
  const hasCond = cond.length > 0;
  const h = g.h, nx = g.nx, ny = g.ny;
  const hz = scene.polarization === "Hz";
  const iLo = Math.max(0, Math.floor((scene.bounds.minX - g.x0) / h) - 1), iHi = Math.min(nx - 1, Math.ceil((scene.bounds.maxX - g.x0) / h) + 1);
  const jLo = Math.max(0, Math.floor((scene.bounds.minY - g.y0) / h) - 1), jHi = Math.min(ny - 1, Math.ceil((scene.bounds.maxY - g.y0) / h) + 1);
  const point = new Float64Array(SAMPLE_LENGTH);
  const near = 0.75 * h;
  const faceCross = scene.boxParts !== undefined;
  const n = nx * ny;
  const fxRe = faceCross ? (c.axyXRe = new Float64Array(n)) : null, fxIm = faceCross ? (c.axyXIm = new Float64Array(n)) : null;
  const fyRe = faceCross ? (c.axyYRe = new Float64Array(n)) : null, fyIm = faceCross ? (c.axyYIm = new Float64Array(n)) : null; // beyond this distance a conductor cannot touch an h × h box or a dual edge
  // 1. nodes: conductor tests, b
  for (let j = jLo; j <= jHi; j++) {
    for (let i = iLo; i <= iHi; i++) {
      const id = i + nx * j;
      const x = g.x0 + i * h, y = g.y0 + j * h;
      const sd = hasCond ? unionDistance(cond, x, y) : Infinity;
      if (sd < -near) { c.pecNode[id] = 1; c.deviceNode[id] = 1; c.bRe[id] = 1; c.bIm[id] = 0; continue; }
      const open = average(x, y, h);
      if (open === -1) continue;
      c.deviceNode[id] = 1;
      if ((!hasCond && (open === 0 || scene.sample(x, y, point) === SAMPLE_PEC)) || (!hz && sd < 0)) {
        c.pecNode[id] = 1; c.bRe[id] = 1; c.bIm[id] = 0; continue;
      }
      let frac = 1;
      if (hz && sd < near) {
        frac = openArea(cond, x, y, h);
        if (frac === 0) { c.pecNode[id] = 1; c.bRe[id] = 1; c.bIm[id] = 0; continue; }
      }
      c.bRe[id] = avg[0] * frac; c.bIm[id] = avg[1] * frac;
    }
  }
  // 2. faces and centres
  for (let j = jLo; j <= jHi; j++) {
    for (let i = iLo; i <= iHi; i++) {
      const id = i + nx * j;
      const x = g.x0 + i * h, y = g.y0 + j * h;
      for (let f = 0; f < 3; f++) {
        const fx = f === 0 ? x + h / 2 : f === 1 ? x : x + h / 2;
        const fy = f === 0 ? y : f === 1 ? y + h / 2 : y + h / 2;
        const reA = f === 0 ? c.axxRe : f === 1 ? c.ayyRe : c.axyRe;
        const imA = f === 0 ? c.axxIm : f === 1 ? c.ayyIm : c.axyIm;
        const comp = f === 0 ? 2 : f === 1 ? 4 : 6;
        const sd = hasCond ? unionDistance(cond, fx, fy) : Infinity;
        if (sd < -near) { reA[id] = 0; imA[id] = 0; c.deviceNode[id] = 1; continue; }
        const open = average(fx, fy, h);
        if (open === -1) continue;
        c.deviceNode[id] = 1;
        if (open === 0 && !hasCond) { reA[id] = 0; imA[id] = 0; continue; } // whole-cell conductor
        if (open === 0) {
          // the box is all conductor but a cut link may still cross it: take the material at an open end
          const xe = f === 0 ? x + h : x, ye = f === 1 ? y + h : y;
          if (average(x, y, h) === 0) average(xe, ye, h);
        }
        let aRe = avg[comp], aIm = avg[comp + 1];
        if (hasCond && sd < near) {
          if (f === 2) {
            // cross term: only between open nodes; scaled by the open area of the cell
            const i1 = Math.min(nx - 1, i + 1), j1 = Math.min(ny - 1, j + 1);
            if (c.pecNode[id] || c.pecNode[i1 + nx * j] || c.pecNode[i + nx * j1] || c.pecNode[i1 + nx * j1]) { aRe = 0; aIm = 0; } else if (hz) {
              const fr = openArea(cond, fx, fy, h); aRe *= fr; aIm *= fr;
            }
          } else if (hz) {
            // open length of the dual edge crossing this face
            const fr = f === 0 ? openFraction(cond, fx, fy - h / 2, fx, fy + h / 2) : openFraction(cond, fx - h / 2, fy, fx + h / 2, fy);
            aRe *= fr; aIm *= fr;
          } else {
            // Ez: a link from an open node to a held node is cut at the surface
            const i2 = f === 0 ? i + 1 : i, j2 = f === 1 ? j + 1 : j;
            if (i2 < nx && j2 < ny) {
              const a = c.pecNode[id], b = c.pecNode[i2 + nx * j2];
              if (a !== b) {
                const x2 = g.x0 + i2 * h, y2 = g.y0 + j2 * h;
                const theta = a ? crossingFraction(cond, x2, y2, x, y) : crossingFraction(cond, x, y, x2, y2);
                const inv = 1 / Math.max(MIN_CUT_FRACTION, theta);
                aRe *= inv; aIm *= inv;
              }
            }
          }
        }
        if (faceCross) {
          // the cross term on the faces, each with its own box (stencil.ts); at the centres only near a conductor
          const nearCond = hasCond && sd < near;
          if (f === 2 && !nearCond) { aRe = 0; aIm = 0; }
          if (f === 0 && !nearCond) { fxRe![id] = avg[6]; fxIm![id] = avg[7]; }
          if (f === 1 && !nearCond) { fyRe![id] = avg[6]; fyIm![id] = avg[7]; }
        }
        reA[id] = aRe; imA[id] = aIm;
      }
    }
  }
  if (hz) {
    // a node with no open area is cut off: no face of its control volume may carry flux
    for (let j = jLo; j <= jHi; j++) {
      for (let i = iLo; i <= iHi; i++) {
        const id = i + nx * j;
        if (!c.pecNode[id]) continue;
        c.axxRe[id] = c.axxIm[id] = c.ayyRe[id] = c.ayyIm[id] = 0;
        if (i > 0) c.axxRe[id - 1] = c.axxIm[id - 1] = 0;
        if (j > 0) c.ayyRe[id - nx] = c.ayyIm[id - nx] = 0;
        for (const cell of [id, id - 1, id - nx, id - nx - 1]) if (cell >= 0) c.axyRe[cell] = c.axyIm[cell] = 0;
      }
    }
  }
  return c;
}
