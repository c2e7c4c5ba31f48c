// The machine a run measured: the figures mean little without it (the bench machine is shared,
// so the load average at the start is recorded too).
import { spawnSync } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { cpus, loadavg, totalmem } from 'node:os';

export interface Machine {
  readonly cpu: string;
  readonly cores: number;
  readonly memoryGb: number;
  readonly node: string;
  readonly os: string;
  readonly date: string;
  readonly loadAverage: readonly number[];
  readonly libreoffice?: string;
}

function cpuModel(): string {
  try {
    const m = /^model name\s*:\s*(.+)$/m.exec(readFileSync('/proc/cpuinfo', 'utf8'));
    if (m?.[1]) return m[1].trim();
  } catch {
    // not Linux: fall through to what Node reports
  }
  return cpus()[0]?.model ?? 'unknown';
}

function osName(): string {
  try {
    const m = /^PRETTY_NAME="?([^"\n]+)"?$/m.exec(readFileSync('/etc/os-release', 'utf8'));
    if (m?.[1]) return m[1];
  } catch {
    // no os-release
  }
  return process.platform;
}

export function describeMachine(libreoffice?: string): Machine {
  const kernel = spawnSync('uname', ['-r'], { encoding: 'utf8' }).stdout?.trim();
  return {
    cpu: cpuModel(),
    cores: cpus().length,
    memoryGb: Math.round((totalmem() / 1024 ** 3) * 10) / 10,
    node: process.version,
    os: kernel ? `${osName()}, Linux ${kernel}` : osName(),
    date: new Date().toISOString(),
    loadAverage: loadavg().map((x) => Math.round(x * 100) / 100),
    ...(libreoffice ? { libreoffice } : {}),
  };
}
