/**
 * Nothing leaks (issue 18): folder walks stay inside the folder named, every text a person reads
 * is terminal-safe, the checklist quotes text as inert Markdown, and invisible characters inside a
 * statistic neither hide it nor split its number. All inputs are invented. The reference for
 * "renders as an image, a link or HTML" is the CommonMark/GFM parser itself (remark-parse with
 * remark-gfm, from npm), not plumbline's code; that ESC (U+001B) starts terminal control sequences
 * and U+202A–202E, U+2066–2069 are the Unicode bidi controls is common practice, no source;
 * writing a URL as `http[:]//` so it is shown but not linked is common practice, no source.
 * t(28) = 2.10 gives two-tailed p = 0.04486 (scipy.stats.t.sf, doubled), so p = .045 is correct;
 * t(40) = 3.10 gives 0.0035 (scipy), so p = .20 is an error.
 */
import { mkdirSync, mkdtempSync, readFileSync, symlinkSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import remarkGfm from 'remark-gfm';
import remarkParse from 'remark-parse';
import { unified } from 'unified';
import { Ajv2020 } from 'ajv/dist/2020.js';
import AjvDraft04Module from 'ajv-draft-04';
import { describe, expect, it } from 'vitest';
import { cli, type Outcome } from './harness.js';
import { readReport } from '../helpers.js';

const tempDir = () => mkdtempSync(join(tmpdir(), 'plumbline-leaks-'));
const WRONG = 'Errors rose, t(40) = 3.10, p = .20.\n';
const RIGHT = 'Scores rose, t(28) = 2.10, p = .045.\n';
const ESC = '\u001b';
const BIDI = /[\u202A-\u202E\u2066-\u2069]/;

interface Json {
  files: Array<{ path: string; source: string; results: Array<{ printed: string; start: { line: number; column: number } }>; findings: Array<{ ruleId: string; messageId: string; level: string; start: { line: number; column: number } }> }>;
}
const json = (o: Outcome) => readReport(o.stdout) as Json;

/** A repository whose folder links out to a secret file and to a folder outside it. */
function repoWithLinksOut(): string {
  const dir = tempDir();
  mkdirSync(join(dir, 'outside'));
  writeFileSync(join(dir, 'outside', 'secret.md'), `SECRET-TOKEN-7731 ${WRONG}`);
  mkdirSync(join(dir, 'repo'));
  mkdirSync(join(dir, 'repo', 'inner'));
  writeFileSync(join(dir, 'repo', 'paper.md'), RIGHT);
  writeFileSync(join(dir, 'repo', 'inner', 'notes.md'), RIGHT);
  symlinkSync(join(dir, 'outside', 'secret.md'), join(dir, 'repo', 'linked.md'));
  symlinkSync(join(dir, 'outside'), join(dir, 'repo', 'elsewhere'));
  symlinkSync('/', join(dir, 'repo', 'root'));
  // a link that stays inside the folder is still followed
  symlinkSync(join(dir, 'repo', 'inner'), join(dir, 'repo', 'same'));
  return dir;
}

describe('folder walks never leave the folder named', () => {
  it('skips links out of the tree (a secret file, a folder, /), says which, and reports nothing of them', async () => {
    const dir = repoWithLinksOut();
    const out = await cli(['repo', '-f', 'html'], { cwd: dir });
    expect(out.code).toBe(0);
    expect(out.stdout).not.toContain('SECRET-TOKEN-7731');
    for (const link of ['repo/elsewhere', 'repo/linked.md', 'repo/root'])
      expect(out.stderr).toContain(`plumbline: ${link}: not followed: this symbolic link leads outside the folder walked (--follow-links-outside follows it)`);
    const files = json(await cli(['repo', '-f', 'json'], { cwd: dir })).files.map((f) => f.path);
    expect(files).toEqual(['repo/inner/notes.md', 'repo/paper.md']);
  }, 20_000);

  it('the runner returns the skipped links as data', async () => {
    const { checkFiles } = await import('../../src/cli/runner.js');
    const dir = repoWithLinksOut();
    const run = await checkFiles(['repo'], { cwd: dir, jobs: 1 });
    expect(run.skippedLinks).toEqual(['repo/elsewhere', 'repo/linked.md', 'repo/root']);
    expect(run.report.failures).toEqual([]);
  }, 20_000);

  it('the JSON, SARIF and HTML reports list the links not followed; a run without any is unchanged', async () => {
    // sources: the JSON report's own schema (schema/report.schema.json) and the OASIS SARIF 2.1.0
    // schema (test/fixtures/standards/sarif-2.1.0-rtm.5.json), both validated with ajv from npm
    const AjvDraft04 = AjvDraft04Module as unknown as typeof AjvDraft04Module.default;
    const reportSchema = new Ajv2020({ allErrors: true, strict: false }).compile(JSON.parse(readFileSync('schema/report.schema.json', 'utf8')));
    const sarifSchema = new AjvDraft04({ allErrors: true, strict: false, validateFormats: false, unicodeRegExp: false }).compile(JSON.parse(readFileSync('test/fixtures/standards/sarif-2.1.0-rtm.5.json', 'utf8')));
    const dir = repoWithLinksOut();
    // a link whose name carries markup, an escape sequence and a bidi control
    symlinkSync('/', join(dir, 'repo', `<img src=x onerror=alert(1)>${ESC}[2J\u202E.md`));
    const hostile = `repo/<img src=x onerror=alert(1)>${ESC}[2J\u202E.md`;
    const skipped = ['repo/elsewhere', 'repo/linked.md', 'repo/root', hostile].sort();

    const data = JSON.parse((await cli(['repo', '-f', 'json'], { cwd: dir })).stdout) as { reportVersion: string; skippedLinks?: string[] };
    expect(reportSchema(data), JSON.stringify(reportSchema.errors?.slice(0, 3))).toBe(true);
    expect(data.reportVersion).toBe('2.1.0');
    expect([...(data.skippedLinks ?? [])].sort()).toEqual(skipped);

    const log = JSON.parse((await cli(['repo', '-f', 'sarif'], { cwd: dir })).stdout) as { runs: Array<{ invocations: Array<{ executionSuccessful: boolean; toolExecutionNotifications: Array<{ level: string; message: { text: string }; locations: Array<{ physicalLocation: { artifactLocation: { uri: string } } }> }> }> }> };
    expect(sarifSchema(log), JSON.stringify(sarifSchema.errors?.slice(0, 3))).toBe(true);
    const notes = log.runs[0]?.invocations[0]?.toolExecutionNotifications ?? [];
    expect(notes).toHaveLength(4);
    expect(notes.every((n) => n.level === 'note' && n.message.text.startsWith('not followed: '))).toBe(true);
    expect(notes.map((n) => n.locations[0]?.physicalLocation.artifactLocation.uri)).toContain('repo/root');
    // skipping a link is no failure of the run
    expect(log.runs[0]?.invocations[0]?.executionSuccessful).toBe(true);

    const html = (await cli(['repo', '-f', 'html'], { cwd: dir })).stdout;
    expect(html).toContain('<h2>Links not followed</h2>');
    for (const link of ['repo/elsewhere', 'repo/linked.md', 'repo/root']) expect(html).toContain(`<li><strong>${link}</strong></li>`);
    // escaped, control characters dropped, bidi shown: the name is text, not markup
    expect(html).toContain('<li><strong>repo/&lt;img src=x onerror=alert(1)&gt;[2J&lt;U+202E&gt;.md</strong></li>');
    expect(html).not.toContain('<img');
    expect(html).not.toContain(ESC);
    expect(html).not.toMatch(BIDI);

    // a walk that skipped nothing: no field, no section
    const clean = tempDir();
    mkdirSync(join(clean, 'repo'));
    writeFileSync(join(clean, 'repo', 'paper.md'), RIGHT);
    expect(JSON.parse((await cli(['repo', '-f', 'json'], { cwd: clean })).stdout)).not.toHaveProperty('skippedLinks');
    expect((await cli(['repo', '-f', 'html'], { cwd: clean })).stdout).not.toContain('Links not followed');
  }, 30_000);

  it('a glob does not follow them either', async () => {
    const dir = repoWithLinksOut();
    const out = await cli(['repo/*.md', '-f', 'json'], { cwd: dir });
    // a glob follows no link to a folder, and a linked file outside is not matched
    expect(json(out).files.map((f) => f.path)).toEqual(['repo/paper.md']);
    expect(out.stdout).not.toContain('SECRET-TOKEN-7731');
  });

  it('--follow-links-outside follows them; a link named on the command line is always read', async () => {
    const dir = tempDir();
    mkdirSync(join(dir, 'outside'));
    writeFileSync(join(dir, 'outside', 'secret.md'), WRONG);
    mkdirSync(join(dir, 'repo'));
    symlinkSync(join(dir, 'outside', 'secret.md'), join(dir, 'repo', 'linked.md'));
    const followed = await cli(['repo', '--follow-links-outside', '-f', 'json'], { cwd: dir });
    expect(json(followed).files.map((f) => f.path)).toEqual(['repo/linked.md']);
    expect(followed.stderr).toBe('');
    const named = await cli(['repo/linked.md', '-f', 'json'], { cwd: dir });
    expect(named.code).toBe(1);
    expect(json(named).files.map((f) => f.path)).toEqual(['repo/linked.md']);
  });
});

describe('terminal control sequences and bidi controls never reach a reader', () => {
  it('a file name with escape sequences: standard error is terminal-safe in every format', async () => {
    const dir = tempDir();
    const name = `gone${ESC}]0;pwned${ESC}\\${ESC}[2J\u202E.md`;
    for (const format of ['human', 'lines', 'json', 'sarif', 'checklist', 'html']) {
      const out = await cli([name, '-f', format], { cwd: dir });
      expect(out.code).toBe(2);
      expect(out.stderr).not.toContain(ESC);
      expect(out.stderr).not.toMatch(BIDI);
      // "[" makes the name a glob that matches nothing: said with the name, made safe
      expect(out.stderr).toContain('plumbline: gone?]0;pwned?\\?[2J<U+202E>.md: ');
    }
  });

  it('a configuration key with escape sequences: said safely on standard error', async () => {
    const dir = tempDir();
    writeFileSync(join(dir, '.plumbline.json'), JSON.stringify({ [`x${ESC}[31mred\u2066`]: true }));
    writeFileSync(join(dir, 'paper.md'), RIGHT);
    const out = await cli(['paper.md'], { cwd: dir });
    expect(out.code).toBe(2);
    expect(out.stderr).toContain('.plumbline.json');
    expect(out.stderr).not.toContain(ESC);
    expect(out.stderr).not.toMatch(BIDI);
  });

  it('a newline in a file name cannot forge a finding in the human output', async () => {
    const dir = tempDir();
    const forged = '  9:9      error   p-follows-from-t';
    const name = `paper.md\n${forged}\n.md`;
    writeFileSync(join(dir, name), WRONG);
    const out = await cli([name], { cwd: dir });
    expect(out.code).toBe(1);
    const lines = out.stdout.split('\n');
    expect(lines.some((l) => l.startsWith('  9:9'))).toBe(false);
    expect(lines).toContain(`paper.md?${forged}?.md`);
  });

  it('bidi controls in the manuscript and the file name are shown as <U+…> in human and HTML output', async () => {
    const dir = tempDir();
    const name = 'report\u202Edm.md';
    writeFileSync(join(dir, name), `Speed \u2067fell\u2069, t(40) = 3.10, p = .20 \u202Dxyz.\n`);
    const human = await cli([name], { cwd: dir });
    expect(human.stdout).not.toMatch(BIDI);
    expect(human.stdout).toContain('report<U+202E>dm.md');
    expect(human.stdout).toContain('Speed <U+2067>fell<U+2069>, t(40)');
    const html = await cli([name, '-f', 'html'], { cwd: dir });
    expect(html.stdout).not.toMatch(BIDI);
    expect(html.stdout).toContain('report&lt;U+202E&gt;dm.md');
    // the bidi controls are also where the note on invisible characters marks the text
    expect(html.stdout).toContain('&lt;U+2067&gt;');
    expect(html.stdout).toContain('fell&lt;U+2069&gt;');
  });

  it('escape sequences in manuscript text and file names do not reach the checklist', async () => {
    const dir = tempDir();
    const name = `paper${ESC}[31m.txt`;
    writeFileSync(join(dir, name), `Table 1. Scores.\n\nMeasure | t(40) | p\nSpeed ${ESC}]0;pwned${ESC}\\ | 3.10 | .20\n`);
    const out = await cli([name, '-f', 'checklist'], { cwd: dir });
    expect(out.stdout).toContain("row 'Speed ?\\]0;pwned?\\\\'");
    expect(out.stdout).toContain('# Reporting checklist: paper?\\[31m.txt');
    expect(out.stdout).not.toContain(ESC);
  });
});

/** Every node of a Markdown tree, by CommonMark/GFM as remark reads it. */
function nodeTypes(markdown: string): Set<string> {
  const types = new Set<string>();
  const visit = (n: { type: string; children?: unknown[] }) => {
    types.add(n.type);
    for (const c of n.children ?? []) visit(c as { type: string; children?: unknown[] });
  };
  visit(unified().use(remarkParse).use(remarkGfm).parse(markdown) as { type: string; children?: unknown[] });
  return types;
}

describe('the checklist quotes text as inert Markdown', () => {
  it('no image, link, autolink or HTML from the manuscript or the file name renders', async () => {
    const dir = tempDir();
    const name = '![x](track.png) [y][r] <b>www.example.invalid a@example.invalid.txt';
    writeFileSync(
      join(dir, name),
      [
        'Table 1. Scores by measure.',
        '',
        'Measure | t(40) | p',
        'Speed ![x](http://example.invalid/track.png) | 3.10 | .20',
        'Errors [a](http://example.invalid/l) <http://example.invalid/a> | 2.47 | .021',
        'Load <img src=http://example.invalid/i.png> https://example.invalid/b | 2.02 | .050',
        '',
        '[r]: http://example.invalid/ref',
        '',
      ].join('\n'),
    );
    const out = await cli([name, '-f', 'checklist'], { cwd: dir });
    expect(out.stdout).toContain("row 'Speed \\!\\[x\\](http\\[:\\]//example.invalid/track.png)'");
    const types = nodeTypes(out.stdout);
    for (const live of ['image', 'link', 'imageReference', 'linkReference', 'html', 'definition']) expect(types.has(live), live).toBe(false);
    expect(types.has('table')).toBe(true);
  });
});

describe('invisible characters inside a statistic', () => {
  const cases: Array<[string, string]> = [
    ['right-to-left mark hiding the t', 'Scores rose, t\u200F(28) = 2.10, p = .045.\n'],
    ['left-to-right mark splitting t', 'Scores rose, t(28) = 2\u200E.10, p = .045.\n'],
    ['Arabic letter mark in df', 'Scores rose, t(2\u061C8) = 2.10, p = .045.\n'],
    ['byte-order mark inside p', 'Scores rose, t(28) = 2.10, p = .0\uFEFF45.\n'],
    ['variation selector after t', 'Scores rose, t(28) = 2.10\uFE0F, p = .045.\n'],
    ['combining mark on a digit', 'Scores rose, t(28) = 2.1\u03010, p = .045.\n'],
    ['combining mark after the df', 'Scores rose, t(28)\u0332 = 2.10, p = .045.\n'],
  ];
  it.each(cases)('%s: the result is read at its exact place, not flagged, and a note says so', async (_, text) => {
    const dir = tempDir();
    writeFileSync(join(dir, 'paper.md'), `# Results\n\n${text}`);
    const out = await cli(['paper.md', '-f', 'json'], { cwd: dir });
    expect(out.code).toBe(0);
    const file = json(out).files[0]!;
    expect(file.results.map((r) => `${r.start.line}:${r.start.column}`)).toEqual(['3:14']);
    const invisible = text.search(/[\u200F\u200E\u061C\uFEFF\uFE0F\u0301\u0332]/);
    expect(file.findings.map((f) => `${f.level} ${f.ruleId}/${f.messageId} ${f.start.line}:${f.start.column}`)).toEqual([`note input-is-readable/invisible-removed 3:${invisible + 1}`]);
  });

  it('a mark on a letter stays (a decomposed accent, the bar of x̄), and no note is made for it', async () => {
    const dir = tempDir();
    writeFileSync(join(dir, 'paper.md'), 'The cafe\u0301 group scored higher (x\u0304 = 3.2), t(28) = 2.10, p = .045.\n');
    const file = json(await cli(['paper.md', '-f', 'json'], { cwd: dir })).files[0]!;
    expect(file.results).toHaveLength(1);
    expect(file.findings).toEqual([]);
  });
});
