// The few IndexedDB calls the store needs, as promises, and opening the database so that it has
// our object store whatever version another copy of the page left it at.

export const STORE = 'workbooks';

export function request<T>(req: IDBRequest<T>): Promise<T> {
  return new Promise((resolve, reject) => {
    req.onsuccess = () => resolve(req.result);
    req.onerror = () => reject(req.error ?? new DOMException('The request failed', 'UnknownError'));
  });
}

/** Resolves when the transaction has committed; rejects when it fails or is aborted. */
export function done(tx: IDBTransaction): Promise<void> {
  return new Promise((resolve, reject) => {
    tx.oncomplete = () => resolve();
    tx.onerror = () => reject(tx.error ?? new DOMException('The write failed', 'UnknownError'));
    tx.onabort = () => reject(tx.error ?? new DOMException('The write was aborted', 'AbortError'));
  });
}

/** Send the transaction's requests to be committed now, not when the page gets round to it. */
export function commitNow(tx: IDBTransaction): void {
  // Older engines commit by themselves once the requests are done.
  (tx as IDBTransaction & { commit?: () => void }).commit?.();
}

function openAt(
  factory: IDBFactory,
  name: string,
  version: number | undefined,
  onBlocked: () => void,
): Promise<IDBDatabase> {
  const req = version === undefined ? factory.open(name) : factory.open(name, version);
  req.onupgradeneeded = () => {
    if (!req.result.objectStoreNames.contains(STORE)) req.result.createObjectStore(STORE);
  };
  req.onblocked = onBlocked;
  return request(req);
}

/**
 * Open at the version the database has (a newer copy of the page may have raised it), and add
 * our object store with one version more if it is missing. `onBlocked`: another tab holds the
 * database open and has not let go yet.
 */
export async function openDatabase(
  factory: IDBFactory,
  name: string,
  onBlocked: () => void = () => {},
): Promise<IDBDatabase> {
  const db = await openAt(factory, name, undefined, onBlocked);
  if (db.objectStoreNames.contains(STORE)) return db;
  const next = db.version + 1;
  db.close();
  return openAt(factory, name, next, onBlocked);
}
