import { existsSync, statSync, watch as watchPath, type FSWatcher } from 'node:fs';
import { basename, dirname, resolve } from 'node:path';
import type { CliOptions } from './args.js';
import type { Io } from './run.js';

/** Quiet time after a change before checking again: an editor's save is often several writes. */
export const WATCH_SETTLE_MS = 150;

/** Clears the screen and puts the cursor home (ECMA-48 ED 2 and CUP). */
const CLEAR = '\u001b[2J\u001b[H';

/**
 * `--watch`: check, then check again whenever something under the files and folders named
 * changes, until interrupted (SIGINT or SIGTERM). On a terminal the screen is cleared before each
 * run. A glob is watched through the folder it is written from (the working folder when it
 * starts with a pattern).
 */
export async function watch(options: CliOptions, io: Io, check: (options: CliOptions, io: Io) => Promise<number>): Promise<number> {
  const refused = [
    ['--output', options.output !== undefined],
    ['--write-baseline', options.writeBaseline !== undefined],
    ['--fix', options.fix === 'apply'],
    ['"-" (standard input)', options.stdin],
  ].filter(([, on]) => on);
  if (refused.length > 0) {
    io.stderr(`plumbline: --watch does not go with ${refused.map(([n]) => n).join(', ')}\n`);
    return 2;
  }
  if (options.files.length === 0) {
    io.stderr('plumbline: --watch needs files or folders to watch\n');
    return 2;
  }
  const runOnce = async (why: string) => {
    if (io.isTTY) await io.stdout(CLEAR);
    io.stderr(`plumbline: ${why}\n`);
    const code = await check({ ...options, watch: false }, io);
    io.stderr(`plumbline: run done (exit status ${code}); watching for changes, Ctrl-C stops\n`);
    return code;
  };
  let last = 0;

  const watchers: FSWatcher[] = [];
  let timer: NodeJS.Timeout | undefined;
  let running: Promise<unknown> = Promise.resolve();
  const changed = (name: string) => {
    clearTimeout(timer);
    timer = setTimeout(() => {
      running = running.then(async () => {
        last = await runOnce(`checking again (${name} changed)`);
      });
    }, WATCH_SETTLE_MS);
  };
  const targets = new Set<string>();
  for (const f of options.files) {
    const abs = resolve(io.cwd, f);
    if (existsSync(abs)) targets.add(abs);
    else {
      // a glob: the folder before its first pattern character (a missing file: its folder)
      const parts = f.split('/');
      const first = parts.findIndex((p) => [...p].some((c) => '*?[{'.includes(c)));
      targets.add(resolve(io.cwd, parts.slice(0, first < 0 ? -1 : first).join('/') || '.'));
    }
  }
  for (const t of targets) {
    try {
      if (statSync(t).isDirectory()) watchers.push(watchPath(t, { recursive: true }, (_event, name) => changed(name ? String(name) : t)));
      // a file through its folder: an editor that saves by renaming a new file over it would end a watch on the file itself
      else watchers.push(watchPath(dirname(t), (_event, name) => (name === null || String(name) === basename(t) ? changed(basename(t)) : undefined)));
    } catch (e) {
      io.stderr(`plumbline: cannot watch ${t}: ${e instanceof Error ? e.message : String(e)}\n`);
    }
  }
  // watching starts before the first run: a change made while it runs, or just after, is not missed
  running = running.then(async () => {
    last = await runOnce('checking');
  });
  return new Promise<number>((done) => {
    const stop = () => {
      clearTimeout(timer);
      for (const w of watchers) w.close();
      process.off('SIGINT', stop);
      process.off('SIGTERM', stop);
      void running.then(() => done(last));
    };
    process.on('SIGINT', stop);
    process.on('SIGTERM', stop);
  });
}
