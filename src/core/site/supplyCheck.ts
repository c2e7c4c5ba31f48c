// The Supply column of a row: a spelling the row's kind accepts, or blank for its default.
import { readSupply, type KindSpec } from '../kinds/index.ts';
import type { EquipmentRow } from './model.ts';
import { error, warning, type Problem } from './problems.ts';

type At = (column: string) => { row: number; column: string };

export function supplyProblems(row: EquipmentRow, kind: KindSpec, at: At): Problem[] {
  const given = row.supply;
  if (given === undefined || given.trim() === '') return [];
  if (!kind.supplies) {
    return [
      warning(
        at('supply'),
        `supply is read only for motors and loads; ignored for a ${kind.name} (got "${given}")`,
      ),
    ];
  }
  const r = readSupply(given, kind.supplies);
  if (r.ok) return [];
  const [first, ...rest] = r.allowed;
  return [
    error(
      at('supply'),
      `supply of a ${kind.name} must be one of ${first ?? ''} (the default when blank), ${rest.join(', ')} (case and hyphens do not matter); got "${given}"`,
    ),
  ];
}
