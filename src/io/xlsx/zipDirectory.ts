// Reads a zip archive's central directory without inflating anything, so that declared sizes,
// encryption flags and truncation are judged before the xlsx library touches the data.
import { fail, formatBytes, type FileResult } from './fileProblem.ts';
import type { XlsxLimits } from './limits.ts';

export interface ZipEntry {
  readonly name: string;
  readonly method: number;
  readonly compressedSize: number;
  readonly uncompressedSize: number;
  readonly localHeaderOffset: number;
}

const SIG_LOCAL = 0x04034b50;
const SIG_CENTRAL = 0x02014b50;
const SIG_EOCD = 0x06054b50;
const SIG_ZIP64_LOCATOR = 0x07064b50;
const SIG_ZIP64_EOCD = 0x06064b50;
const OLE_MAGIC = [0xd0, 0xcf, 0x11, 0xe0, 0xa1, 0xb1, 0x1a, 0xe1];

function startsWith(bytes: Uint8Array, magic: readonly number[]): boolean {
  return magic.every((b, i) => bytes[i] === b);
}

/** Does the byte string contain this text as UTF-16LE (how OLE stream names are stored)? */
function containsUtf16(bytes: Uint8Array, text: string): boolean {
  const needle = new Uint8Array(text.length * 2);
  for (let i = 0; i < text.length; i++) needle[i * 2] = text.charCodeAt(i);
  outer: for (let i = 0; i + needle.length <= bytes.length; i++) {
    for (let j = 0; j < needle.length; j++) if (bytes[i + j] !== needle[j]) continue outer;
    return true;
  }
  return false;
}

function looksLikeText(bytes: Uint8Array): boolean {
  const n = Math.min(bytes.length, 512);
  for (let i = 0; i < n; i++) {
    const b = bytes[i] as number;
    if (b === 0 || (b < 9 && b !== 0)) return false;
  }
  return true;
}

/** Classify a file that is not a zip: encrypted OOXML, legacy .xls, text, or something else. */
function notZip(bytes: Uint8Array): FileResult<ZipEntry[]> {
  if (startsWith(bytes, OLE_MAGIC)) {
    if (containsUtf16(bytes, 'EncryptedPackage') || containsUtf16(bytes, 'EncryptionInfo')) {
      return fail(
        'encrypted',
        'the file is password-protected (an encrypted container); open it in its program, remove the password, save as .xlsx and try again',
      );
    }
    return fail(
      'legacy-xls',
      'the file is an old binary .xls workbook, not .xlsx; save it as .xlsx (or export CSV) and try again',
    );
  }
  if (looksLikeText(bytes))
    return fail('not-zip', 'the file is text, not an xlsx workbook; import it as CSV instead');
  return fail('not-zip', 'the file is not an xlsx workbook (it is not a zip archive)');
}

function findEndOfDirectory(view: DataView): number {
  const min = Math.max(0, view.byteLength - 22 - 0xffff);
  for (let i = view.byteLength - 22; i >= min; i--) {
    if (view.getUint32(i, true) === SIG_EOCD) return i;
  }
  return -1;
}

interface Directory {
  readonly count: number;
  readonly size: number;
  readonly offset: number;
}

function readDirectoryRecord(view: DataView, eocd: number): Directory | undefined {
  let count = view.getUint16(eocd + 10, true);
  let size = view.getUint32(eocd + 12, true);
  let offset = view.getUint32(eocd + 16, true);
  if (count === 0xffff || size === 0xffffffff || offset === 0xffffffff) {
    const loc = eocd - 20;
    if (loc < 0 || view.getUint32(loc, true) !== SIG_ZIP64_LOCATOR) return undefined;
    const z = Number(view.getBigUint64(loc + 8, true));
    if (z + 56 > view.byteLength || view.getUint32(z, true) !== SIG_ZIP64_EOCD) return undefined;
    count = Number(view.getBigUint64(z + 32, true));
    size = Number(view.getBigUint64(z + 40, true));
    offset = Number(view.getBigUint64(z + 48, true));
  }
  return { count, size, offset };
}

/** Sizes of 0xFFFFFFFF live in the zip64 extra field (id 1), in a fixed order. */
function zip64Sizes(
  view: DataView,
  extraStart: number,
  extraLen: number,
  raw: { u: number; c: number; o: number },
): { u: number; c: number; o: number } {
  let p = extraStart;
  const end = extraStart + extraLen;
  while (p + 4 <= end) {
    const id = view.getUint16(p, true);
    const len = view.getUint16(p + 2, true);
    if (id === 1) {
      let q = p + 4;
      const next = (): number => {
        const v = Number(view.getBigUint64(q, true));
        q += 8;
        return v;
      };
      const u = raw.u === 0xffffffff && q + 8 <= p + 4 + len ? next() : raw.u;
      const c = raw.c === 0xffffffff && q + 8 <= p + 4 + len ? next() : raw.c;
      const o = raw.o === 0xffffffff && q + 8 <= p + 4 + len ? next() : raw.o;
      return { u, c, o };
    }
    p += 4 + len;
  }
  return raw;
}

