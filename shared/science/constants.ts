// Physical and geodetic constants, SI units, each with its source.

/** Speed of light in vacuum, m/s (exact, SI definition). */
export const SPEED_OF_LIGHT_M_PER_S = 299_792_458;

/** c², m²/s². */
export const SPEED_OF_LIGHT_SQUARED_M2_PER_S2 = SPEED_OF_LIGHT_M_PER_S * SPEED_OF_LIGHT_M_PER_S;

/** Potential of the geoid W0, m²/s², IERS Conventions (2010), Table 1.1. Equals L_G·c². */
export const W0_IERS_2010_M2_PER_S2 = 62_636_856.0;

/**
 * Potential of the geoid W0, m²/s², IAG 2015 Resolution No. 1 (adopted in the 2017 update of
 * IERS Table 1.1). It differs from L_G·c²: L_G is defining and was not changed with it.
 */
export const W0_IAG_2015_M2_PER_S2 = 62_636_853.4;

/** L_G = 1 − d(TT)/d(TCG), defining constant, IAU 2000 Resolution B1.9. */
export const L_G = 6.969290134e-10;

/** Standard acceleration of gravity g_n, m/s² (3rd CGPM, 1901), used only for rough conversions. */
export const STANDARD_GRAVITY_M_PER_S2 = 9.80665;

/** Probability content of ±1σ of a normal distribution, erf(1/√2): the "68 %" interval. */
export const ONE_SIGMA_PROBABILITY = 0.6826894921370859;
