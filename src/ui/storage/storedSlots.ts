// Looking through what the browser store keeps besides the open workbook: the state before the
// last one, the workbook set aside when another replaced it, and copies kept by other tabs. Used
// by commands only, so it loads with them.
import type { WorkbookDoc } from '../../core/workbook/document.ts';
import { request } from './idbRequests.ts';
import {
  COPY_PREFIX,
  JOURNAL,
  PREVIOUS,
  readState,
  SET_ASIDE,
  type StoredState,
  type WorkbookStore,
} from './idbStore.ts';

async function readable(
  store: WorkbookStore,
  slot: string,
): Promise<{ doc: WorkbookDoc; savedAt: string } | undefined> {
  const s = readState(await request(store.objectStore('readonly').get(slot)));
  return s && { doc: s.doc, savedAt: s.savedAt };
}

/** The state before the last one (what loading falls back to). */
export function loadPrevious(
  store: WorkbookStore,
): Promise<{ doc: WorkbookDoc; savedAt: string } | undefined> {
  return readable(store, PREVIOUS);
}

/** The workbook set aside when a template, file or import replaced it. */
export function loadSetAside(
  store: WorkbookStore,
): Promise<{ doc: WorkbookDoc; savedAt: string } | undefined> {
  return readable(store, SET_ASIDE);
}

/** Copies kept by other tabs: slot, title and when each was last saved, newest first. */
export async function copies(
  store: WorkbookStore,
): Promise<Array<{ slot: string; title: string; savedAt: string }>> {
  const os = store.objectStore('readonly');
  const range = IDBKeyRange.bound(COPY_PREFIX, `${COPY_PREFIX}\uffff`);
  const [keys, values] = await Promise.all([
    request(os.getAllKeys(range)),
    request(os.getAll(range)) as Promise<StoredState[]>,
  ]);
  return keys
    .map((k, i) => ({ slot: String(k), title: values[i]?.title ?? '', savedAt: values[i]?.savedAt ?? '' }))
    .sort((a, b) => b.savedAt.localeCompare(a.savedAt));
}

/** Remove a slot and its journal (a copy brought back into the workbook). */
export async function dropSlot(store: WorkbookStore, slot: string): Promise<void> {
  const os = store.objectStore('readwrite');
  os.delete(slot);
  await request(os.delete(IDBKeyRange.bound([JOURNAL, slot], [JOURNAL, slot, []])));
}
