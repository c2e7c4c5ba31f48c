// Clocks for the steps. Fast steps run several times and report the median (the machine is
// shared, so a single run is noisy); slow steps run once, because their budget is the limit.

export interface Timing {
  readonly ms: number;
  readonly minMs: number;
  readonly runs: number;
  /** CPU time of this process in the run(s) (median), all its threads: see cpuNow. */
  readonly cpuMs: number;
}

/**
 * CPU time of this process so far, ms (user + system, every thread, the collector's included).
 * Beside the wall time it shows how much of a step waited for a busy shared machine.
 */
export function cpuNow(): number {
  const u = process.cpuUsage();
  return (u.user + u.system) / 1000;
}

export function median(xs: readonly number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  const mid = Math.floor(s.length / 2);
  return s.length % 2 === 1 ? (s[mid] as number) : ((s[mid - 1] as number) + (s[mid] as number)) / 2;
}

/** Time `fn` once; returns its value too. */
export function timeOnce<T>(fn: () => T): { value: T; ms: number; cpuMs: number } {
  const c0 = cpuNow();
  const t0 = performance.now();
  const value = fn();
  return { value, ms: performance.now() - t0, cpuMs: cpuNow() - c0 };
}

export async function timeOnceAsync<T>(
  fn: () => Promise<T>,
): Promise<{ value: T; ms: number; cpuMs: number }> {
  const c0 = cpuNow();
  const t0 = performance.now();
  const value = await fn();
  return { value, ms: performance.now() - t0, cpuMs: cpuNow() - c0 };
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
  const cpu: number[] = [];
  let value: T | undefined;
  let spent = 0;
  for (let i = 0; i < maxRuns && (i === 0 || spent < maxTotalMs); i++) {
    const c0 = cpuNow();
    const t0 = performance.now();
    value = fn(i);
    const dt = performance.now() - t0;
    cpu.push(cpuNow() - c0);
    times.push(dt);
    spent += dt;
  }
  return {
    ms: median(times),
    minMs: Math.min(...times),
    runs: times.length,
    cpuMs: median(cpu),
    value: value as T,
  };
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
