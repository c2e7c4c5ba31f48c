// The page's typical-value fill: the core plan over the open workbook's equipment sheets, keyed
// by the engine's sheet ids (the session applies it as one step).
import type { EquipmentColumns } from '../../core/workbook/equipmentColumns.ts';
import { planTypicalFill, type TypicalFillPlan } from '../../core/workbook/typicalFill.ts';
import type { ContentStore } from './contentStore.ts';

export type TypicalFillReport = TypicalFillPlan<number>;

export function planPageFill(
  contents: ContentStore,
  sheetIds: readonly number[],
  plans: readonly EquipmentColumns[],
): TypicalFillReport {
  const sheets = plans.map((_, i) => {
    const id = sheetIds[i];
    return { key: id ?? -1, rows: id === undefined ? [] : contents.get(id) };
  });
  return planTypicalFill(sheets, plans);
}
