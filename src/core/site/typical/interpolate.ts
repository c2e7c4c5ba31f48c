// Reading a value between the rows of a rating table. Ratings follow a geometric series (R10,
// R20), so values are read on a logarithmic scale of the rating unless a source says otherwise.

/** A table row: rating (kVA or kW) → value. Rows in ascending rating. */
export type RatingTable = ReadonlyArray<readonly [rating: number, value: number]>;

export type Scale = 'linear' | 'log';

/**
 * The value at `rating`, interpolated between the two neighbouring rows; undefined outside the
 * table (a typical value is not stretched beyond the sizes it was given for).
 */
export function lookup(table: RatingTable, rating: number, scale: Scale = 'log'): number | undefined {
  if (!(rating > 0) || table.length === 0) return undefined;
  const first = table[0] as readonly [number, number];
  const last = table[table.length - 1] as readonly [number, number];
  if (rating < first[0] || rating > last[0]) return undefined;
  for (let i = 0; i < table.length; i++) {
    const [r1, v1] = table[i] as readonly [number, number];
    if (rating === r1) return v1;
    const next = table[i + 1];
    if (!next || rating > next[0]) continue;
    const [r2, v2] = next;
    const t = scale === 'log' ? Math.log(rating / r1) / Math.log(r2 / r1) : (rating - r1) / (r2 - r1);
    return v1 + (v2 - v1) * t;
  }
  return undefined;
}

/** The value of the band a rating falls in: rows are (upper limit of the band, value). */
export function band(table: RatingTable, rating: number): number | undefined {
  if (!(rating > 0)) return undefined;
  for (const [upTo, value] of table) if (rating <= upTo) return value;
  return undefined;
}
