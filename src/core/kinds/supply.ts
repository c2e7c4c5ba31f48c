// What feeds a motor or a load (the Supply column): the arrangements in the trade's words, the
// spellings accepted for each, and what each means for the supply: the displacement factor a
// drive draws, and which harmonics it injects (for the detuning choice).
//
// Spellings: case does not matter, and a hyphen reads as a space ("VSD 6-pulse" = "vsd 6 pulse").
// The workbook's formulas compare the same way (LOWER(TRIM(SUBSTITUTE(cell,"-"," ")))), so the
// page, the export and the core agree on every accepted spelling.
import { ifText, normaliseText, type Expr } from './expr.ts';

/** What an arrangement injects into the supply, for the detuning choice. */
export type HarmonicClass =
  /** Nothing worth counting (direct-on-line, star-delta, soft starter in bypass, linear loads). */
  | 'none'
  /** Six-pulse converters: characteristic orders 6k ± 1 (5, 7, 11, 13 …). */
  | 'six-pulse'
  /** Single-phase electronic loads: the 3rd and its odd multiples (triplens add in the neutral). */
  | 'single-phase'
  /** Active front end: low-order currents small; counted as a source of no characteristic order. */
  | 'active-front-end';

export interface SupplyArrangement {
  /** As the reference and messages write it. */
  readonly name: string;
  /** Other accepted spellings, as written (normalised when compared). */
  readonly aliases: readonly string[];
  readonly harmonics: HarmonicClass;
  /**
   * Supply-side displacement factor (cos φ1) a drive draws whatever the motor's nameplate cos φ;
   * undefined: the item's own cos φ applies.
   */
  readonly displacement?: number;
}

/**
 * Six-pulse drive with a diode front end draws a displacement factor of about 0.95–0.98 at its
 * input across most of its load range (common practice, from memory: makers' data sheets and
 * IEEE Std 519 discussions of drive input current). We take 0.96, in the middle.
 */
export const SIX_PULSE_DISPLACEMENT = 0.96;
/** An active front end is run at unity displacement unless set otherwise (common practice). */
export const ACTIVE_FRONT_END_DISPLACEMENT = 1;

export const DIRECT_ON_LINE: SupplyArrangement = {
  name: 'direct-on-line',
  aliases: ['DOL'],
  harmonics: 'none',
};
export const VSD_SIX_PULSE: SupplyArrangement = {
  name: 'VSD 6-pulse',
  aliases: [],
  harmonics: 'six-pulse',
  displacement: SIX_PULSE_DISPLACEMENT,
};
export const VSD_ACTIVE_FRONT_END: SupplyArrangement = {
  name: 'VSD AFE',
  aliases: [],
  harmonics: 'active-front-end',
  displacement: ACTIVE_FRONT_END_DISPLACEMENT,
};
export const LINEAR: SupplyArrangement = { name: 'linear', aliases: [], harmonics: 'none' };

/** What may feed a motor; blank = direct-on-line. */
export const MOTOR_SUPPLIES: readonly SupplyArrangement[] = [
  DIRECT_ON_LINE,
  { name: 'star-delta', aliases: ['Y-D', 'wye-delta'], harmonics: 'none' },
  { name: 'soft starter', aliases: ['soft start'], harmonics: 'none' },
  VSD_SIX_PULSE,
  VSD_ACTIVE_FRONT_END,
];

/** What a load is; blank = linear. */
export const LOAD_SUPPLIES: readonly SupplyArrangement[] = [
  LINEAR,
  { name: 'rectifier/UPS', aliases: ['rectifier', 'UPS'], harmonics: 'six-pulse' },
  {
    name: 'electronic lighting',
    aliases: ['single-phase electronic', 'LED lighting'],
    harmonics: 'single-phase',
  },
  VSD_SIX_PULSE,
];

/** Case folded, hyphens read as spaces, spaces trimmed and runs of spaces made one (as TRIM does). */
export const normaliseSupply = normaliseText;

export type SupplyReading =
  | { readonly ok: true; readonly arrangement: SupplyArrangement }
  | { readonly ok: false; readonly allowed: readonly string[] };

/** The arrangement a Supply cell names among those allowed; a blank is the list's first (its default). */
export function readSupply(text: string | undefined, allowed: readonly SupplyArrangement[]): SupplyReading {
  const first = allowed[0];
  if (text === undefined || text.trim() === '') {
    return first ? { ok: true, arrangement: first } : { ok: false, allowed: [] };
  }
  const n = normaliseSupply(text);
  const found = allowed.find((a) => [a.name, ...a.aliases].some((s) => normaliseSupply(s) === n));
  return found ? { ok: true, arrangement: found } : { ok: false, allowed: allowed.map((a) => a.name) };
}

/**
 * The reactive power of an item by its supply: for each arrangement that draws its own
 * displacement factor (a drive), `drawn(factor)` when the Supply cell names it (each spelling),
 * else `own` (the item's own cos φ). Printed as nested IFs on the Supply cell.
 */
export function bySupply(
  allowed: readonly SupplyArrangement[],
  drawn: (displacement: number) => Expr,
  own: Expr,
): Expr {
  let out = own;
  for (const a of [...allowed].reverse()) {
    if (a.displacement === undefined) continue;
    const q = drawn(a.displacement);
    for (const spelling of [a.name, ...a.aliases].reverse())
      out = ifText('supply', normaliseText(spelling), q, out);
  }
  return out;
}
