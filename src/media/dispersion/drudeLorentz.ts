/**
 * Drude–Lorentz: ε = ε∞ − f_p²/(f² + iγf) + Σ_k Δε_k f0_k²/(f0_k² − f² − iγ_k f), all
 * frequencies in Hz. The Drude term carries the free electrons, the poles the interband
 * transitions. Source: Vial, Grimault, Macías, Barchiesi, de la Chapelle, "Improved analytical fit
 * of gold dispersion", Phys. Rev. B 71, 085416 (2005); Rakić et al., Appl. Opt. 37, 5271 (1998).
 */
import { cAdd } from "../../core/complex.js";
import { checkPoles, type DispersionModel, type DispersionParams } from "./dispersionModel.js";
import { DRUDE_PARAMS, drudeTerm } from "./drude.js";
import { lorentzSum, POLE_PARAMS, polesOf } from "./lorentz.js";

export const drudeLorentz: DispersionModel = {
  id: "drude-lorentz",
  description: "Drude term plus Lorentz poles",
  params: [...DRUDE_PARAMS, ...POLE_PARAMS],
  check: (p) => checkPoles(p, false),
  evaluate(p: DispersionParams, f: number) {
    const s = cAdd(drudeTerm(p.plasma_hz, p.gamma_hz, f), lorentzSum(polesOf(p), f));
    return { re: p.eps_inf + s.re, im: s.im };
  },
};
