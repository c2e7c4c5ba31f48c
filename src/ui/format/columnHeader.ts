// What the frozen column header shows: the letter (for typing references), the unit taken from
// the sheet's header text, and a sample of the number format.
import type { ColumnInfo } from '../../core/workbook/document.ts';

/** 'P (kW)' → 'kW'; 'cos φ' → undefined. The last parenthesised part is the unit. */
export function unitOf(header: string): string | undefined {
  const m = /\(([^()]+)\)\s*$/.exec(header);
  return m ? (m[1] as string).trim() : undefined;
}

/** '0.000' → '0.000'; undefined → undefined. A short hint of how numbers in the column look. */
export function formatHint(info: ColumnInfo | undefined): string | undefined {
  if (!info?.format || info.format.toLowerCase() === 'general') return undefined;
  return info.format;
}

/** Column width in pixels from a width in characters (ColumnInfo.width), within sane bounds. */
export function widthPx(info: ColumnInfo | undefined, fallbackChars = 11): number {
  const chars = info?.width ?? Math.max(fallbackChars, Math.min(28, (info?.header.length ?? 0) + 2));
  return Math.round(Math.max(48, Math.min(420, chars * 7.4 + 14)));
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
