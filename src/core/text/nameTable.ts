// Tables keyed by names the user chose (cases, buses, tags, sheets). A plain object literal
// inherits from Object.prototype, so a case called "toString" would find a function there and
// one called "__proto__" would replace the prototype instead of adding an entry. These tables
// have no prototype, and reads look at own entries only, so every name is just a name.

/** An empty table (or one filled from entries) with no prototype. */
export function nameTable<T>(entries: Iterable<readonly [string, T]> = []): Record<string, T> {
  const table = Object.create(null) as Record<string, T>;
  for (const [k, v] of entries) table[k] = v;
  return table;
}

/** The entry for `name`, looking at the table's own entries only (never its prototype). */
export function entryOf<T>(table: Readonly<Record<string, T>> | undefined, name: string): T | undefined {
  return table !== undefined && Object.hasOwn(table, name) ? table[name] : undefined;
}
