/**
 * Adaptive Gauss–Kronrod (7/15-point) quadrature on a finite interval. The difference between the
 * 15-point Kronrod and the embedded 7-point Gauss estimate drives bisection until it is below the
 * tolerance. Nodes and weights: Piessens et al., "QUADPACK" (1983), routine QK15.
 */
const XGK = [
  0.991455371120812639206854697526329, 0.949107912342758524526189684047851, 0.864864423359769072789712788640926,
  0.741531185599394439863864773280788, 0.586087235467691130294144845693013, 0.405845151377397166906606412076961,
  0.207784955007898467600689403773245, 0,
];
const WGK = [
  0.02293532201052922496373200805897, 0.063092092629978553290700663189204, 0.104790010322250183839876322541518,
  0.140653259715525918745189590510238, 0.16900472663926790282658342659855, 0.190350578064785409913256402421014,
  0.204432940075298892414161999234649, 0.209482141084727828012999174891714,
];
/** Gauss weights at XGK[1], XGK[3], XGK[5], XGK[7]. */
const WG = [0.129484966168869693270611432679082, 0.27970539148927666790146777142378, 0.381830050505118944950369775488975, 0.417959183673469387755102040816327];

function qk15(f: (x: number) => number, a: number, b: number): { value: number; error: number } {
  const c = 0.5 * (a + b);
  const h = 0.5 * (b - a);
  const fc = f(c);
  let kronrod = fc * WGK[7];
  let gauss = fc * WG[3];
  for (let j = 0; j < 7; j++) {
    const dx = h * XGK[j];
    const s = f(c - dx) + f(c + dx);
    kronrod += WGK[j] * s;
    if (j % 2 === 1) gauss += WG[(j - 1) / 2] * s;
  }
  return { value: kronrod * h, error: Math.abs((kronrod - gauss) * h) };
}

export interface QuadratureResult {
  value: number;
  /** estimated absolute error */
  error: number;
  converged: boolean;
  /** number of 15-point panels evaluated */
  panels: number;
}

/**
 * ∫_a^b f(x) dx to |error| ≤ max(absTol, relTol·|value|), bisecting the panel with the largest
 * error estimate; at most `maxPanels` panels (converged false when the cap is hit).
 */
export function integrateAdaptive(
  f: (x: number) => number,
  a: number,
  b: number,
  relTol = 1e-12,
  absTol = 1e-15,
  maxPanels = 2000,
): QuadratureResult {
  const panels: { a: number; b: number; value: number; error: number }[] = [{ a, b, ...qk15(f, a, b) }];
  let count = 1;
  for (;;) {
    let value = 0;
    let error = 0;
    let worst = 0;
    for (let k = 0; k < panels.length; k++) {
      value += panels[k].value;
      error += panels[k].error;
      if (panels[k].error > panels[worst].error) worst = k;
    }
    if (error <= Math.max(absTol, relTol * Math.abs(value))) return { value, error, converged: true, panels: count };
    if (count + 2 > maxPanels) return { value, error, converged: false, panels: count };
    const p = panels[worst];
    const m = 0.5 * (p.a + p.b);
    panels.splice(worst, 1, { a: p.a, b: m, ...qk15(f, p.a, m) }, { a: m, b: p.b, ...qk15(f, m, p.b) });
    count += 2;
  }
}
