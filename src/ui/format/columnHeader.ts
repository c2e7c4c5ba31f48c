// What the frozen column header shows: the letter (for typing references), the unit taken from
// the sheet's header text, and a sample of the number format.
import type { ColumnInfo } from '../../core/workbook/document.ts';

/** 'P (kW)' → 'kW'; 'cos φ' → undefined. The last parenthesised part is the unit. */
export function unitOf(header: string): string | undefined {
  const m = /\(([^()]+)\)\s*$/.exec(header);
  return m ? (m[1] as string).trim() : undefined;
}

/**
 * How numbers in the column are shown, in words an estimator reads at a glance: decimal places
 * ('0.0' → '1 dp', '0.0##' → '1–3 dp', '0' → '0 dp', '0.0%' → '1 dp %'); undefined for General.
 */
export function formatHint(info: ColumnInfo | undefined): string | undefined {
  const code = info?.format?.trim();
  if (!code || code.toLowerCase() === 'general') return undefined;
  const m = /^(?:#,##)?0(?:\.(0*)(#*))?(%|E\+00)?$/.exec(code);
  if (!m) return code;
  const min = m[1]?.length ?? 0,
    max = min + (m[2]?.length ?? 0);
  const dp = max > min ? `${min}–${max} dp` : `${min} dp`;
  return m[3] === '%' ? `${dp} %` : m[3] ? `${dp} exp` : dp;
}

export interface HeaderLabel {
  readonly letter: string;
  /** e.g. 'kW · 0.0', or '' when nothing is known. */
  readonly detail: string;
  readonly computed: boolean;
}

export function headerLabel(letter: string, info: ColumnInfo | undefined): HeaderLabel {
  const parts = [info ? unitOf(info.header) : undefined, formatHint(info)].filter((p): p is string => !!p);
  return { letter, detail: parts.join(' · '), computed: info?.computed === true };
}
