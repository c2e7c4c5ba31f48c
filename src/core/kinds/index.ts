// Equipment kinds: the registry with the built-in kinds registered, in sheet order.
import { registerKind } from './registry.ts';
import { MOTOR } from './motor.ts';
import { LOAD } from './load.ts';
import { GENERATOR } from './generator.ts';
import { TRANSFORMER } from './transformer.ts';
import { LINE } from './line.ts';
import { CABLE } from './cable.ts';
import { FEEDER } from './feeder.ts';
import { CAPACITOR } from './capacitor.ts';
import { REACTOR } from './reactor.ts';

for (const k of [MOTOR, LOAD, GENERATOR, TRANSFORMER, LINE, CABLE, FEEDER, CAPACITOR, REACTOR])
  registerKind(k);

export {
  allKinds,
  equipmentSheets,
  findKind,
  isBranchKind,
  isCapacitorKind,
  kindNames,
  kindOf,
  registerKind,
} from './registry.ts';
export * from './spec.ts';
export * from './expr.ts';
export * from './columns.ts';
export * from './sheets.ts';
export * from './supply.ts';
export { columnLabel, type ColumnLabel } from './labels.ts';
