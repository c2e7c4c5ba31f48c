// CPU time of finished child processes, from /proc/self/stat (cutime + cstime: children that
// have been waited for, their own waited-for children included). On a shared machine the CPU
// time of a whole-process step says more than its wall time, so both are reported.
import { readFileSync } from 'node:fs';

const TICKS_PER_SECOND = 100; // USER_HZ on Linux

/** Milliseconds of CPU used so far by waited-for children, or undefined off Linux. */
export function childrenCpuMs(): number | undefined {
  try {
    const stat = readFileSync('/proc/self/stat', 'utf8');
    // Fields after the command name (which may hold spaces) start at field 3.
    const fields = stat.slice(stat.lastIndexOf(')') + 2).split(' ');
    const cutime = Number(fields[13]);
    const cstime = Number(fields[14]);
    return Number.isFinite(cutime) && Number.isFinite(cstime)
      ? ((cutime + cstime) * 1_000) / TICKS_PER_SECOND
      : undefined;
  } catch {
    return undefined;
  }
}

/** Run a synchronous child-spawning function; returns its value and the children's CPU ms. */
export function withChildCpu<T>(fn: () => T): { value: T; cpuMs?: number } {
  const before = childrenCpuMs();
  const value = fn();
  const after = childrenCpuMs();
  return before === undefined || after === undefined ? { value } : { value, cpuMs: after - before };
}
