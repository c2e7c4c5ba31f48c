// Conductor resistance per km from the cross-section and temperature, one function per metal:
// the sheet formula reads CABLE.R.CU(185, 70), and the export writes the IEC 60228 table out as
// a piecewise formula that every spreadsheet program recalculates.
import { defineFunction, type FunctionSpec } from '../registry/spec.ts';
import { formatNumber } from '../registry/messages.ts';
import {
  ALPHA20,
  resistance20,
  resistanceAt,
  standardSections,
  type ConductorMetal,
} from '../elements/conductor.ts';

const FAMILY = 'Cables and lines';
const num = (x: number | boolean | undefined): number => x as number;

const NAMES: Readonly<Record<ConductorMetal, string>> = { cu: 'copper', al: 'aluminium' };

/** IF(a=1.5,12.1,IF(a=2.5,7.41,…,NA())): the table as a classic formula, NA() off the table. */
function tableText(metal: ConductorMetal, a: string): string {
  const sizes = standardSections(metal);
  const head = sizes.map((s) => `IF(${a}=${s},${resistance20(metal, s)},`).join('');
  return `${head}NA()${')'.repeat(sizes.length)}`;
}

function conductorFunction(metal: ConductorMetal, examples: FunctionSpec['examples']): FunctionSpec {
  const sizes = standardSections(metal);
  return defineFunction({
    name: `CABLE.R.${metal.toUpperCase()}`,
    family: FAMILY,
    summary: `Resistance per phase of a stranded ${NAMES[metal]} conductor from its cross-section, Ω/km.`,
    description:
      `The maximum DC resistance at 20 °C of IEC 60228 class 2 ${NAMES[metal]} conductors for the standard cross-section given ` +
      `(${formatNumber(sizes[0] as number)} to ${formatNumber(sizes[sizes.length - 1] as number)} mm²), ` +
      `taken to the conductor temperature θ by R20·(1 + α20·(θ − 20)) with α20 = ${ALPHA20[metal]} /K. ` +
      'The table gives the maximum a conductor may have, so a real one is at or below it; blank θ is 20 °C, ' +
      'which reads low for a loaded cable (70 °C PVC and 90 °C XLPE are the usual maximum conductor temperatures). ' +
      "The AC resistance of large sections is a few per cent higher (skin effect): use the maker's value where known.",
    params: [
      {
        name: 'area_mm2',
        unit: 'mm²',
        doc: `conductor cross-section, a standard size of IEC 60228 class 2 ${NAMES[metal]}`,
        domain: { lo: sizes[0] as number, hi: sizes[sizes.length - 1] as number },
      },
      {
        name: 'theta_c',
        unit: '°C',
        doc: 'conductor temperature',
        domain: { lo: -50, hi: 250 },
        default: 20,
      },
    ],
    result: { unit: 'Ω/km', doc: 'resistance per phase' },
    source: {
      kind: 'from memory',
      ref: 'IEC 60228 Table 2 (class 2 conductors, maximum DC resistance at 20 °C); α20 from IEC 60287-1-1 Table 1',
    },
    examples,
    check: ([a]) =>
      resistance20(metal, num(a)) === undefined
        ? `argument 1 (area_mm2) must be a standard ${NAMES[metal]} cross-section of IEC 60228 class 2 (${sizes.join(', ')} mm²); got ${formatNumber(num(a))}`
        : undefined,
    compute: ([a, t]) => resistanceAt(metal, resistance20(metal, num(a)) as number, num(t)),
    expand: ([a, t]) => `${tableText(metal, a as string)}*(1+${ALPHA20[metal]}*(${t}-20))`,
    expandGuards: ([a]) => [`AND(${sizes.map((s) => `${a}<>${s}`).join(',')})`],
  });
}

export const CABLE_R_CU = conductorFunction('cu', [
  {
    args: [185],
    expect: 0.0991,
    tol: 1e-12,
    note: '185 mm² copper at 20 °C: 0.0991 Ω/km (IEC 60228 Table 2, from memory)',
  },
  {
    args: [240, 90],
    expect: 0.0754 * (1 + 3.93e-3 * 70),
    tol: 1e-12,
    note: '240 mm² copper at 90 °C (XLPE maximum): 0.0754 Ω/km at 20 °C × 1.2751 (recomputed in the tests)',
  },
  {
    args: [180],
    expect: { error: 'argument 1 (area_mm2) must be a standard copper cross-section' },
    note: 'not a standard size',
  },
]);

export const CABLE_R_AL = conductorFunction('al', [
  {
    args: [240],
    expect: 0.125,
    tol: 1e-12,
    note: '240 mm² aluminium at 20 °C: 0.125 Ω/km (IEC 60228 Table 2, from memory)',
  },
  {
    args: [95, 70],
    expect: 0.32 * (1 + 4.03e-3 * 50),
    tol: 1e-12,
    note: '95 mm² aluminium at 70 °C (PVC maximum): 0.320 Ω/km at 20 °C × 1.2015 (recomputed in the tests)',
  },
  {
    args: [6],
    expect: { error: 'argument 1 (area_mm2) must be in [10, 2500]; got 6' },
    note: 'aluminium class 2 starts at 10 mm²',
  },
]);
