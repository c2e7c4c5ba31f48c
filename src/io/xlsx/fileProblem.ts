// Why a file could not be read, in words a user can act on. Every reader in src/io/xlsx returns
// one of these instead of throwing, so the caller can show it and keep the open workbook as is.

export type FileProblemCode =
  | 'empty'
  | 'not-zip'
  | 'truncated'
  | 'encrypted'
  | 'legacy-xls'
  | 'too-large'
  | 'zip-bomb'
  | 'too-many-rows'
  | 'too-many-columns'
  | 'wrong-layout'
  | 'corrupt'
  | 'unknown-function'
  | 'circular-reference';

export interface FileProblem {
  readonly code: FileProblemCode;
  /** What is wrong and what to do, e.g. "the file is password-protected; save an unprotected copy". */
  readonly message: string;
  /** Where: a zip entry, "Sheet!B7", a sheet name. */
  readonly where?: string;
}

export type FileResult<T> =
  { readonly ok: true; readonly value: T } | { readonly ok: false; readonly problem: FileProblem };

export function fail<T>(code: FileProblemCode, message: string, where?: string): FileResult<T> {
  return { ok: false, problem: where === undefined ? { code, message } : { code, message, where } };
}

/** One line for a status bar or the command line: "message (where)". */
export function describeProblem(p: FileProblem): string {
  return p.where ? `${p.message} (at ${p.where})` : p.message;
}

export function formatBytes(n: number): string {
  if (n >= 1024 * 1024) return `${(n / (1024 * 1024)).toFixed(1)} MiB`;
  if (n >= 1024) return `${(n / 1024).toFixed(1)} KiB`;
  return `${n} bytes`;
}
