// A typical short-circuit power for a point of connection whose value the utility has not given
// yet, by nominal voltage. It is offered, never used silently: the finding that offers it says
// it is typical, and the user types it (or the utility's value) on the Site sheet.
import { SOURCES } from './sources.ts';
import type { TypicalNumber } from './transformers.ts';

/**
 * Highest nominal voltage of a level, kV → typical short-circuit power there, MVA. Common
 * practice, values from memory (see SOURCES.supplyShortCircuit): an LV connection near a
 * 630–1000 kVA distribution transformer; 3.3–6.6 kV, 10–11 kV, 15–22 kV, 30–35 kV, 45–69 kV,
 * 110–138 kV and 220–230 kV networks.
 */
export const TYPICAL_SUPPLY_SSC_MVA: ReadonlyArray<readonly [maxKv: number, mva: number]> = [
  [1, 15],
  [7.2, 150],
  [12, 250],
  [24, 350],
  [36, 750],
  [72.5, 2000],
  [145, 5000],
  [245, 10000],
];

/** The typical short-circuit power for a connection at uKv, or undefined above 245 kV. */
export function typicalSupplyShortCircuit(uKv: number): TypicalNumber | undefined {
  if (!(uKv > 0)) return undefined;
  const row = TYPICAL_SUPPLY_SSC_MVA.find(([maxKv]) => uKv <= maxKv);
  return row && { value: row[1], source: SOURCES.supplyShortCircuit };
}
