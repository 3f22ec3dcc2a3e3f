/**
 * Polarization projection of a material field. A 2D device (invariant along z) decouples into two
 * scalar problems named by the field that points along z:
 * - `Ez`: E along z. The medium acts through ε_zz and the in-plane 2×2 μ_t;
 *   wave equation ∇·(μ_t ∇E_z / det μ_t) + k₀² ε_zz E_z = 0.
 * - `Hz`: H along z. The medium acts through μ_zz and the in-plane 2×2 ε_t (swap ε and μ).
 * A 3D device has no such projection: `3D` keeps all six components of ε and μ.
 * (Convention of this project, design brief §2; the wave equation is the standard 2D reduction of
 * Maxwell's equations for z-invariant media, e.g. Schurig, Pendry, Smith, Opt. Express 14, 9794 (2006).)
 */
export const POLARIZATIONS = ["Ez", "Hz", "3D"] as const;
export type Polarization = (typeof POLARIZATIONS)[number];
export type PlanarPolarization = "Ez" | "Hz";

export const EZ_COMPONENTS = ["eps_zz", "mu_xx", "mu_yy", "mu_xy"] as const;
export const HZ_COMPONENTS = ["mu_zz", "eps_xx", "eps_yy", "eps_xy"] as const;
export const FULL_COMPONENTS = [
  "eps_xx", "eps_yy", "eps_zz", "eps_xy", "eps_xz", "eps_yz",
  "mu_xx", "mu_yy", "mu_zz", "mu_xy", "mu_xz", "mu_yz",
] as const;

/** Names of the kept components, in storage order, for a polarization. */
export function componentNames(polarization: Polarization): readonly string[] {
  return polarization === "Ez" ? EZ_COMPONENTS : polarization === "Hz" ? HZ_COMPONENTS : FULL_COMPONENTS;
}

/** One line saying what the polarization keeps, for help texts and reports. */
export function polarizationSummary(polarization: Polarization): string {
  switch (polarization) {
    case "Ez":
      return "E along z: the device acts through ε_zz and the in-plane μ (μ_xx, μ_yy, μ_xy)";
    case "Hz":
      return "H along z: the device acts through μ_zz and the in-plane ε (ε_xx, ε_yy, ε_xy)";
    default:
      return "3D device: no polarization reduction; all six components of ε and μ are kept";
  }
}
