// What every subcommand receives and returns: its arguments, two output channels, an exit code.

export interface CliIo {
  /** Normal output (stdout); each call is one chunk, callers add their own newlines. */
  out(text: string): void;
  /** Messages about bad input or failures (stderr). */
  err(text: string): void;
}

/** A subcommand: returns the exit status (0 success, 1 bad input). */
export type RunCommand = (argv: string[], io: CliIo) => Promise<number>;
