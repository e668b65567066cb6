import type { Finding } from '../engine/index.js';
import type { Fix } from '../rule-api/types.js';

export interface AppliedFixes {
  /** The source with every fix that applied. */
  text: string;
  applied: Array<{ fix: Fix; ruleId: string }>;
  /** Fixes left out, with why: the text at their place is not what the rule read, or another fix already changed it. */
  skipped: Array<{ fix: Fix; ruleId: string; reason: string }>;
}

/** Where one edit lands in the source, once checked. */
interface Landing {
  start: number;
  end: number;
  text: string;
}

/**
 * Where a fix's edits land, or why it cannot be applied. Each edit's `find` must occur exactly
 * once in the source at its span: the applier, unlike a rule, reads the source, and changes only
 * characters it finds there as the rule read them.
 */
export function landFix(source: string, fix: Fix): Landing[] | string {
  const out: Landing[] = [];
  for (const e of fix.edits) {
    if (e.span.start < 0 || e.span.end > source.length || e.span.start > e.span.end || e.find === '') return 'its place is outside the text';
    const slice = source.slice(e.span.start, e.span.end);
    const at = slice.indexOf(e.find);
    if (at < 0) return `the text there is "${slice}", not the "${e.find}" it was read as`;
    if (slice.indexOf(e.find, at + 1) >= 0) return `"${e.find}" occurs more than once there`;
    out.push({ start: e.span.start + at, end: e.span.start + at + e.find.length, text: e.text });
  }
  out.sort((a, b) => a.start - b.start);
  for (let i = 1; i < out.length; i++) if ((out[i] as Landing).start < (out[i - 1] as Landing).end) return 'its edits overlap';
  return out;
}

/**
 * Apply the fixes the findings carry to their source. Fixes are taken in order of place; one
 * whose edits would touch characters an earlier fix changed is left out (the next run offers it
 * again if it still applies). Never changes anything but the characters each edit names.
 */
export function applyFixes(source: string, findings: readonly Finding[]): AppliedFixes {
  const candidates = findings.filter((f): f is Finding & { fix: Fix } => f.fix !== undefined);
  const applied: AppliedFixes['applied'] = [];
  const skipped: AppliedFixes['skipped'] = [];
  const taken: Landing[] = [];
  for (const f of candidates) {
    const landing = landFix(source, f.fix);
    if (typeof landing === 'string') {
      skipped.push({ fix: f.fix, ruleId: f.ruleId, reason: landing });
      continue;
    }
    if (landing.some((l) => taken.some((t) => l.start < t.end && t.start < l.end))) {
      skipped.push({ fix: f.fix, ruleId: f.ruleId, reason: 'another fix changes the same characters' });
      continue;
    }
    taken.push(...landing);
    applied.push({ fix: f.fix, ruleId: f.ruleId });
  }
  taken.sort((a, b) => a.start - b.start);
  let text = '';
  let at = 0;
  for (const l of taken) {
    text += source.slice(at, l.start) + l.text;
    at = l.end;
  }
  text += source.slice(at);
  return { text, applied, skipped };
}
