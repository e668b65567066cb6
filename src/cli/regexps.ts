import { setFlagUnlessStartedWith, startedWithFlag } from './v8Flags.js';

/**
 * V8 runs a regular expression's first match in its bytecode interpreter and compiles it to
 * machine code only when it is used again (`--regexp-tier-up`). A check uses some 180 regular
 * expressions, most of them with Unicode classes, nearly all on more than one text, so a run
 * made the bytecode and then the machine code of nearly every one, and read its first text in
 * the slower interpreter. Compiled at once instead, a whole run of `plumbline --format json` on
 * a 50 KB manuscript (bench figure 8) took some 370 ms against 410 ms (interleaved, ten runs
 * each, best five, on a quiet machine).
 */
export const REGEXP_FLAG = '--no-regexp-tier-up';

/** Whether the process was started with a regexp tier-up setting of its own (execArgv or NODE_OPTIONS), which then stands. */
export function hasOwnRegexpTier(execArgv: readonly string[], nodeOptions: string | undefined): boolean {
  return startedWithFlag('regexp-tier-up', execArgv, nodeOptions);
}

/**
 * Sets REGEXP_FLAG for this process and its worker threads (V8's flags are the process's),
 * unless the process has a setting of its own. Called before the start-up bundle is compiled
 * and its regular expressions made: V8 takes a code cache only under the flags it was made
 * with, so every run sets it at the same point. Returns whether it was set.
 */
export function compileRegexpsAtOnce(execArgv: readonly string[] = process.execArgv, nodeOptions: string | undefined = process.env.NODE_OPTIONS): boolean {
  return setFlagUnlessStartedWith('regexp-tier-up', REGEXP_FLAG, execArgv, nodeOptions);
}
