// The harmonics a bank must stay clear of, and how far: shared by the design rules and the
// workbook's resonance check (a module of its own, so the page's first download needs only these).

/** Characteristic harmonics of six-pulse converters, h = 6k ± 1 (published: IEEE Std 519, IEC 61000-2-4). */
export const CHARACTERISTIC_HARMONICS: readonly number[] = [5, 7, 11, 13];

/** A parallel resonance closer than this share to a characteristic harmonic is flagged (common practice: ±10 %). */
export const RESONANCE_MARGIN = 0.1;
