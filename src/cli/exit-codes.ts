/**
 * The exit codes both command-line tools share (documented in shared/README.md, "Command line"):
 * a script can tell "my command was wrong" from "the tool refused my file" without reading text.
 */
export const EXIT = {
  /** Done (also `--help` and `--list`). */
  ok: 0,
  /** The command line is wrong (unknown option, missing value). */
  usage: 1,
  /** The tool itself failed (a bug, a full disk): same code as a usage mistake, by contract. */
  internal: 1,
  /**
   * Input refused: a file named on the command line cannot be opened, read or used — a log,
   * airframe, column map or bench run with a problem the message places by line and column, a
   * log too short to analyse or whose time never advances, an airframe that does not fit the
   * log, an output folder that does not exist.
   */
  refused: 2,
} as const;

/** A mistake in the command line: the tool prints the message and its usage, exit 1. */
export class UsageError extends Error {
  override name = 'UsageError';
}

/** Input the tool refuses: the message goes to stderr as it is, exit 2. */
export class RefusedInput extends Error {
  override name = 'RefusedInput';
}
