// One undo step per user action. The engine keeps its own undo stack; a step remembers how many
// engine entries it used (the user's writes, then what the living model wrote to follow them)
// and the state beside the engine before and after it.

export interface Step<T> {
  readonly engineEntries: number;
  readonly before: T;
  readonly after: T;
}

export class History<T> {
  private readonly undoStack: Step<T>[] = [];
  private readonly redoStack: Step<T>[] = [];

  constructor(private readonly limit: number) {}

  record(step: Step<T>): void {
    this.undoStack.push(step);
    if (this.undoStack.length > this.limit) this.undoStack.shift();
    this.redoStack.length = 0;
  }

  undo(): Step<T> | undefined {
    const s = this.undoStack.pop();
    if (s) this.redoStack.push(s);
    return s;
  }

  redo(): Step<T> | undefined {
    const s = this.redoStack.pop();
    if (s) this.undoStack.push(s);
    return s;
  }

  get canUndo(): boolean {
    return this.undoStack.length > 0;
  }

  get canRedo(): boolean {
    return this.redoStack.length > 0;
  }
}
