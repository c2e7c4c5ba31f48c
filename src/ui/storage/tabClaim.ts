// Which tab works on the workbook kept in this browser. The first tab to open it holds a Web Lock
// for as long as it lives; a tab that cannot have the lock is second and works on a copy. Tabs
// tell each other over a BroadcastChannel, so the first tab can say that a second one is open.
// Without Web Locks every tab counts as first; the save numbers in the store still keep a later
// save from erasing an earlier one (see tabStorage.ts).

export const LOCK_NAME = 'kvar-ledger:workbook';
const CHANNEL_NAME = 'kvar-ledger:tabs';

export interface TabClaim {
  readonly mode: 'main' | 'copy';
  /** The claim is backed by the lock: no other tab works on the workbook while this one lives. */
  readonly locked: boolean;
  /** Stop listening (tests; the page keeps its claim until it closes). */
  close(): void;
}

export interface ClaimOptions {
  readonly locks?: LockManager | undefined;
  readonly channel?: (name: string) => BroadcastChannel | undefined;
  /** Main tab: another tab opened and works on a copy. */
  readonly onSecondTab?: () => void;
  /** Copy tab: the main tab has closed (the workbook in the browser is free again). */
  readonly onMainClosed?: () => void;
}

const defaultChannel = (name: string): BroadcastChannel | undefined =>
  typeof BroadcastChannel === 'undefined' ? undefined : new BroadcastChannel(name);

/** Claim the workbook: 'main' when no other tab holds it, else 'copy'. */
export async function claimWorkbook(opts: ClaimOptions = {}): Promise<TabClaim> {
  const channel = (opts.channel ?? defaultChannel)(CHANNEL_NAME);
  const locks = opts.locks;
  let release: () => void = () => {};
  let mode: 'main' | 'copy' = 'main';
  let locked = false;
  if (locks) {
    const held = new Promise<void>((r) => (release = r));
    mode = await new Promise<'main' | 'copy'>((resolve) => {
      void locks
        .request(LOCK_NAME, { ifAvailable: true }, (lock) => {
          locked = lock !== null;
          resolve(lock ? 'main' : 'copy');
          // Held until the page closes (or close() in tests).
          return lock ? held : undefined;
        })
        .catch(() => resolve('main'));
    });
    if (mode === 'copy')
      void locks
        .request(LOCK_NAME, () => {
          opts.onMainClosed?.();
          return held;
        })
        .catch(() => undefined);
  }
  if (channel) {
    channel.onmessage = (e: MessageEvent) => {
      if (mode === 'main' && (e.data as { copy?: boolean } | null)?.copy) opts.onSecondTab?.();
    };
    if (mode === 'copy') channel.postMessage({ copy: true });
  }
  return {
    mode,
    locked,
    close: () => {
      release();
      channel?.close();
    },
  };
}
