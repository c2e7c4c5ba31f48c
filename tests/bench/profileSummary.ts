// A V8 CPU profile (from the inspector or the DevTools protocol) as two short tables: the
// functions with the most self time, and the project files most often on the stack.
// "(garbage collector)" is the collector; "dispatch" and "(program)" are the profiler's and the
// runtime's own time around the measured code.

export interface ProfileNode {
  id: number;
  callFrame: { functionName: string; url: string; lineNumber: number };
  children?: number[];
}
export interface Profile {
  nodes: ProfileNode[];
  samples: number[];
  timeDeltas: number[];
}

const short = (url: string) =>
  url
    .replace(/^file:\/\//, '')
    .replace(/^.*\/work\/main\//, '')
    .replace(/^.*node_modules\//, 'nm:');

export function summarise(p: Profile, top = 25): string {
  const byId = new Map(p.nodes.map((n) => [n.id, n]));
  const parent = new Map<number, number>();
  for (const n of p.nodes) for (const c of n.children ?? []) parent.set(c, n.id);
  const self = new Map<string, number>();
  const onStack = new Map<string, number>();
  let total = 0;
  p.samples.forEach((id, i) => {
    const dt = (p.timeDeltas[i] ?? 0) / 1_000;
    total += dt;
    const n = byId.get(id);
    if (!n) return;
    const key = `${n.callFrame.functionName || '(anonymous)'}  ${short(n.callFrame.url)}`;
    self.set(key, (self.get(key) ?? 0) + dt);
    const files = new Set<string>();
    for (let cur: number | undefined = id; cur !== undefined; cur = parent.get(cur)) {
      const u = byId.get(cur)?.callFrame.url ?? '';
      if (/\/src\/(core|engine|io|ui|cli)\//.test(u) && !u.includes('node_modules')) files.add(short(u));
    }
    for (const f of files) onStack.set(f, (onStack.get(f) ?? 0) + dt);
  });
  const table = (m: Map<string, number>) =>
    [...m.entries()]
      .sort((a, b) => b[1] - a[1])
      .slice(0, top)
      .map(
        ([k, ms]) => `${ms.toFixed(0).padStart(8)} ms ${((100 * ms) / total).toFixed(1).padStart(5)} %  ${k}`,
      )
      .join('\n');
  return `sampled ${total.toFixed(0)} ms\n\nself time by function:\n${table(self)}\n\nproject files on the stack (inclusive):\n${table(onStack)}\n`;
}
