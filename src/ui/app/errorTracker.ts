// The error cells of the whole workbook, for the status line's count and its "next" jump. The
// count is the workbook's, not the sheet's on screen, so it changes only when a value changes
// (switching sheets leaves it alone). Scanning a large workbook takes long, so it is scanned
// once and then kept up to date from the engine's list of changed values; row moves, sheet
// changes and undo make it scan again.
import { isEngineError, type ExportedChange, type HyperFormula } from '../../engine/index.ts';

export interface ErrorCell {
  readonly sheet: number;
  readonly row: number;
  readonly col: number;
}

const key = (s: number, r: number, c: number) => `${s},${r},${c}`;

export class ErrorTracker {
  private cells = new Set<string>();
  private fresh = false;
  private readonly onValues = (changes: ExportedChange[]) => {
    if (!this.fresh) return;
    for (const ch of changes) {
      if (!('address' in ch)) continue;
      const k = key(ch.address.sheet, ch.address.row, ch.address.col);
      if (isEngineError(ch.newValue)) this.cells.add(k);
      else this.cells.delete(k);
    }
  };

  constructor(private readonly engine: HyperFormula) {
    engine.on('valuesUpdated', this.onValues);
  }

  /** Cell addresses may have moved: scan again on the next read. */
  invalidate(): void {
    this.fresh = false;
  }

  get needsScan(): boolean {
    return !this.fresh;
  }

  private scan(): void {
    this.cells = new Set();
    for (const name of this.engine.getSheetNames()) {
      const sheet = this.engine.getSheetId(name);
      if (sheet === undefined) continue;
      this.engine.getSheetValues(sheet).forEach((row, r) =>
        row.forEach((v, c) => {
          if (isEngineError(v)) this.cells.add(key(sheet, r, c));
        }),
      );
    }
    this.fresh = true;
  }

  count(): number {
    if (!this.fresh) this.scan();
    return this.cells.size;
  }

  /** Error cells in reading order: sheets in `order` (tab order), then rows, then columns. */
  list(order: readonly number[] = []): ErrorCell[] {
    if (!this.fresh) this.scan();
    const rank = (s: number) => {
      const i = order.indexOf(s);
      return i < 0 ? order.length + s : i;
    };
    return [...this.cells]
      .map((k) => {
        const [sheet, row, col] = k.split(',').map(Number) as [number, number, number];
        return { sheet, row, col };
      })
      .sort((a, b) => rank(a.sheet) - rank(b.sheet) || a.row - b.row || a.col - b.col);
  }

  /** The first error cell after (sheet, row, col) in reading order, wrapping round. */
  next(order: readonly number[], at?: ErrorCell): ErrorCell | undefined {
    const all = this.list(order);
    if (!at) return all[0];
    const pos = order.indexOf(at.sheet);
    const after = all.find((e) => {
      const p = order.indexOf(e.sheet);
      return p > pos || (p === pos && (e.row > at.row || (e.row === at.row && e.col > at.col)));
    });
    return after ?? all[0];
  }

  dispose(): void {
    this.engine.off('valuesUpdated', this.onValues);
  }
}
