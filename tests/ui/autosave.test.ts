// Debounced autosave with a hand-driven timer (no waiting on real time).
import { describe, expect, it } from 'vitest';
import type { WorkbookDoc } from '../../src/core/workbook/document.ts';
import { Autosaver, type AutosaveStatus } from '../../src/ui/storage/autosave.ts';
import type { SaveResult } from '../../src/ui/storage/idbStore.ts';

function harness(result: () => SaveResult) {
  const timers: Array<() => void> = [];
  const delays: number[] = [];
  const issuedNow: WorkbookDoc[] = [];
  const saved: WorkbookDoc[] = [];
  const statuses: AutosaveStatus[] = [];
  let version = 0;
  const saver = {
    save: async (doc: WorkbookDoc) => {
      saved.push(doc);
      return result();
    },
    // Records the document the moment the save is issued (before any await).
    saveNow: (doc: WorkbookDoc) => {
      issuedNow.push(doc);
      return Promise.resolve(result());
    },
  };
  const auto = new Autosaver(
    saver,
    () => ({ format: 'kvar-ledger-workbook', version: 1, title: `v${++version}`, sheets: [] }) as WorkbookDoc,
    {
      onStatus: (s) => statuses.push(s),
      setTimer: (fn, ms) => (delays.push(ms), timers.push(fn)),
      clearTimer: () => timers.splice(0, timers.length),
    },
  );
  return { auto, timers, saved, statuses, delays, issuedNow };
}

describe('Autosaver', () => {
  it('turns a burst of edits into one write', async () => {
    const h = harness(() => ({ ok: true, savedAt: 't1', unchanged: false }));
    h.auto.changed();
    h.auto.changed();
    h.auto.changed();
    expect(h.timers).toHaveLength(1);
    await h.auto.flush();
    expect(h.saved).toHaveLength(1);
    expect(h.statuses.at(-1)).toEqual({ state: 'saved', savedAt: 't1' });
    expect(h.auto.hasUnsaved).toBe(false);
  });

  it('does not write when nothing changed', async () => {
    const h = harness(() => ({ ok: true, savedAt: 't', unchanged: false }));
    await h.auto.flush();
    expect(h.saved).toHaveLength(0);
  });

  it('reports a failed write with its message', async () => {
    const h = harness(() => ({
      ok: false,
      reason: 'storage',
      message: 'Browser storage for this page is full',
    }));
    h.auto.changed();
    await h.auto.flush();
    expect(h.statuses.at(-1)).toEqual({ state: 'failed', message: 'Browser storage for this page is full' });
  });

  it('turns a throwing saver into a failed status instead of an exception', async () => {
    const h = harness(() => {
      throw new Error('disk gone');
    });
    h.auto.changed();
    await h.auto.flush();
    expect(h.statuses.at(-1)).toEqual({ state: 'failed', message: 'Saving failed: disk gone' });
  });

  it('saves an edit made while a write is running, afterwards', async () => {
    const h = harness(() => ({ ok: true, savedAt: 't', unchanged: false }));
    h.auto.changed();
    const first = h.auto.flush();
    h.auto.changed();
    await first;
    await h.auto.flush();
    expect(h.saved.map((d) => d.title)).toEqual(['v1', 'v2']);
  });

  it('issues the save at once when the page goes away, even while another save is running', async () => {
    const h = harness(() => ({ ok: true, savedAt: 't', unchanged: false }));
    h.auto.changed();
    const running = h.auto.flush();
    h.auto.changed();
    h.auto.flushNow();
    // Issued synchronously: nothing was awaited first (neither the running save nor a read).
    expect(h.issuedNow.map((d) => d.title)).toEqual(['v2']);
    expect(h.auto.hasUnsaved).toBe(true);
    await running;
    // Let the issued save report (a turn of the event loop; no timing is measured).
    await new Promise((r) => setTimeout(r, 0));
    expect(h.auto.hasUnsaved).toBe(false);
    expect(h.statuses.at(-1)).toEqual({ state: 'saved', savedAt: 't' });
    // Nothing new: nothing issued.
    h.auto.flushNow();
    expect(h.issuedNow).toHaveLength(1);
  });

  it('saves an urgent change at the next turn, others after the pause', () => {
    const h = harness(() => ({ ok: true, savedAt: 't', unchanged: false }));
    h.auto.changed();
    h.auto.changed(true);
    expect(h.delays).toEqual([700, 0]);
  });
});
