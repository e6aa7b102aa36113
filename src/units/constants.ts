/**
 * Physical constants used throughout phasewise (SI, CODATA 2018).
 * @module
 */

/**
 * Speed of light in vacuum [m/s] (exact, SI 2019).
 * @category Units
 */
export const C0_M_PER_S = 299_792_458;

/**
 * Vacuum magnetic permeability μ0 [N/A²] (CODATA 2018: 1.256 637 062 12 × 10⁻⁶).
 * @category Units
 */
export const MU0_H_PER_M = 1.25663706212e-6;

/**
 * Vacuum electric permittivity ε0 = 1/(μ0 c0²) [F/m] (CODATA 2018: 8.854 187 8128 × 10⁻¹²).
 * @category Units
 */
export const EPS0_F_PER_M = 1 / (MU0_H_PER_M * C0_M_PER_S * C0_M_PER_S);

/**
 * Free-space wave impedance η0 = μ0·c0 ≈ 376.730 313 668 Ω (CODATA 2018).
 * @category Units
 */
export const ETA0_OHM = MU0_H_PER_M * C0_M_PER_S;

/**
 * Boltzmann constant k_B [J/K] (exact, SI 2019).
 * @category Units
 */
export const K_BOLTZMANN_J_PER_K = 1.380649e-23;

/**
 * Standard reference temperature T0 for noise figures [K] (IEEE Std 100 convention).
 * @category Units
 */
export const T0_K = 290;

/**
 * One jansky [W m⁻² Hz⁻¹].
 * @category Units
 */
export const JANSKY_W_PER_M2_HZ = 1e-26;
