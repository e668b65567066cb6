/**
 * The command line's defaults, in a module of their own that imports nothing: the help text
 * quotes them, and `plumbline --help` is answered without loading the checker.
 */

/**
 * What one document may cost. A document over either budget is reported as not checked, with
 * the reason, and every other document is still checked: each is checked on a worker thread
 * whose heap is limited to `memoryMb`, and a worker that runs past `seconds` is stopped and
 * replaced.
 */
export interface Budget {
  memoryMb: number;
  seconds: number;
}

export const DEFAULT_BUDGET: Budget = { memoryMb: 2048, seconds: 120 };

/** Files above this size are skipped unless configured otherwise (`maxFileBytes`, `--max-file-bytes`). */
export const DEFAULT_MAX_FILE_BYTES = 50 * 1024 * 1024;
