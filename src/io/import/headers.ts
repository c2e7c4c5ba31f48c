// Reading one header cell of a client's list: which interchange column it most likely means,
// in which unit, and whether it names an operating case ("Load factor (night)" → load:night).
import { NUMERIC_COLUMNS, TEXT_COLUMNS } from '../../core/site/model.ts';
import { CASE_PREFIX, normaliseHeader } from '../../core/site/parse.ts';
import { normaliseWords, targetBySynonym } from './synonyms.ts';
import { dimensionOf, dimensionOfUnit, isKnownUnitSpelling, type Dimension } from './units.ts';

export type HeaderMatch = 'exact' | 'synonym' | 'unit' | 'none';

export interface HeaderReading {
  readonly target: string | null;
  readonly match: HeaderMatch;
  /** The unit as spelled in the header (e.g. 'MW', '(V)' → 'V'), if any. */
  readonly unitSpelling?: string;
}

const CANONICAL = new Set<string>([...TEXT_COLUMNS, ...NUMERIC_COLUMNS]);

/** Which target a unit alone suggests when the words say nothing. */
const BY_UNIT: Partial<Record<Dimension, string>> = {
  power: 'p_kw',
  reactive: 'q_kvar',
  apparent: 's_kva',
  voltage: 'u_kv',
  length: 'len_km',
  capacitance: 'c_uf_km',
  inductance: 'l_mh_km',
  resistance: 'r_ohm_km',
};

/** Single letters are units only at the end of a longer header or in brackets ("Voltage V", "(m)"). */
const SHORT_UNITS = new Set(['v', 'w', 'm']);

interface Split {
  /** Normalised words, for matching synonyms. */
  readonly words: string[];
  /** For each word, the token it came from as written (case names keep their spelling). */
  readonly rawOf: string[];
  readonly unit?: string;
  /** Bracketed text that is not a unit, as written. */
  readonly qualifier: string[];
}

/** Separate a header into words, a unit, and bracketed words that are not a unit. */
export function splitHeader(text: string): Split {
  let unit: string | undefined;
  const qualifier: string[] = [];
  const rest = text.replace(/[([{]\s*([^)\]}]*?)\s*[)\]}]/g, (_, inner: string) => {
    if (unit === undefined && isKnownUnitSpelling(inner)) unit = inner.trim();
    else if (inner.trim() !== '') qualifier.push(inner.trim());
    return ' ';
  });
  // "%Z", "Eff%": a percent sign glued to a word is a unit of its own.
  const spaced = rest.replace(/%/g, ' % ');
  const raw = spaced.split(/\s+/).filter(Boolean);
  const words: string[] = [];
  const rawOf: string[] = [];
  raw.forEach((tok, i) => {
    const t = tok.replace(/^[.,:;]+|[.,:;]+$/g, '');
    const lower = t.toLowerCase();
    const last = i === raw.length - 1;
    const isUnit =
      isKnownUnitSpelling(lower) &&
      (!SHORT_UNITS.has(lower) || (last && raw.length > 1)) &&
      lower !== 'fraction';
    if (unit === undefined && isUnit) unit = t;
    else {
      for (const w of normaliseWords(t).split(' ').filter(Boolean)) {
        words.push(w);
        rawOf.push(t);
      }
    }
  });
  return unit === undefined ? { words, rawOf, qualifier } : { words, rawOf, unit, qualifier };
}

/** The words outside [from, to) as written, each source token once, then the bracketed text. */
function leftoverText(split: Split, from: number, to: number): string {
  const tokens: string[] = [];
  split.rawOf.forEach((t, i) => {
    if ((i < from || i >= to) && tokens[tokens.length - 1] !== t) tokens.push(t);
  });
  return [...tokens, ...split.qualifier].join(' ').trim();
}

/** Longest run of words that is a synonym; ties go to the rightmost (the head noun is last). */
function bestPhrase(words: readonly string[]): { target: string; from: number; to: number } | undefined {
  for (let len = words.length; len >= 1; len--) {
    for (let from = words.length - len; from >= 0; from--) {
      const target = targetBySynonym(words.slice(from, from + len).join(' '));
      if (target) return { target, from, to: from + len };
    }
  }
  return undefined;
}

/** What one header most likely means. */
export function readHeader(text: string): HeaderReading {
  const trimmed = text.trim();
  if (trimmed === '') return { target: null, match: 'none' };
  const canonical = normaliseHeader(trimmed);
  if (CANONICAL.has(canonical)) return { target: canonical, match: 'exact' };
  if (canonical.startsWith(CASE_PREFIX) && canonical.length > CASE_PREFIX.length)
    return { target: canonical, match: 'exact' };

  const split = splitHeader(trimmed);
  const withUnit = (r: Omit<HeaderReading, 'unitSpelling'>): HeaderReading =>
    split.unit === undefined ? r : { ...r, unitSpelling: split.unit };
  const unitDim = split.unit === undefined ? undefined : dimensionOfUnit(split.unit);
  // nF/km is how line data is usually given, µF/km how cable data is.
  const nano = unitDim === 'capacitance' && (split.unit ?? '').toLowerCase().startsWith('n');
  const unitTarget = nano ? 'c_nf_km' : unitDim === undefined ? undefined : BY_UNIT[unitDim];

  const phrase = bestPhrase(split.words);
  if (phrase) {
    const leftover = leftoverText(split, phrase.from, phrase.to);
    if (phrase.target === 'load' && leftover !== '')
      return withUnit({ target: CASE_PREFIX + leftover, match: 'synonym' });
    // The unit outranks the words when they disagree: 'Rating (kVA)' is an apparent power.
    const synDim = dimensionOf(phrase.target);
    const physical = unitDim !== undefined && unitDim !== 'fraction' && unitDim !== 'percent';
    if (physical && synDim !== unitDim && unitTarget) return withUnit({ target: unitTarget, match: 'unit' });
    return withUnit({ target: phrase.target, match: 'synonym' });
  }
  if (unitTarget) return withUnit({ target: unitTarget, match: 'unit' });
  return withUnit({ target: null, match: 'none' });
}

export { columnLetters as columnLetter } from '../../core/workbook/refs.ts';
