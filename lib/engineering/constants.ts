/**
 * Vacuum permeability μ0 in N/A² (= H/m), CODATA 2018 recommended value. Since the 2019 SI
 * redefinition μ0 is measured, no longer exactly 4π·10⁻⁷; the two differ by about 1e-10.
 */
export const MU_0 = 1.25663706212e-6;

/**
 * The voltage below which a DC bus is treated as safe to touch: 60 V DC is the ES1 limit of
 * IEC 62368-1 and the accessible-voltage limit of IEC 61010-1, and the level IEC 60204-1 asks
 * capacitors to discharge to (within 5 s) — from memory.
 */
export const SAFE_VOLTAGE_V = 60;

/**
 * Stored charge above which an accessible capacitor counts as hazardous: 45 µC, the figure
 * IEC 61010-1 uses for charge on accessible capacitors — from memory.
 */
export const STORED_CHARGE_THRESHOLD_C = 45e-6;
