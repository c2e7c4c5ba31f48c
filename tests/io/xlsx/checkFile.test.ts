// The gate before the xlsx library: each hostile or broken file is refused with a clear message.
// Zip layout per PKWARE APPNOTE.TXT; encrypted OOXML container per MS-OFFCRYPTO / MS-CFB.
import { describe, expect, it } from 'vitest';
import { checkXlsxBytes } from '../../../src/io/xlsx/checkFile.ts';
import { DEFAULT_XLSX_LIMITS, MAX_SHEET_ROWS } from '../../../src/io/xlsx/limits.ts';
import { encryptedContainer, makeZip, sheetXmlWithRows, xlsxShell } from './zipFixtures.ts';

async function problemOf(bytes: Uint8Array, limits = DEFAULT_XLSX_LIMITS) {
  const r = await checkXlsxBytes(bytes, limits);
  if (r.ok) throw new Error('expected the file to be refused');
  return r.problem;
}

describe('checkXlsxBytes', () => {
  it('accepts a small well-formed workbook and reports its extent', async () => {
    const r = await checkXlsxBytes(xlsxShell(sheetXmlWithRows(12)));
    expect(r).toMatchObject({ ok: true, value: { sheets: [{ rows: 12, maxRow: 12, maxColumn: 1 }] } });
  });

  it('refuses an empty file', async () => {
    const p = await problemOf(new Uint8Array());
    expect(p.code).toBe('empty');
    expect(p.message).toMatch(/empty \(0 bytes\)/);
  });

  it('refuses text and random bytes as not a zip', async () => {
    expect((await problemOf(new TextEncoder().encode('tag,bus,kind\nM1,B1,motor\n'))).message).toMatch(
      /text.*CSV/,
    );
    const noise = new Uint8Array(300).map((_, i) => (i * 37 + 11) % 256);
    expect((await problemOf(noise)).code).toBe('not-zip');
  });

  it('refuses a truncated file', async () => {
    const whole = xlsxShell(sheetXmlWithRows(500));
    const p = await problemOf(whole.subarray(0, Math.floor(whole.length / 2)));
    expect(p.code).toBe('truncated');
    expect(p.message).toMatch(/truncated or damaged/);
  });

  it('refuses a password-protected (encrypted OLE) file', async () => {
    const p = await problemOf(encryptedContainer());
    expect(p.code).toBe('encrypted');
    expect(p.message).toMatch(/password-protected/);
  });

  it('refuses an encrypted zip entry', async () => {
    const p = await problemOf(xlsxShell(sheetXmlWithRows(2), { encrypted: true }));
    expect(p).toMatchObject({ code: 'encrypted', where: 'xl/worksheets/sheet1.xml' });
  });

  it('refuses a zip that is not a workbook', async () => {
    const p = await problemOf(
      makeZip([
        { name: 'word/document.xml', data: '<w/>' },
        { name: '[Content_Types].xml', data: '<T/>' },
      ]),
    );
    expect(p.code).toBe('wrong-layout');
    expect(p.message).toMatch(/word-processor document/);
  });

  it('refuses a sheet of one million rows before any library loads it', async () => {
    const p = await problemOf(xlsxShell(sheetXmlWithRows(1_000_000)));
    expect(p.code).toBe('too-many-rows');
    expect(p.message).toContain(MAX_SHEET_ROWS.toLocaleString('en'));
  });

  it('refuses a sheet whose only row is number 1,048,576', async () => {
    const xml =
      '<worksheet><sheetData><row r="1048576"><c r="A1048576"><v>1</v></c></row></sheetData></worksheet>';
    expect((await problemOf(xlsxShell(xml))).code).toBe('too-many-rows');
  });

  it('refuses a zip bomb by its declared compression ratio', async () => {
    const p = await problemOf(xlsxShell(' '.repeat(40 * 1024 * 1024)));
    expect(p.code).toBe('zip-bomb');
    expect(p.message).toMatch(/inflates \d+×/);
  });

  it('refuses a zip bomb whose directory lies about its size', async () => {
    const xml = `<worksheet><sheetData>${' '.repeat(4 * 1024 * 1024)}</sheetData></worksheet>`;
    const p = await problemOf(xlsxShell(xml, { declaredSize: 2000 }));
    expect(p.code).toBe('zip-bomb');
    expect(p.message).toMatch(/beyond the 2.0 KiB its directory declares/);
  });

  it('refuses a file whose declared total is over the limit', async () => {
    const limits = { ...DEFAULT_XLSX_LIMITS, uncompressedBytes: 1000 };
    expect((await problemOf(xlsxShell(sheetXmlWithRows(100)), limits)).code).toBe('zip-bomb');
  });
});
