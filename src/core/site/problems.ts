// What can be wrong with a site, said in one voice: every message starts with where
// ("row 7, column cos_phi: ...") so an estimator can find the cell, then says what is wrong,
// the allowed range where there is one, and the value given.
import { formatNumber } from '../registry/messages.ts';

export type Severity = 'error' | 'warning' | 'info';

export interface Problem {
  readonly severity: Severity;
  readonly message: string;
  /** 1-based row in the source (CSV/xlsx: header = row 1; site file: n-th equipment row). */
  readonly row?: number;
  readonly column?: string;
  readonly bus?: string;
  readonly tag?: string;
}

export interface Where {
  readonly row?: number;
  readonly column?: string;
  readonly bus?: string;
  readonly tag?: string;
}

/** "row 7, column cos_phi" / "row 7" / "bus LV1" / "" */
export function describeWhere(w: Where): string {
  const parts: string[] = [];
  if (w.row !== undefined) parts.push(`row ${w.row}`);
  if (w.column !== undefined) parts.push(`column ${w.column}`);
  if (parts.length === 0 && w.bus !== undefined) parts.push(`bus ${w.bus}`);
  return parts.join(', ');
}

export function problem(severity: Severity, where: Where, text: string): Problem {
  const prefix = describeWhere(where);
  const out: { -readonly [K in keyof Problem]: Problem[K] } = {
    severity,
    message: prefix ? `${prefix}: ${text}` : text,
  };
  if (where.row !== undefined) out.row = where.row;
  if (where.column !== undefined) out.column = where.column;
  if (where.bus !== undefined) out.bus = where.bus;
  if (where.tag !== undefined) out.tag = where.tag;
  return out;
}

export const error = (where: Where, text: string): Problem => problem('error', where, text);
export const warning = (where: Where, text: string): Problem => problem('warning', where, text);
export const info = (where: Where, text: string): Problem => problem('info', where, text);

export function hasErrors(problems: readonly Problem[]): boolean {
  return problems.some((p) => p.severity === 'error');
}

/** Quote a cell value for a message; long text is cut. */
export function given(text: string): string {
  const t = text.length > 40 ? text.slice(0, 40) + '…' : text;
  return `"${t}"`;
}

/** Message texts shared by parse, validate and the site file reader. */
export const say = {
  notANumber: (text: string) => `must be a number; got ${given(text)}`,
  missingValue: (column: string, kind: string) => `${column} is required for a ${kind} and is blank`,
  missingTag: () => 'tag is blank; every item needs a unique tag',
  missingBus: () => 'bus is blank; every item must say which bus it is connected to',
  unknownKind: (text: string, allowed: readonly string[]) =>
    `kind must be one of ${allowed.join(', ')}; got ${given(text)}`,
  duplicateTag: (tag: string, firstRow: number) =>
    `tag ${given(tag)} is already used in row ${firstRow}; tags must be unique`,
  unknownColumn: (name: string) => `unknown column ${given(name)} is ignored`,
  duplicateColumn: (name: string, first: number) =>
    `column ${given(name)} appears twice (also column ${first}); the second is ignored`,
  unstorable: (what: string, code: string) =>
    `${what} contains the character ${code} (a control or unpaired character), which spreadsheet files cannot carry; remove it`,
  outOfRange: (what: string, range: string, value: number) =>
    `${what} must be ${range}; got ${formatNumber(value)}`,
} as const;
