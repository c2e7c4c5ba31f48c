// Clocks for the steps. Fast steps run several times and report the median (the machine is
// shared, so a single run is noisy); slow steps run once, because their budget is the limit.

export interface Timing {
  readonly ms: number;
  readonly minMs: number;
  readonly runs: number;
}

export function median(xs: readonly number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  const mid = Math.floor(s.length / 2);
  return s.length % 2 === 1 ? (s[mid] as number) : ((s[mid - 1] as number) + (s[mid] as number)) / 2;
}

/** Time `fn` once; returns its value too. */
export function timeOnce<T>(fn: () => T): { value: T; ms: number } {
  const t0 = performance.now();
  const value = fn();
  return { value, ms: performance.now() - t0 };
}

export async function timeOnceAsync<T>(fn: () => Promise<T>): Promise<{ value: T; ms: number }> {
  const t0 = performance.now();
  const value = await fn();
  return { value, ms: performance.now() - t0 };
}

/**
 * Run `fn(i)` up to `maxRuns` times, stopping early once `maxTotalMs` has been spent (always at
 * least once). Returns the median and the minimum, and the last value.
 */
export function timeRepeated<T>(
  fn: (i: number) => T,
  maxRuns = 7,
  maxTotalMs = 2_000,
): Timing & { value: T } {
  const times: number[] = [];
  let value: T | undefined;
  let spent = 0;
  for (let i = 0; i < maxRuns && (i === 0 || spent < maxTotalMs); i++) {
    const t0 = performance.now();
    value = fn(i);
    const dt = performance.now() - t0;
    times.push(dt);
    spent += dt;
  }
  return { ms: median(times), minMs: Math.min(...times), runs: times.length, value: value as T };
}

/**
 * Run `fn` a few times untimed first: the first edits after a large build pay for the JavaScript
 * engine compiling the hot paths and collecting the build's garbage, a one-off cost that is not
 * what each later edit costs. Steps that warm up say so in their note.
 */
export function warmUp(fn: () => unknown, times = 3): void {
  for (let i = 0; i < times; i++) fn();
}

export const peakRssMb = (): number => process.resourceUsage().maxRSS / 1024;
