// What the user chose for a header last time, so the same client's next list maps itself.
// Plain JSON-ready data and pure functions: the app keeps it in localStorage under
// MAPPING_MEMORY_STORAGE_KEY (JSON.stringify to save, parseMappingMemory to load).
import { normaliseWords } from './synonyms.ts';

export const MAPPING_MEMORY_STORAGE_KEY = 'kvar-ledger.import-mapping.v1';
/** Oldest choices are forgotten beyond this many headers. */
export const MAPPING_MEMORY_MAX_ENTRIES = 500;

export interface RememberedChoice {
  /** Interchange column, 'load:<case>', or null for "ignore this column". */
  readonly target: string | null;
  /** Unit label chosen for the column ('' for plain numbers). */
  readonly unit?: string;
}

export interface MappingMemory {
  readonly version: 1;
  /** Keyed by the header's normalised words ('Tag No.' → 'tag no'). Insertion order = age. */
  readonly choices: Readonly<Record<string, RememberedChoice>>;
}

export function emptyMappingMemory(): MappingMemory {
  return { version: 1, choices: {} };
}

export function memoryKey(header: string): string {
  return normaliseWords(header);
}

export function recall(memory: MappingMemory | undefined, header: string): RememberedChoice | undefined {
  const key = memoryKey(header);
  if (!memory || key === '') return undefined;
  return Object.prototype.hasOwnProperty.call(memory.choices, key) ? memory.choices[key] : undefined;
}

/** A new memory with these header → choice pairs added (newest last, oldest dropped past the cap). */
export function remember(
  memory: MappingMemory,
  pairs: ReadonlyArray<readonly [string, RememberedChoice]>,
): MappingMemory {
  const next = new Map(Object.entries(memory.choices));
  for (const [header, choice] of pairs) {
    const key = memoryKey(header);
    if (key === '') continue;
    next.delete(key);
    next.set(
      key,
      choice.unit === undefined ? { target: choice.target } : { target: choice.target, unit: choice.unit },
    );
  }
  const entries = [...next.entries()].slice(-MAPPING_MEMORY_MAX_ENTRIES);
  return { version: 1, choices: Object.fromEntries(entries) };
}

/** Read a stored memory; anything unreadable (absent, old, tampered) gives an empty one. */
export function parseMappingMemory(text: string | null | undefined): MappingMemory {
  if (!text) return emptyMappingMemory();
  try {
    const data: unknown = JSON.parse(text);
    if (typeof data !== 'object' || data === null || (data as { version?: unknown }).version !== 1)
      return emptyMappingMemory();
    const choices = (data as { choices?: unknown }).choices;
    if (typeof choices !== 'object' || choices === null) return emptyMappingMemory();
    const pairs: Array<[string, RememberedChoice]> = [];
    for (const [k, v] of Object.entries(choices)) {
      if (typeof v !== 'object' || v === null) continue;
      const t = (v as { target?: unknown }).target;
      const u = (v as { unit?: unknown }).unit;
      if (t !== null && typeof t !== 'string') continue;
      pairs.push([k, typeof u === 'string' ? { target: t, unit: u } : { target: t }]);
    }
    return remember(emptyMappingMemory(), pairs);
  } catch {
    return emptyMappingMemory();
  }
}
