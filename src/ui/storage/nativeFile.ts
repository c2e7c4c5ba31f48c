// The native file: the workbook as JSON (*.kvar.json), saved by download and opened from disk.
import type { WorkbookDoc } from '../../core/workbook/document.ts';
import { parseWorkbookText } from '../model/docValidate.ts';
import { serializeForStorage } from './idbStore.ts';

export const NATIVE_EXTENSION = '.kvar.json';

/** 'Cold store (demo)' → 'cold-store-demo.kvar.json' */
export function fileNameFor(title: string, ext = NATIVE_EXTENSION): string {
  const stem = title
    .toLowerCase()
    .normalize('NFKD')
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-+|-+$/g, '')
    .slice(0, 60);
  return `${stem || 'workbook'}${ext}`;
}

export function download(bytes: BlobPart, name: string, type: string): void {
  const url = URL.createObjectURL(new Blob([bytes], { type }));
  const a = document.createElement('a');
  a.href = url;
  a.download = name;
  document.body.append(a);
  // A click that does not bubble: the grid would take a page-level click as the user leaving it
  // and drop the keyboard, so the next Ctrl+Z after Ctrl+S would go nowhere.
  a.dispatchEvent(new MouseEvent('click', { bubbles: false, cancelable: true }));
  a.remove();
  setTimeout(() => URL.revokeObjectURL(url), 10_000);
}

/** Save as a file; the same check as the browser storage runs first. */
export function saveNativeFile(
  doc: WorkbookDoc,
): { ok: true; name: string } | { ok: false; message: string } {
  const ser = serializeForStorage(doc);
  if (!ser.ok) return ser;
  const name = fileNameFor(doc.title);
  download(JSON.stringify(JSON.parse(ser.text), null, 1), name, 'application/json');
  return { ok: true, name };
}

/** Ask for a file; resolves undefined when the user cancels. */
export function pickFile(accept: string): Promise<File | undefined> {
  return new Promise((resolve) => {
    const input = document.createElement('input');
    input.type = 'file';
    input.accept = accept;
    input.addEventListener('change', () => resolve(input.files?.[0]));
    input.addEventListener('cancel', () => resolve(undefined));
    input.click();
  });
}

export const MAX_NATIVE_BYTES = 64 * 1024 * 1024;

export async function readNativeFile(
  file: File,
): Promise<{ ok: true; doc: WorkbookDoc } | { ok: false; message: string }> {
  if (file.size > MAX_NATIVE_BYTES)
    return {
      ok: false,
      message: `"${file.name}" is ${(file.size / 1048576).toFixed(0)} MB; workbooks up to ${MAX_NATIVE_BYTES / 1048576} MB can be opened.`,
    };
  const r = parseWorkbookText(await file.text());
  return r.ok ? r : { ok: false, message: `"${file.name}" cannot be opened: ${r.message}` };
}