/**
 * List the entries of a zip archive, refusing empty, non-zip, truncated, encrypted and oversized
 * files with a message that says which and why.
 */
export function readZipDirectory(bytes: Uint8Array, limits: XlsxLimits): FileResult<ZipEntry[]> {
  if (bytes.length === 0) return fail('empty', 'the file is empty (0 bytes)');
  if (bytes.length > limits.fileBytes) {
    return fail(
      'too-large',
      `the file is ${formatBytes(bytes.length)}; the largest accepted is ${formatBytes(limits.fileBytes)}`,
    );
  }
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  if (bytes.length < 4 || view.getUint32(0, true) !== SIG_LOCAL) {
    if (bytes.length >= 4 && view.getUint32(0, true) === SIG_EOCD)
      return fail('empty', 'the file is an empty zip archive, not an xlsx workbook');
    return notZip(bytes);
  }
  const truncated = (why: string) =>
    fail<ZipEntry[]>('truncated', `the file is truncated or damaged (${why}); copy or download it again`);
  if (bytes.length < 22) return truncated('shorter than a zip directory');
  const eocd = findEndOfDirectory(view);
  if (eocd < 0) return truncated('its zip directory at the end is missing');
  const dir = readDirectoryRecord(view, eocd);
  if (!dir) return truncated('its zip64 directory record is missing');
  if (dir.count > limits.entries) {
    return fail('too-large', `the archive has ${dir.count} entries; the most accepted is ${limits.entries}`);
  }
  if (dir.offset + dir.size > eocd) return truncated('its zip directory points past the end of the data');

  const entries: ZipEntry[] = [];
  let p = dir.offset;
  let total = 0;
  const decoder = new TextDecoder();
  for (let i = 0; i < dir.count; i++) {
    if (p + 46 > eocd || view.getUint32(p, true) !== SIG_CENTRAL)
      return truncated(`zip directory entry ${i + 1} is damaged`);
    const flags = view.getUint16(p + 8, true);
    const method = view.getUint16(p + 10, true);
    const nameLen = view.getUint16(p + 28, true);
    const extraLen = view.getUint16(p + 30, true);
    const commentLen = view.getUint16(p + 32, true);
    const name = decoder.decode(bytes.subarray(p + 46, p + 46 + nameLen));
    const sizes = zip64Sizes(view, p + 46 + nameLen, extraLen, {
      c: view.getUint32(p + 20, true),
      u: view.getUint32(p + 24, true),
      o: view.getUint32(p + 42, true),
    });
    if (flags & 1)
      return fail(
        'encrypted',
        'the archive is password-protected; save an unprotected copy and try again',
        name,
      );
    if (method !== 0 && method !== 8)
      return fail(
        'corrupt',
        `the entry uses compression method ${method}; only stored and deflate are read`,
        name,
      );
    if (sizes.o + 30 + sizes.c > bytes.length)
      return truncated(`entry ${name} runs past the end of the file`);
    if (sizes.u > limits.entryBytes) {
      return fail(
        'zip-bomb',
        `an entry inflates to ${formatBytes(sizes.u)}; the largest accepted is ${formatBytes(limits.entryBytes)}`,
        name,
      );
    }
    if (sizes.u > limits.ratioCheckMinBytes && sizes.u > limits.compressionRatio * Math.max(1, sizes.c)) {
      return fail(
        'zip-bomb',
        `an entry inflates ${Math.round(sizes.u / Math.max(1, sizes.c))}× (${formatBytes(sizes.c)} to ${formatBytes(sizes.u)}); at most ${limits.compressionRatio}× is accepted`,
        name,
      );
    }
    total += sizes.u;
    if (total > limits.uncompressedBytes) {
      return fail(
        'zip-bomb',
        `the archive inflates to more than ${formatBytes(limits.uncompressedBytes)}, the most accepted`,
      );
    }
    entries.push({
      name,
      method,
      compressedSize: sizes.c,
      uncompressedSize: sizes.u,
      localHeaderOffset: sizes.o,
    });
    p += 46 + nameLen + extraLen + commentLen;
  }
  return { ok: true, value: entries };
}

/** Where an entry's data starts, from its local header. */
export function entryDataOffset(bytes: Uint8Array, e: ZipEntry): number | undefined {
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  const p = e.localHeaderOffset;
  if (p + 30 > bytes.length || view.getUint32(p, true) !== SIG_LOCAL) return undefined;
  const start = p + 30 + view.getUint16(p + 26, true) + view.getUint16(p + 28, true);
  return start + e.compressedSize <= bytes.length ? start : undefined;
}
