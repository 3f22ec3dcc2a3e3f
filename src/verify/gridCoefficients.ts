/**
 * Resample a scene onto the FDFD grid: the operator coefficients where the staggered scheme needs
 * them. b (out-of-plane constant) at nodes, A_xx = (T/det T)_xx on x-faces (i+½, j), A_yy on
 * y-faces (i, j+½), A_xy at cell centres (i+½, j+½). Each value is the arithmetic mean over an
 * s × s set of points spread across the grid cell around its location (s = `subsamples`), so
 * unit cells smaller than the grid step are averaged rather than aliased; for b with the field
 * along z this is the exact mean-field rule for layers along the field, for A it is the series
 * (harmonic) mean of T across the sampling box — a first-order approximation at oblique interfaces.
 * Perfect conductors are decided by the point itself, not the mean: Ez — nodes in a conductor are
 * held at zero total field; Hz — faces and cell centres in a conductor get A = 0 (no tangential E,
 * so ∂u/∂n = 0 on the conductor), and nodes cut off on all four faces are marked as inside.
 */
import type { FdfdGrid } from "./fdfdGrid.js";
import { backgroundCoefficients, SAMPLE_BACKGROUND, SAMPLE_LENGTH, SAMPLE_PEC, S_B, S_TXX, S_TXY, S_TYY, type Scene } from "./scene.js";

/** Complex coefficient arrays on the grid (index i + nx·j for every location kind). */
export interface GridCoefficients {
  bRe: Float64Array; bIm: Float64Array;
  axxRe: Float64Array; axxIm: Float64Array;
  ayyRe: Float64Array; ayyIm: Float64Array;
  axyRe: Float64Array; axyIm: Float64Array;
  /** 1 where the node is inside a perfect conductor (Ez: held at zero; Hz: cut off) */
  pecNode: Uint8Array;
  /** 1 where a node, face or centre next to the node differs from the background (device mask) */
  deviceNode: Uint8Array;
}

const KIND_B = 0, KIND_XX = 1, KIND_YY = 2, KIND_XY = 3;

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
 * Sample `scene` onto grid `g` with s × s points per location (s ≥ 1). Only locations inside the
 * scene's bounds (plus one step) are sampled; the rest keep the background values.
 */
export function gridCoefficients(g: FdfdGrid, scene: Scene, subsamples = 3): GridCoefficients {
  const c = backgroundGridCoefficients(g, scene);
  const { b: bBg, t: tBg } = backgroundCoefficients(scene);
  const s = Math.max(1, Math.floor(subsamples));
  const buf = new Float64Array(SAMPLE_LENGTH);
  const acc = new Float64Array(2);
  const pecFace = new Uint8Array(g.nx * g.ny * 2); // [x-face, y-face] per node index
  const h = g.h;
  const iLo = Math.max(0, Math.floor((scene.bounds.minX - g.x0) / h) - 1), iHi = Math.min(g.nx - 1, Math.ceil((scene.bounds.maxX - g.x0) / h) + 1);
  const jLo = Math.max(0, Math.floor((scene.bounds.minY - g.y0) / h) - 1), jHi = Math.min(g.ny - 1, Math.ceil((scene.bounds.maxY - g.y0) / h) + 1);
  // mean of one coefficient over the s × s box centred at (xc, yc); returns the point's own kind
  const meanAt = (xc: number, yc: number, kind: number): number => {
    const centreKind = scene.sample(xc, yc, buf);
    let sRe = 0, sIm = 0;
    for (let p = 0; p < s; p++) {
      for (let q = 0; q < s; q++) {
        const x = xc + ((p + 0.5) / s - 0.5) * h, y = yc + ((q + 0.5) / s - 0.5) * h;
        const k = scene.sample(x, y, buf);
        let vRe: number, vIm: number;
        if (k === SAMPLE_BACKGROUND || k === SAMPLE_PEC) {
          // conductors are handled by the point test; their area counts as background in the mean
          if (kind === KIND_B) { vRe = bBg; vIm = 0; } else if (kind === KIND_XY) { vRe = 0; vIm = 0; } else { vRe = 1 / tBg; vIm = 0; }
        } else if (kind === KIND_B) {
          vRe = buf[S_B]; vIm = buf[S_B + 1];
        } else {
          // A = T / det T, det T = T_xx T_yy − T_xy² (complex)
          const xr = buf[S_TXX], xi = buf[S_TXX + 1], yr = buf[S_TYY], yi = buf[S_TYY + 1], cr = buf[S_TXY], ci = buf[S_TXY + 1];
          const dRe = xr * yr - xi * yi - (cr * cr - ci * ci), dIm = xr * yi + xi * yr - 2 * cr * ci;
          const nRe = kind === KIND_XX ? xr : kind === KIND_YY ? yr : cr;
          const nIm = kind === KIND_XX ? xi : kind === KIND_YY ? yi : ci;
          const d2 = dRe * dRe + dIm * dIm;
          vRe = (nRe * dRe + nIm * dIm) / d2;
          vIm = (nIm * dRe - nRe * dIm) / d2;
        }
        sRe += vRe; sIm += vIm;
      }
    }
    acc[0] = sRe / (s * s); acc[1] = sIm / (s * s);
    return centreKind;
  };
  const hz = scene.polarization === "Hz";
  for (let j = jLo; j <= jHi; j++) {
    for (let i = iLo; i <= iHi; i++) {
      const id = i + g.nx * j;
      const x = g.x0 + i * h, y = g.y0 + j * h;
      let touched = false;
      let k = meanAt(x, y, KIND_B);
      c.bRe[id] = acc[0]; c.bIm[id] = acc[1];
      if (k !== SAMPLE_BACKGROUND) touched = true;
      if (k === SAMPLE_PEC && !hz) c.pecNode[id] = 1;
      k = meanAt(x + h / 2, y, KIND_XX);
      c.axxRe[id] = acc[0]; c.axxIm[id] = acc[1];
      if (k !== SAMPLE_BACKGROUND) touched = true;
      if (k === SAMPLE_PEC && hz) { c.axxRe[id] = 0; c.axxIm[id] = 0; pecFace[2 * id] = 1; }
      k = meanAt(x, y + h / 2, KIND_YY);
      c.ayyRe[id] = acc[0]; c.ayyIm[id] = acc[1];
      if (k !== SAMPLE_BACKGROUND) touched = true;
      if (k === SAMPLE_PEC && hz) { c.ayyRe[id] = 0; c.ayyIm[id] = 0; pecFace[2 * id + 1] = 1; }
      k = meanAt(x + h / 2, y + h / 2, KIND_XY);
      c.axyRe[id] = acc[0]; c.axyIm[id] = acc[1];
      if (k !== SAMPLE_BACKGROUND) touched = true;
      if (k === SAMPLE_PEC && hz) { c.axyRe[id] = 0; c.axyIm[id] = 0; }
      if (touched) c.deviceNode[id] = 1;
    }
  }
  if (hz) {
    // a node whose four faces are all in the conductor is cut off from the rest: inside the conductor
    for (let j = 1; j < g.ny; j++) {
      for (let i = 1; i < g.nx; i++) {
        const id = i + g.nx * j;
        if (pecFace[2 * id] && pecFace[2 * (id - 1)] && pecFace[2 * id + 1] && pecFace[2 * (id - g.nx) + 1]) {
          c.pecNode[id] = 1;
          c.bRe[id] = 1; c.bIm[id] = 0; // any non-zero value keeps the (decoupled) row regular
        }
      }
    }
  }
  return c;
}
