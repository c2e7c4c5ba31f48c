// Ctrl+Arrow targets, on a small sheet drawn as text ('x' filled, '.' blank).
import { describe, expect, it } from 'vitest';
import { dataEdgeTarget } from '../../src/ui/grid/dataEdge.ts';

const sheet = ['xxx.x', 'x....', 'x..x.', '.....', 'x....'];
const filled = (r: number, c: number) => sheet[r]?.[c] === 'x';
const extent = { rows: 5, cols: 5 };
const go = (row: number, col: number, dir: 'up' | 'down' | 'left' | 'right') =>
  dataEdgeTarget(filled, { row, col }, dir, extent);

describe('Ctrl+Arrow', () => {
  it('runs to the end of a filled run', () => {
    expect(go(0, 0, 'down')).toEqual({ row: 2, col: 0 });
    expect(go(0, 0, 'right')).toEqual({ row: 0, col: 2 });
  });
  it('jumps over blanks to the next filled cell', () => {
    expect(go(2, 0, 'down')).toEqual({ row: 4, col: 0 });
    expect(go(0, 2, 'right')).toEqual({ row: 0, col: 4 });
    expect(go(2, 3, 'left')).toEqual({ row: 2, col: 0 });
  });
  it('stops at the data edge, not in the spare rows and columns beyond it', () => {
    expect(go(4, 0, 'down')).toEqual({ row: 4, col: 0 });
    expect(go(1, 1, 'down')).toEqual({ row: 4, col: 1 });
    expect(go(1, 1, 'right')).toEqual({ row: 1, col: 4 });
    expect(go(0, 4, 'right')).toEqual({ row: 0, col: 4 });
    expect(go(3, 3, 'up')).toEqual({ row: 2, col: 3 });
    expect(go(0, 0, 'up')).toEqual({ row: 0, col: 0 });
  });
  it('from beyond the data, moves back to it or stays put', () => {
    expect(dataEdgeTarget(filled, { row: 9, col: 0 }, 'up', extent)).toEqual({ row: 4, col: 0 });
    expect(dataEdgeTarget(filled, { row: 9, col: 0 }, 'down', extent)).toEqual({ row: 9, col: 0 });
  });
});
