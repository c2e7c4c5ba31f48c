// Plain-formula fragments shared by the family files. Each mirrors the operation order of the
// matching element function, so the expansion and the compute agree to rounding.

/** tan(acos c) as √(1 − c²)/c, like elements/powerTriangle.ts tanFromCos. */
export const tanText = (c: string): string => `(SQRT(1-POWER(${c},2))/${c})`;

/** x² as POWER(x,2) (equal to x·x in floating point). */
export const squareText = (x: string): string => `POWER(${x},2)`;

/**
 * A boolean argument's text as a condition. Bare TRUE/FALSE are written as TRUE()/FALSE(),
 * which every spreadsheet program reads (some formula engines do not accept the bare words).
 */
export const boolText = (t: string | undefined): string => {
  const u = (t ?? 'FALSE').trim().toUpperCase();
  if (u === 'TRUE') return 'TRUE()';
  if (u === 'FALSE') return 'FALSE()';
  return t as string;
};
