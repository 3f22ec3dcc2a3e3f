/**
 * SI physical constants, defined once for the whole code base (CODATA 2018 recommended values).
 * Source: Tiesinga et al., "CODATA recommended values of the fundamental physical constants:
 * 2018", Rev. Mod. Phys. 93, 025010 (2021).
 */
/** speed of light in vacuum, m/s (exact) */
export const SPEED_OF_LIGHT_M_PER_S = 299_792_458;
/** vacuum permeability, H/m (CODATA 2018) */
export const MU0_H_PER_M = 1.25663706212e-6;
/** vacuum permittivity, F/m = 1/(μ₀c²) */
export const EPS0_F_PER_M = 1 / (MU0_H_PER_M * SPEED_OF_LIGHT_M_PER_S * SPEED_OF_LIGHT_M_PER_S);
