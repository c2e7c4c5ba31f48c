// A tiny zip writer for tests, able to lie about sizes and flags, so hostile files can be made
// in the test itself (zip format: PKWARE APPNOTE.TXT, sections 4.3.7, 4.3.12, 4.3.16).
import { crc32, deflateRawSync } from 'node:zlib';

export interface FixtureEntry {
  readonly name: string;
  readonly data: string | Uint8Array;
  /** Declare this uncompressed size instead of the true one. */
  readonly declaredSize?: number;
  /** Set the "encrypted" flag bit. */
  readonly encrypted?: boolean;
  readonly store?: boolean;
}

export function makeZip(entries: readonly FixtureEntry[]): Uint8Array {
  const locals: Buffer[] = [];
  const centrals: Buffer[] = [];
  let offset = 0;
  for (const e of entries) {
    const raw = typeof e.data === 'string' ? Buffer.from(e.data, 'utf8') : Buffer.from(e.data);
    const body = e.store ? raw : deflateRawSync(raw);
    const name = Buffer.from(e.name, 'utf8');
    const size = e.declaredSize ?? raw.length;
    const flags = e.encrypted ? 1 : 0;
    const method = e.store ? 0 : 8;
    const crc = crc32(raw);
    const local = Buffer.alloc(30);
    local.writeUInt32LE(0x04034b50, 0);
    local.writeUInt16LE(20, 4);
    local.writeUInt16LE(flags, 6);
    local.writeUInt16LE(method, 8);
    local.writeUInt32LE(crc, 14);
    local.writeUInt32LE(body.length, 18);
    local.writeUInt32LE(size, 22);
    local.writeUInt16LE(name.length, 26);
    locals.push(local, name, body);
    const central = Buffer.alloc(46);
    central.writeUInt32LE(0x02014b50, 0);
    central.writeUInt16LE(20, 4);
    central.writeUInt16LE(20, 6);
    central.writeUInt16LE(flags, 8);
    central.writeUInt16LE(method, 10);
    central.writeUInt32LE(crc, 16);
    central.writeUInt32LE(body.length, 20);
    central.writeUInt32LE(size, 24);
    central.writeUInt16LE(name.length, 28);
    central.writeUInt32LE(offset, 42);
    centrals.push(central, name);
    offset += 30 + name.length + body.length;
  }
  const dir = Buffer.concat(centrals);
  const end = Buffer.alloc(22);
  end.writeUInt32LE(0x06054b50, 0);
  end.writeUInt16LE(entries.length, 8);
  end.writeUInt16LE(entries.length, 10);
  end.writeUInt32LE(dir.length, 12);
  end.writeUInt32LE(offset, 16);
  return new Uint8Array(Buffer.concat([...locals, dir, end]));
}

const CONTENT_TYPES =
  '<?xml version="1.0" encoding="UTF-8"?><Types xmlns="http://schemas.openxmlformats.org/package/2006/content-types"/>';
const WORKBOOK =
  '<?xml version="1.0" encoding="UTF-8"?><workbook xmlns="http://schemas.openxmlformats.org/spreadsheetml/2006/main"><sheets><sheet name="S" sheetId="1"/></sheets></workbook>';

/** The minimum entries that make the gate call a zip an xlsx, plus the given worksheet XML. */
export function xlsxShell(sheetXml: string | Uint8Array, sheetOpts: Partial<FixtureEntry> = {}): Uint8Array {
  return makeZip([
    { name: '[Content_Types].xml', data: CONTENT_TYPES },
    { name: 'xl/workbook.xml', data: WORKBOOK },
    { name: 'xl/worksheets/sheet1.xml', data: sheetXml, ...sheetOpts },
  ]);
}

/** Worksheet XML with `rows` rows of one number each. */
export function sheetXmlWithRows(rows: number): string {
  const parts: string[] = [
    '<?xml version="1.0" encoding="UTF-8"?><worksheet xmlns="http://schemas.openxmlformats.org/spreadsheetml/2006/main"><sheetData>',
  ];
  for (let r = 1; r <= rows; r++) parts.push(`<row r="${r}"><c r="A${r}"><v>${r}</v></c></row>`);
  parts.push('</sheetData></worksheet>');
  return parts.join('');
}

/**
 * The start of an OLE compound file (MS-CFB 2.2 header signature) whose directory names the
 * streams an encrypted OOXML package has (MS-OFFCRYPTO 2.3.4): what a password-protected xlsx is.
 */
export function encryptedContainer(): Uint8Array {
  const header = Buffer.alloc(512);
  Buffer.from([0xd0, 0xcf, 0x11, 0xe0, 0xa1, 0xb1, 0x1a, 0xe1]).copy(header, 0);
  header.writeUInt16LE(0x003e, 24);
  header.writeUInt16LE(0x0003, 26);
  header.writeUInt16LE(0xfffe, 28);
  header.writeUInt16LE(9, 30);
  const dir = Buffer.alloc(512);
  ['Root Entry', 'EncryptionInfo', 'EncryptedPackage', '\u0006DataSpaces'].forEach((n, i) => {
    const name = Buffer.from(n + '\0', 'utf16le');
    name.copy(dir, i * 128);
    dir.writeUInt16LE(name.length, i * 128 + 64);
    dir[i * 128 + 66] = i === 0 ? 5 : 2;
  });
  return new Uint8Array(Buffer.concat([header, dir, Buffer.alloc(1024)]));
}

let million: Uint8Array | undefined;
/** A well-formed xlsx whose one sheet has 1,000,000 rows (built once per test file). */
export function millionRowXlsx(): Uint8Array {
  million ??= xlsxShell(sheetXmlWithRows(1_000_000));
  return million;
}
