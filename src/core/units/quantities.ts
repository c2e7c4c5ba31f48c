// Quantity brands: kW, kvar and kVA share one dimension, so only a type keeps them apart at
// module boundaries. Brands are cast here and nowhere else.
declare const brand: unique symbol;
type Brand<T, B extends string> = T & { readonly [brand]: B };

export type Kw = Brand<number, 'kW'>;
export type Kvar = Brand<number, 'kvar'>;
export type Kva = Brand<number, 'kVA'>;
export type Kv = Brand<number, 'kV'>;
export type Hz = Brand<number, 'Hz'>;
export type Mva = Brand<number, 'MVA'>;

export const kw = (x: number): Kw => x as Kw;
export const kvar = (x: number): Kvar => x as Kvar;
export const kva = (x: number): Kva => x as Kva;
export const kv = (x: number): Kv => x as Kv;
export const hz = (x: number): Hz => x as Hz;
export const mva = (x: number): Mva => x as Mva;

/** Unit prefixes for import conversion: factor to the catalogue unit. */
export const POWER_TO_KW: Readonly<Record<string, number>> = { w: 1e-3, kw: 1, mw: 1e3 };
export const REACTIVE_TO_KVAR: Readonly<Record<string, number>> = { var: 1e-3, kvar: 1, mvar: 1e3 };
export const APPARENT_TO_KVA: Readonly<Record<string, number>> = { va: 1e-3, kva: 1, mva: 1e3 };
export const VOLTAGE_TO_KV: Readonly<Record<string, number>> = { v: 1e-3, kv: 1 };
export const CAPACITANCE_TO_UF: Readonly<Record<string, number>> = { pf: 1e-6, nf: 1e-3, uf: 1, µf: 1 };

/** A percentage given as a fraction (≤ 1) or as percent: returns percent. */
export function asPercent(x: number, givenAsFraction: boolean): number {
  return givenAsFraction ? x * 100 : x;
}
