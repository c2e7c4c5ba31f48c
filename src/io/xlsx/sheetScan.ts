// A streaming look inside each worksheet before the xlsx library loads the file: inflates the
// sheet XML chunk by chunk, counts rows and the widest column, and stops as soon as a limit is
// passed or the entry inflates beyond what its directory declared (a lying zip bomb).
import { fail, formatBytes, type FileResult } from './fileProblem.ts';
import type { XlsxLimits } from './limits.ts';
import { entryDataOffset, type ZipEntry } from './zipDirectory.ts';

export interface SheetExtent {
  /** Zip entry name, e.g. xl/worksheets/sheet1.xml. */
  readonly entry: string;
  readonly rows: number;
  readonly maxRow: number;
  readonly maxColumn: number;
}

export const WORKSHEET_ENTRY = /^xl\/worksheets\/[^/]+\.xml$/i;

const TAG = /<(?:[A-Za-z_][\w.-]*:)?(row|c)\b([^>]*)>/g;
const ROW_ATTR = /\br="(\d+)"/;
const CELL_ATTR = /\br="([A-Za-z]{1,4})\d+"/;

function columnNumber(letters: string): number {
  let n = 0;
  for (const ch of letters.toUpperCase()) n = n * 26 + (ch.charCodeAt(0) - 64);
  return n;
}

class ExtentCounter {
  rows = 0;
  maxRow = 0;
  maxColumn = 0;
  private carry = '';

  /** Feed decoded text; only complete tags are examined, the tail waits for the next chunk. */
  feed(text: string, final: boolean): void {
    const all = this.carry + text;
    const cut = final ? all.length : all.lastIndexOf('<');
    const body = cut < 0 ? all : all.slice(0, cut);
    this.carry = cut < 0 ? '' : all.slice(cut);
    for (const m of body.matchAll(TAG)) {
      if (m[1] === 'row') {
        this.rows++;
        const r = ROW_ATTR.exec(m[2] ?? '');
        this.maxRow = Math.max(this.maxRow, r ? Number(r[1]) : this.maxRow + 1);
      } else {
        const c = CELL_ATTR.exec(m[2] ?? '');
        if (c) this.maxColumn = Math.max(this.maxColumn, columnNumber(c[1] as string));
      }
    }
  }
}

async function* inflated(bytes: Uint8Array, e: ZipEntry, start: number): AsyncGenerator<Uint8Array> {
  const data = bytes.subarray(start, start + e.compressedSize);
  if (e.method === 0) {
    yield data;
    return;
  }
  const stream = new Blob([data as Uint8Array<ArrayBuffer>])
    .stream()
    .pipeThrough(new DecompressionStream('deflate-raw'));
  const reader = stream.getReader();
  try {
    for (;;) {
      const { done, value } = await reader.read();
      if (done) return;
      yield value;
    }
  } finally {
    await reader.cancel().catch(() => undefined);
  }
}

async function scanOne(bytes: Uint8Array, e: ZipEntry, limits: XlsxLimits): Promise<FileResult<SheetExtent>> {
  const start = entryDataOffset(bytes, e);
  if (start === undefined)
    return fail(
      'truncated',
      'the file is truncated or damaged (a worksheet is cut short); copy or download it again',
      e.name,
    );
  const counter = new ExtentCounter();
  const decoder = new TextDecoder();
  let produced = 0;
  try {
    for await (const chunk of inflated(bytes, e, start)) {
      produced += chunk.length;
      if (produced > e.uncompressedSize || produced > limits.entryBytes) {
        return fail(
          'zip-bomb',
          `a worksheet inflates beyond the ${formatBytes(e.uncompressedSize)} its directory declares`,
          e.name,
        );
      }
      counter.feed(decoder.decode(chunk, { stream: true }), false);
      if (counter.rows > limits.sheetRows || counter.maxRow > limits.sheetRows) {
        return fail(
          'too-many-rows',
          `a worksheet has more than ${limits.sheetRows.toLocaleString('en')} rows, the most accepted (see README, Limits)`,
          e.name,
        );
      }
      if (counter.maxColumn > limits.sheetColumns) {
        return fail(
          'too-many-columns',
          `a worksheet uses more than ${limits.sheetColumns} columns, the most accepted (see README, Limits)`,
          e.name,
        );
      }
    }
    counter.feed(decoder.decode(), true);
  } catch {
    return fail(
      'corrupt',
      'a worksheet cannot be inflated (damaged data); copy or download the file again',
      e.name,
    );
  }
  if (counter.rows > limits.sheetRows || counter.maxRow > limits.sheetRows) {
    return fail(
      'too-many-rows',
      `a worksheet has more than ${limits.sheetRows.toLocaleString('en')} rows, the most accepted (see README, Limits)`,
      e.name,
    );
  }
  return {
    ok: true,
    value: { entry: e.name, rows: counter.rows, maxRow: counter.maxRow, maxColumn: counter.maxColumn },
  };
}

/** Scan every worksheet entry; the first problem found wins. */
export async function scanWorksheets(
  bytes: Uint8Array,
  entries: readonly ZipEntry[],
  limits: XlsxLimits,
): Promise<FileResult<SheetExtent[]>> {
  const out: SheetExtent[] = [];
  for (const e of entries.filter((x) => WORKSHEET_ENTRY.test(x.name))) {
    const r = await scanOne(bytes, e, limits);
    if (!r.ok) return r;
    out.push(r.value);
  }
  return { ok: true, value: out };
}
