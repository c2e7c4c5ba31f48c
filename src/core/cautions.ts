// The cautions that travel with every figure Kvar Ledger produces: written once here and shown
// by the page's About box, the Site sheet, the export's cover, the CLI and the function reference.

/** The cautions in full, one paragraph each. */
export const CAUTION_LINES: readonly string[] = [
  'Kvar Ledger estimates. Its figures are for pricing and early decisions, not a design.',
  'Capacitor banks, harmonic resonance and switching overvoltage can hurt people and damage plant: banks hold a dangerous charge after switch-off, a bank tuned near a harmonic can overheat or fail, motors can self-excite, and overcompensation raises voltage at light load.',
  "The final design, protection and switching must follow local codes and the utility's rules, with studies and sign-off by a licensed engineer.",
];

/** The cautions in one line, for a terminal or a generated reference. */
export const CAUTION_SHORT =
  'Estimate only: capacitor banks, resonance and overvoltage can hurt people and plant; the final design follows local codes, the utility and a licensed engineer.';
