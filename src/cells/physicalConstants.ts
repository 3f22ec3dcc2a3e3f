/** The cell models' short names for the SI constants of core/physicalConstants.ts (defined once there). */
import { EPS0_F_PER_M, MU0_H_PER_M, SPEED_OF_LIGHT_M_PER_S } from "../core/physicalConstants.js";

/** speed of light in vacuum, m/s (exact) */
export const C0 = SPEED_OF_LIGHT_M_PER_S;
/** vacuum permeability, H/m (CODATA 2018) */
export const MU0 = MU0_H_PER_M;
/** vacuum permittivity, F/m = 1/(μ₀c²) */
export const EPS0 = EPS0_F_PER_M;
