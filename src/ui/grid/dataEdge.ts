// Ctrl+Arrow as spreadsheet users know it, but stopping at the data's edge instead of running
// into the spare rows and columns the grid keeps for typing: from a filled cell with a filled
// neighbour, to the last filled cell of that run; otherwise to the next filled cell; with
// nothing further, to the last row or column that holds data.

export type Direction = 'up' | 'down' | 'left' | 'right';

export interface Extent {
  /** Rows and columns that hold data (the engine's sheet dimensions). */
  readonly rows: number;
  readonly cols: number;
}

export function dataEdgeTarget(
  filled: (row: number, col: number) => boolean,
  from: { row: number; col: number },
  dir: Direction,
  extent: Extent,
): { row: number; col: number } {
  const dr = dir === 'down' ? 1 : dir === 'up' ? -1 : 0;
  const dc = dir === 'right' ? 1 : dir === 'left' ? -1 : 0;
  const lastRow = Math.max(extent.rows - 1, 0),
    lastCol = Math.max(extent.cols - 1, 0);
  // The far end in this direction: the data's edge, or where the cell already is beyond it.
  const endRow = dr > 0 ? Math.max(lastRow, from.row) : 0;
  const endCol = dc > 0 ? Math.max(lastCol, from.col) : 0;
  const inside = (r: number, c: number) =>
    (dr === 0 || (dr > 0 ? r <= endRow : r >= endRow)) && (dc === 0 || (dc > 0 ? c <= endCol : c >= endCol));
  let r = from.row + dr,
    c = from.col + dc;
  if (!inside(r, c)) return { ...from };
  if (filled(from.row, from.col) && filled(r, c)) {
    // Along a run of filled cells to its last one.
    while (inside(r + dr, c + dc) && filled(r + dr, c + dc)) {
      r += dr;
      c += dc;
    }
    return { row: r, col: c };
  }
  // Over blanks to the next filled cell, or to the edge.
  while (!filled(r, c) && inside(r + dr, c + dc)) {
    r += dr;
    c += dc;
  }
  return { row: r, col: c };
}
