/** SI physical constants used by the cell models (CODATA 2018 recommended values). */
/** speed of light in vacuum, m/s (exact) */
export const C0 = 299_792_458;
/** vacuum permeability, H/m (CODATA 2018) */
export const MU0 = 1.25663706212e-6;
/** vacuum permittivity, F/m = 1/(μ₀c²) */
export const EPS0 = 1 / (MU0 * C0 * C0);
