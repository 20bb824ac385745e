/**
 * Physical constants in SI. µ0 is taken as 4π·10⁻⁷ H/m, the value the inductance formulas
 * were fitted with; the 2019 SI value differs by less than 1 part in 10⁹.
 */
export const MU0 = 4 * Math.PI * 1e-7;

/** Speed of light in vacuum, m/s (exact). */
const SPEED_OF_LIGHT = 299_792_458;

/** Impedance of free space η0 = µ0·c ≈ 376.73 Ω. */
export const ETA0 = MU0 * SPEED_OF_LIGHT;

/** Micrometres to metres. */
export const UM = 1e-6;

/** Henries to nanohenries. */
export const TO_NH = 1e9;
