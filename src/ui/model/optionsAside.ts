// The Design options sheet's banks stay with their bus when the buses change, as the Compensation
// sheet's do: a renamed bus keeps them under its new name, and a bus that goes away has them kept
// aside, per option block, until a bus of the same key comes back and gets them again. The sheet is
// read by bus name, so without this a bus renamed or missing for one step would lose what was
// typed for it in every option.
import type { CellContent } from '../../core/workbook/document.ts';
import type { OptionInputs } from '../../core/workbook/optionInputs.ts';
import type { RetiredOptions } from './siteState.ts';

/**
 * The typed options for the buses there are now (`present`: their keys): banks of a renamed bus
 * under its new key (`renamed`: old key → new key), banks of buses gone aside, banks kept aside
 * for a bus that is back returned to it. Returns both, the old left as they were. Only the banks
 * move: the page keeps the cells' marks in the sheet's layout, moved by row (optionRowMoves).
 */
export function optionsFollowBuses(
  typed: readonly OptionInputs[],
  present: (key: string) => boolean,
  retired: RetiredOptions,
  renamed: ReadonlyMap<string, string>,
): { typed: OptionInputs[]; retired: RetiredOptions } {
  const kept: Array<ReadonlyMap<string, ReadonlyMap<number, CellContent>>> = [];
  const out = typed.map((o, j) => {
    const banks = new Map<string, ReadonlyMap<number, CellContent>>();
    const aside = new Map(retired[j] ?? []);
    for (const [old, values] of o.banks) {
      const key = renamed.get(old) ?? old;
      if (present(key)) banks.set(key, values);
      else aside.set(key, values);
    }
    for (const [key, values] of aside) {
      if (!present(key)) continue;
      if (!banks.has(key)) banks.set(key, values);
      aside.delete(key);
    }
    kept.push(aside);
    return { ...o, banks };
  });
  return { typed: out, retired: kept };
}
