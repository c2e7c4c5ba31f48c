// The list of equipment kinds: the only place that knows which kinds exist. Validation, the
// roll-up, the workbook and the export ask it; a kind it does not know is an error, never 0.
import type { KindSpec, SheetSpec } from './spec.ts';

const kinds: KindSpec[] = [];
// Names as typed → kind: the structure pass asks once or twice per equipment row on every edit.
const found = new Map<string, KindSpec | undefined>();

/** Add a kind (the built-ins are added by index.ts; a test may add a throwaway kind). */
export function registerKind(spec: KindSpec): void {
  if (kinds.some((k) => k.name === spec.name)) throw new Error(`kind ${spec.name} is registered twice`);
  const other = kinds.find((k) => k.sheet.name === spec.sheet.name && k.sheet !== spec.sheet);
  if (other)
    throw new Error(`kind ${spec.name}: sheet "${spec.sheet.name}" is already defined by kind ${other.name}`);
  kinds.push(spec);
  found.clear();
}

/** Every kind, in registration order. */
export function allKinds(): readonly KindSpec[] {
  return kinds;
}

export function kindNames(): readonly string[] {
  return kinds.map((k) => k.name);
}

/** The kind named (as typed, ignoring case), or undefined. */
export function findKind(name: string): KindSpec | undefined {
  if (found.has(name)) return found.get(name);
  const n = name.trim().toLowerCase();
  const k = kinds.find((x) => x.name === n);
  if (found.size > 10_000) found.clear(); // names typed by hand: keep the cache small
  found.set(name, k);
  return k;
}

/** The kind named; throws when unknown (callers that handle user input use findKind). */
export function kindOf(name: string): KindSpec {
  const k = findKind(name);
  if (!k) throw new Error(`unknown equipment kind "${name}"; known: ${kindNames().join(', ')}`);
  return k;
}

/** The equipment sheets in order of their first kind, each with its kinds. */
export function equipmentSheets(): ReadonlyArray<{
  readonly sheet: SheetSpec;
  readonly kinds: readonly KindSpec[];
}> {
  const out: Array<{ sheet: SheetSpec; kinds: KindSpec[] }> = [];
  for (const k of kinds) {
    const s = out.find((x) => x.sheet === k.sheet);
    if (s) s.kinds.push(k);
    else out.push({ sheet: k.sheet, kinds: [k] });
  }
  return out;
}

/** A kind with the capacitor trait: installed compensation, counted in resonance (never by its name). */
export function isCapacitorKind(name: string): boolean {
  return findKind(name)?.traits?.capacitor === true;
}

export function isBranchKind(name: string): boolean {
  return findKind(name)?.role === 'branch';
}
