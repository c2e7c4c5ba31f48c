import { describe, expect, it } from 'vitest';
import {
  emptyMappingMemory,
  MAPPING_MEMORY_MAX_ENTRIES,
  parseMappingMemory,
  recall,
  remember,
} from '../../../src/io/import/memory.ts';

describe('MappingMemory', () => {
  it('remembers by normalised header and survives JSON', () => {
    const m = remember(emptyMappingMemory(), [
      ['Tag No.', { target: 'tag' }],
      ['Leistung (MW)', { target: 'p_kw', unit: 'MW' }],
      ['Notes', { target: null }],
    ]);
    const back = parseMappingMemory(JSON.stringify(m));
    expect(recall(back, 'tag no')).toEqual({ target: 'tag' });
    expect(recall(back, 'LEISTUNG  MW')).toEqual({ target: 'p_kw', unit: 'MW' });
    expect(recall(back, 'Notes')).toEqual({ target: null });
    expect(recall(back, 'Other')).toBeUndefined();
  });

  it('reads garbage as empty, never throws', () => {
    for (const text of [
      null,
      '',
      '{',
      '[]',
      '{"version":2,"choices":{}}',
      '{"version":1,"choices":{"a":{"target":5}}}',
    ]) {
      expect(parseMappingMemory(text).choices).toEqual({});
    }
    expect(
      recall(parseMappingMemory('{"version":1,"choices":{"__proto__":{"target":"tag"}}}'), 'constructor'),
    ).toBeUndefined();
  });

  it('forgets the oldest beyond the cap and moves a re-chosen header to the newest', () => {
    let m = emptyMappingMemory();
    for (let i = 0; i < MAPPING_MEMORY_MAX_ENTRIES + 10; i++) m = remember(m, [[`h${i}`, { target: 'tag' }]]);
    expect(Object.keys(m.choices)).toHaveLength(MAPPING_MEMORY_MAX_ENTRIES);
    expect(recall(m, 'h0')).toBeUndefined();
    m = remember(m, [['h10', { target: 'bus' }]]);
    expect(Object.keys(m.choices).at(-1)).toBe('h10');
  });
});
