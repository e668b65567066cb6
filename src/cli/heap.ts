import { setFlagUnlessStartedWith, startedWithFlag } from './v8Flags.js';

/**
 * How far V8 lets an old generation grow past its live size before the next full collection,
 * in batch runs: 50 means to 1.5 times (V8's own default lets a small heap grow some fourfold).
 * Batch keeps next to nothing per document, so each thread's live heap stays at some 15-18 MB
 * through a corpus of any length, and its peak memory is that growth times the threads. Measured
 * on 1,500 and 5,000 stat-dense 10 KB documents (bench figure 5, DEVELOPERS.md): peak RSS
 * 330-370 MB at V8's default, 250-263 MB at 50, with full-collection pauses of some 0.36 s
 * against 0.10 s in a run of some 20 s (about 1 % of its time; the scavenges, 2 s, unchanged).
 * A run that keeps its reports (file mode) has a live heap that grows with them, where the same
 * setting cost some 20 % more CPU on one 60,000-result document, so it is for batch only.
 */
export const BATCH_HEAP_GROWING_PERCENT = 50;

/** Whether the process was started with a heap-growing setting of its own (execArgv or NODE_OPTIONS), which then stands. */
export function hasOwnHeapGrowing(execArgv: readonly string[], nodeOptions: string | undefined): boolean {
  return startedWithFlag('heap-growing-percent', execArgv, nodeOptions);
}

/**
 * Sets BATCH_HEAP_GROWING_PERCENT for this process and the worker threads it starts (V8's flags
 * are the process's), unless the process has a setting of its own. Called before the start-up
 * bundle is compiled: V8 takes a code cache only under the flags it was made with, so a batch
 * run sets it at the same point whether it makes its cache or uses it. Returns whether it was set.
 */
export function growHeapSlowly(execArgv: readonly string[] = process.execArgv, nodeOptions: string | undefined = process.env.NODE_OPTIONS): boolean {
  return setFlagUnlessStartedWith('heap-growing-percent', `--heap-growing-percent=${BATCH_HEAP_GROWING_PERCENT}`, execArgv, nodeOptions);
}
