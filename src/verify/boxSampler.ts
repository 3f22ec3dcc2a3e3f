/**
 * The sub-pixel average of one h × h box of a scene (gridCoefficients.ts places these averages on
 * the grid; its file comment gives the rules and their sources: Farjadpour et al., Opt. Lett. 31,
 * 2972 (2006); Kottke, Farjadpour & Johnson, Phys. Rev. E 77, 036611 (2008)): b by the arithmetic
 * mean, the in-plane tensor T by the Kottke mean about the interface normal, from the scene's exact
 * parts and normal where it offers them (Scene.boxParts), else from s × s point samples (s raised
 * to FINE_SAMPLES where they differ). Allocation-free per box. Pure.
 */
import { backgroundCoefficients, BOX_MAX_PARTS, BOX_PART, SAMPLE_BACKGROUND, SAMPLE_LENGTH, SAMPLE_PEC, S_B, S_TXX, S_TXY, S_TYY, type Scene } from "./scene.js";

/** Samples per side where a box straddles an interface (the coarse layout found a difference). */
const FINE_SAMPLES = 10;

/**
 * The averaged material of one h × h box: complex b and A = T/det T. Allocation-free: the sampler
 * keeps its scratch arrays; `average(xc, yc, h)` writes into `avg` (bRe, bIm, axxRe, axxIm, ayyRe,
 * ayyIm, axyRe, axyIm) and returns the number of open (not conductor) samples (1 for a box made of
 * the scene's exact parts), 0 when every sample is conductor, −1 when every sample is background.
 */
export function boxSampler(scene: Scene, sCoarse: number) {
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

