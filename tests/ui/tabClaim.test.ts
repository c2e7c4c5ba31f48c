// Which tab works on the workbook: the first to claim it; a later tab works on a copy and learns
// when the first closes; the first hears of the second over the tab channel. The lock manager
// here follows the Web Locks rules the claim relies on (exclusive locks, ifAvailable, a queue).
import { afterEach, describe, expect, it } from 'vitest';
import { claimWorkbook, type TabClaim } from '../../src/ui/storage/tabClaim.ts';

type Callback = (lock: { name: string } | null) => unknown;

/** Exclusive locks by name: held until the callback's promise settles; waiters are served in order. */
function lockManager(): LockManager {
  const held = new Set<string>();
  const queue = new Map<string, Array<() => void>>();
  const grant = (name: string, cb: Callback): Promise<unknown> => {
    held.add(name);
    return Promise.resolve(cb({ name })).finally(() => {
      held.delete(name);
      queue.get(name)?.shift()?.();
    });
  };
  const request = (name: string, a: unknown, b?: unknown): Promise<unknown> => {
    const opts = (typeof a === 'function' ? {} : a) as { ifAvailable?: boolean };
    const cb = (typeof a === 'function' ? a : b) as Callback;
    if (!held.has(name)) return grant(name, cb);
    if (opts.ifAvailable) return Promise.resolve(cb(null));
    return new Promise((resolve) => {
      const waiting = queue.get(name) ?? [];
      waiting.push(() => resolve(grant(name, cb)));
      queue.set(name, waiting);
    });
  };
  return { request, query: async () => ({ held: [], pending: [] }) } as unknown as LockManager;
}

let claims: TabClaim[] = [];
afterEach(() => {
  claims.forEach((c) => c.close());
  claims = [];
});

const until = async (check: () => boolean) => {
  for (let i = 0; i < 200 && !check(); i++) await new Promise((r) => setTimeout(r, 5));
  return check();
};

describe('claimWorkbook', () => {
  it('the first tab works on the workbook, a later one on a copy; each learns of the other', async () => {
    const locks = lockManager();
    const heard: string[] = [];
    const first = await claimWorkbook({ locks, onSecondTab: () => heard.push('second tab opened') });
    claims.push(first);
    const second = await claimWorkbook({ locks, onMainClosed: () => heard.push('first tab closed') });
    claims.push(second);
    expect([first.mode, second.mode]).toEqual(['main', 'copy']);
    expect(await until(() => heard.includes('second tab opened'))).toBe(true);
    first.close();
    expect(await until(() => heard.includes('first tab closed'))).toBe(true);
    // Once the second has closed too, a new tab is first again.
    second.close();
    await new Promise((r) => setTimeout(r, 0));
    const third = await claimWorkbook({ locks });
    claims.push(third);
    expect(third.mode).toBe('main');
  });

  it('counts as first without Web Locks (the save numbers still guard the workbook)', async () => {
    const a = await claimWorkbook({ locks: undefined });
    const b = await claimWorkbook({ locks: undefined });
    claims.push(a, b);
    expect([a.mode, b.mode]).toEqual(['main', 'main']);
  });
});
