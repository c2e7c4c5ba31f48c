// The error cells of the sheet on screen, for the status line's count and "next" jump. Scanning
// a 10,000-row sheet takes long, so it is scanned once and then kept up to date from the
// engine's list of changed values; row moves and undo make it scan again.
import { isEngineError, type ExportedChange, type HyperFormula } from '../../engine/index.ts';

const key = (r: number, c: number) => `${r},${c}`;

export class ErrorTracker {
  private sheet = -1;
  private cells = new Set<string>();
  private fresh = false;
  private readonly onValues = (changes: ExportedChange[]) => {
    if (!this.fresh) return;
    for (const ch of changes) {
      if (!('address' in ch) || ch.address.sheet !== this.sheet) continue;
      const k = key(ch.address.row, ch.address.col);
      if (isEngineError(ch.newValue)) this.cells.add(k);
      else this.cells.delete(k);
    }
  };

  constructor(private readonly engine: HyperFormula) {
    engine.on('valuesUpdated', this.onValues);
  }

  /** Follow this sheet (scanned on the next read). */
  watch(sheetId: number): void {
    if (sheetId !== this.sheet) this.invalidate();
    this.sheet = sheetId;
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
    if (this.sheet >= 0 && this.engine.doesSheetExist(this.engine.getSheetName(this.sheet) ?? '')) {
      this.engine.getSheetValues(this.sheet).forEach((row, r) =>
        row.forEach((v, c) => {
          if (isEngineError(v)) this.cells.add(key(r, c));
        }),
      );
    }
    this.fresh = true;
  }

  count(): number {
    if (!this.fresh) this.scan();
    return this.cells.size;
  }

  /** Error cells in reading order. */
  list(): Array<[number, number]> {
    if (!this.fresh) this.scan();
    return [...this.cells]
      .map((k) => k.split(',').map(Number) as [number, number])
      .sort((a, b) => a[0] - b[0] || a[1] - b[1]);
  }

  dispose(): void {
    this.engine.off('valuesUpdated', this.onValues);
  }
}
