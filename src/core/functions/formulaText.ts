// Plain-formula fragments shared by the family files. Each mirrors the operation order of the
// matching element function, so the expansion and the compute agree to rounding.

/** tan(acos c) as √(1 − c²)/c, like elements/powerTriangle.ts tanFromCos. */
export const tanText = (c: string): string => `(SQRT(1-POWER(${c},2))/${c})`;

/** x² as POWER(x,2) (equal to x·x in floating point). */
export const squareText = (x: string): string => `POWER(${x},2)`;
