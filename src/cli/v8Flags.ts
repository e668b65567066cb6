import { createRequire } from 'node:module';

const requireBuiltin = createRequire(import.meta.url);

/**
 * Whether the process was started with a setting of V8's flag `name` (`heap-growing-percent`)
 * in its arguments or NODE_OPTIONS, in any form V8 reads: `-` or `_` between words, `--no-`
 * before it, a value after it, or a longer flag that begins with it.
 */
export function startedWithFlag(name: string, execArgv: readonly string[], nodeOptions: string | undefined): boolean {
  return `${execArgv.join(' ')} ${nodeOptions ?? ''}`.replaceAll('_', '-').includes(name);
}

/**
 * Sets `setting` (of V8's flag `name`) for this process and the worker threads it starts (V8's
 * flags are the process's), unless the process was started with a setting of that flag, which
 * then stands. Call it before the start-up bundle is compiled: V8 takes a code cache only under
 * the flags it was made with, so each run must set it at the same point whether it makes its
 * cache or uses it. Returns whether it was set.
 */
export function setFlagUnlessStartedWith(name: string, setting: string, execArgv: readonly string[], nodeOptions: string | undefined): boolean {
  if (startedWithFlag(name, execArgv, nodeOptions)) return false;
  (requireBuiltin('node:v8') as typeof import('node:v8')).setFlagsFromString(setting);
  return true;
}
