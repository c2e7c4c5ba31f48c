/** Tolerance for "within the requirement", kvar: rounding of the roll-up, not a design margin (common practice). */
export const WITHIN_TOL_KVAR = 0.5;
