// Character scanners for the tokenizer, written by hand so that each one reads characters
// forward only and says how far it got: no pattern can rescan the rest of the text from every
// position (a regular expression for quoted sheet names did, and 90 kB of '' took 10 s).
// Every read goes through `at`, which counts, so a test can show the work is linear.

/** Counts the characters the scanners read; optional, for tests. */
export interface ScanCounter {
  reads: number;
}

export class Scanner {
  constructor(
    readonly text: string,
    private readonly counter?: ScanCounter,
  ) {}

  /** The character at k ('' past the end), counted. */
  at(k: number): string {
    if (this.counter) this.counter.reads++;
    return this.text.charAt(k);
  }

  isLetter(k: number): boolean {
    const c = this.at(k);
    return (c >= 'A' && c <= 'Z') || (c >= 'a' && c <= 'z');
  }
  isDigit(k: number): boolean {
    const c = this.at(k);
    return c >= '0' && c <= '9';
  }
  /** A character that may continue a name: letter, digit, '_' or '.'. */
  isNamePart(k: number): boolean {
    const c = this.at(k);
    return (
      (c >= 'A' && c <= 'Z') || (c >= 'a' && c <= 'z') || (c >= '0' && c <= '9') || c === '_' || c === '.'
    );
  }

  /** End of a run of digits from k. */
  digits(k: number): number {
    while (this.isDigit(k)) k++;
    return k;
  }

  /** End of a name's tail (letters, digits, '_', '.') from k. */
  nameTail(k: number): number {
    while (this.isNamePart(k)) k++;
    return k;
  }

  /**
   * A quoted text from k (at a quote character q) to just after its closing quote, a doubled
   * quote standing for one; `closed` false when the text ends first.
   */
  quoted(k: number, q: string): { end: number; closed: boolean } {
    let j = k + 1;
    for (;;) {
      const c = this.at(j);
      if (c === '') return { end: this.text.length, closed: false };
      if (c !== q) j++;
      else if (this.at(j + 1) === q) j += 2;
      else return { end: j + 1, closed: true };
    }
  }
}

/** After a reference: not a name, call, number or sheet going on. */
function refEnds(s: Scanner, k: number): boolean {
  const c = s.at(k);
  return !(s.isNamePart(k) || c === '(' || c === '!');
}

/** `$A$1`-style cell from k: its end, or -1. Letters 1–3, digits 1+. */
function cell(s: Scanner, k: number): number {
  let j = k;
  if (s.at(j) === '$') j++;
  const letters = j;
  while (j - letters < 4 && s.isLetter(j)) j++;
  if (j === letters || j - letters > 3) return -1;
  if (s.at(j) === '$') j++;
  const end = s.digits(j);
  return end === j ? -1 : end;
}

/** `$A`-style column from k (1–3 letters): its end, or -1. */
function column(s: Scanner, k: number): number {
  let j = k;
  if (s.at(j) === '$') j++;
  const letters = j;
  while (j - letters < 4 && s.isLetter(j)) j++;
  return j === letters || j - letters > 3 ? -1 : j;
}

/** `$1`-style row from k: its end, or -1. */
function row(s: Scanner, k: number): number {
  let j = k;
  if (s.at(j) === '$') j++;
  const end = s.digits(j);
  return end === j ? -1 : end;
}

/** A sheet prefix from k (`Sheet1!` or `'My sheet'!`): the index after '!', or -1. */
function sheetPrefix(s: Scanner, k: number): number {
  const c = s.at(k);
  let end: number;
  if (c === "'") {
    const q = s.quoted(k, "'");
    if (!q.closed || q.end === k + 2) return -1;
    end = q.end;
  } else if (s.isLetter(k) || c === '_') end = s.nameTail(k + 1);
  else return -1;
  return s.at(end) === '!' ? end + 1 : -1;
}

/** The part after an optional sheet: `A1`, `A1:B2` (the second may name a sheet), `A:C`, `1:3`. */
function area(s: Scanner, k: number): number {
  const first = cell(s, k);
  if (first >= 0) {
    if (s.at(first) === ':') {
      const from = first + 1;
      const sheet = sheetPrefix(s, from);
      const second = cell(s, sheet >= 0 ? sheet : from);
      if (second >= 0 && refEnds(s, second)) return second;
    }
    if (refEnds(s, first)) return first;
  }
  const col = column(s, k);
  if (col >= 0 && s.at(col) === ':') {
    const end = column(s, col + 1);
    if (end >= 0 && refEnds(s, end)) return end;
  }
  const r = row(s, k);
  if (r >= 0 && s.at(r) === ':') {
    const end = row(s, r + 1);
    if (end >= 0 && refEnds(s, end)) return end;
  }
  return -1;
}

/** A reference starting at k: its end, or -1. A sheet prefix is tried first, then none. */
export function reference(s: Scanner, k: number): number {
  const sheet = sheetPrefix(s, k);
  if (sheet >= 0) {
    const end = area(s, sheet);
    if (end >= 0) return end;
  }
  return area(s, k);
}

/** A number from k (12, 0.5, .5, 1e-3, 2.): its end, or -1. */
export function number(s: Scanner, k: number): number {
  let j = s.digits(k);
  if (j > k) {
    if (s.at(j) === '.') j = s.digits(j + 1);
  } else if (s.at(k) === '.' && s.isDigit(k + 1)) j = s.digits(k + 1);
  else return -1;
  const e = s.at(j);
  if (e === 'e' || e === 'E') {
    let x = j + 1;
    const sign = s.at(x);
    if (sign === '+' || sign === '-') x++;
    const end = s.digits(x);
    if (end > x) j = end;
  }
  return j;
}

/** A name from k ([A-Za-z_\\] then letters, digits, '_', '.'): its end, or -1. */
export function name(s: Scanner, k: number): number {
  const c = s.at(k);
  if (!(s.isLetter(k) || c === '_' || c === '\\')) return -1;
  return s.nameTail(k + 1);
}

const ERRORS = [
  '#NULL!',
  '#DIV/0!',
  '#VALUE!',
  '#REF!',
  '#NAME?',
  '#NUM!',
  '#N/A',
  '#SPILL!',
  '#CYCLE!',
  '#ERROR!',
  '#LIC!',
  '#GETTING_DATA',
];

/** An error literal from k (#N/A …, any letter case): its end, or -1. */
export function errorLiteral(s: Scanner, k: number): number {
  let word = '';
  for (let j = k; j < k + 13; j++) {
    const c = s.at(j);
    if (c === '') break;
    word += c.toUpperCase();
  }
  const found = ERRORS.find((e) => word.startsWith(e));
  return found === undefined ? -1 : k + found.length;
}

/** A run of whitespace from k: its end (k when none). */
export function spaces(s: Scanner, k: number): number {
  let j = k;
  for (;;) {
    const c = s.at(j);
    if (c === '' || !/\s/.test(c)) return j;
    j++;
  }
}
