/**
 * A unified diff (as `diff -u` writes it) of two texts, with `context` lines around each change.
 * Fixes change characters within lines and never add or remove a line break, so lines are
 * compared one for one; texts whose line counts differ are diffed as one hunk from the first
 * differing line to the end.
 */
export function unifiedDiff(path: string, before: string, after: string, context = 3): string {
  if (before === after) return '';
  const a = before.split('\n');
  const b = after.split('\n');
  // a final line break ends the last line; it does not start an empty one
  if (before.endsWith('\n') && after.endsWith('\n')) {
    a.pop();
    b.pop();
  }
  const changed: number[] = [];
  if (a.length === b.length) {
    for (let i = 0; i < a.length; i++) if (a[i] !== b[i]) changed.push(i);
  } else {
    let i = 0;
    while (i < a.length && i < b.length && a[i] === b[i]) i++;
    return header(path) + hunk(a, b, i, a.length, i, b.length, context);
  }
  let out = header(path);
  let k = 0;
  while (k < changed.length) {
    let last = k;
    // changes closer than twice the context share a hunk
    while (last + 1 < changed.length && (changed[last + 1] as number) - (changed[last] as number) <= 2 * context) last++;
    out += hunkOfLines(a, b, changed[k] as number, changed[last] as number, changed.slice(k, last + 1), context);
    k = last + 1;
  }
  return out;
}

const header = (path: string) => `--- a/${path}\n+++ b/${path}\n`;

function hunkOfLines(a: string[], b: string[], first: number, last: number, changed: number[], context: number): string {
  const start = Math.max(0, first - context);
  const end = Math.min(a.length, last + context + 1);
  const set = new Set(changed);
  const minus: string[] = [];
  let body = '';
  for (let i = start; i < end; i++) {
    if (set.has(i)) {
      body += `-${a[i]}\n`;
      minus.push(`+${b[i]}\n`);
      // a run of changed lines: every old line, then every new one
      if (!set.has(i + 1)) {
        body += minus.join('');
        minus.length = 0;
      }
    } else body += ` ${a[i]}\n`;
  }
  const n = end - start;
  return `@@ -${start + 1},${n} +${start + 1},${n} @@\n${body}`;
}

function hunk(a: string[], b: string[], aFrom: number, aTo: number, bFrom: number, bTo: number, context: number): string {
  const start = Math.max(0, aFrom - context);
  let body = '';
  for (let i = start; i < aFrom; i++) body += ` ${a[i]}\n`;
  for (let i = aFrom; i < aTo; i++) body += `-${a[i]}\n`;
  for (let i = bFrom; i < bTo; i++) body += `+${b[i]}\n`;
  return `@@ -${start + 1},${aTo - start} +${start + 1},${bTo - start} @@\n${body}`;
}
