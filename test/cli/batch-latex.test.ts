import { mkdirSync, mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { cli } from './harness.js';
import { readReport } from '../helpers.js';

/**
 * Batch mode follows a LaTeX manuscript's \input and \include files when the line gives its path,
 * as the command line does (within its folder only), and keeps one output line per input line:
 * the included files' reports travel in that line as `included`. Invented text.
 */
describe('batch mode: LaTeX includes', () => {
  it('the included file is checked and listed in the manuscript\'s line; a refused include is a note there', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'plumbline-batch-tex-'));
    mkdirSync(join(dir, 'parts'));
    writeFileSync(join(dir, 'main.tex'), '\\begin{document}\nIntro.\n\\input{parts/results}\n\\input{/etc/hostname}\n\\end{document}\n');
    writeFileSync(join(dir, 'parts', 'results.tex'), 'Scores rose, $t(23) = 5.90$, $p = .000$.\n\\include{missing}\n');
    const doc = JSON.stringify({ id: 'inline', text: 'x, t(46) = 0.84, p = .04.' });
    const out = await cli(['batch', '--jobs', '1'], { stdin: `${join(dir, 'main.tex')}\n${doc}\n` });
    const rows = out.stdout.trim().split('\n').map((l) => readReport(l) as { id: unknown; findings: Array<{ ruleId: string; message: string }>; included?: Array<{ path: string; findings: Array<{ ruleId: string; message: string }> }> });
    expect(rows.map((r) => r.id)).toEqual([join(dir, 'main.tex'), 'inline']);
    const [main] = rows;
    expect(main?.findings.filter((f) => f.ruleId === 'input-is-readable').map((f) => f.message)).toEqual([expect.stringContaining('\\input{/etc/hostname} (an absolute path')]);
    expect(main?.included?.map((r) => r.path)).toEqual([join(dir, 'parts', 'results.tex')]);
    const included = main?.included?.[0]?.findings.map((f) => f.ruleId);
    expect(included).toContain('zero-p-is-a-bound');
    expect(main?.included?.[0]?.findings.find((f) => f.ruleId === 'input-is-readable')?.message).toContain('\\include{missing}');
    expect(rows[1]?.included).toBeUndefined();
    expect(out.stderr).toContain('plumbline batch: 2 lines');
  });
});
