import { spawn, spawnSync } from 'node:child_process';
import { chmodSync, existsSync, lstatSync, mkdirSync, mkdtempSync, readFileSync, readlinkSync, statSync, symlinkSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { Ajv2020 } from 'ajv/dist/2020.js';
import { describe, expect, it } from 'vitest';
import { checkFiles, formatJson, readBaseline } from '../../src/index.js';
import { RULES } from '../../src/engine/index.js';
import { BIN, cli } from './harness.js';
import { COMMAND_NAMES, OPTIONS } from '../../src/cli/help.js';
import { readReport } from '../helpers.js';

/**
 * The command line behaves as users of command-line linters expect: output through links and
 * into pipes and devices, quiet on a closed pipe, strict options, diagnostics on standard error,
 * one-line findings, baselines, ignore patterns, a package ready to publish. Every manuscript
 * here is invented.
 */

const root = resolve(import.meta.dirname, '../..');
const main = BIN;

/** An error: p = .20 cannot follow from t(40) = 3.10 (two-tailed p ≈ .0035; common practice, no source). */
const WRONG = 'Errors rose after the redesign, t(40) = 3.10, p = .20.\n';
/** A warning only: p = .42 does not follow from t(23) = 1.12 (p ≈ .27), both sides of .05 agree. */
const WARNED = 'Fatigue scores did not differ, t(23) = 1.12, p = .42.\n';
/** Consistent: t(23) = 2.47 gives p ≈ .021. */
const RIGHT = 'Recall improved with spacing, t(23) = 2.47, p = .021.\n';

function tempDir(): string {
  return mkdtempSync(join(tmpdir(), 'plumbline-conv-'));
}
function tree(files: Record<string, string>): string {
  const dir = tempDir();
  for (const [name, text] of Object.entries(files)) {
    mkdirSync(join(dir, name, '..'), { recursive: true });
    writeFileSync(join(dir, name), text);
  }
  return dir;
}
const json = (s: string) => readReport(s) as ReturnType<typeof parseReport>;
function parseReport(s: string) {
  return JSON.parse(s) as {
    summary: { error: number; warning: number; note: number; hiddenByQuiet: number; hiddenByBaseline: number };
    files: Array<{ path: string; alpha: { basis: string; value: number }; sidedness: { basis: string }; findings: Array<{ ruleId: string; level: string; fingerprint: string; start: { line: number } }>; results: Array<{ alpha: { basis: string; value: number } }> }>;
    failures: Array<{ path: string; message: string }>;
    cautions: string[];
  };
}
const isRoot = process.getuid?.() === 0;

describe('--output', () => {
  it('writes through a symbolic link: the link stays a link and its target holds the report', async () => {
    const dir = tree({ 'a.md': WRONG, 'reports/real.json': 'old' });
    symlinkSync(join(dir, 'reports/real.json'), join(dir, 'link.json'));
    const out = await cli(['a.md', '-f', 'json', '-o', 'link.json'], { cwd: dir });
    expect(out.code).toBe(1);
    expect(lstatSync(join(dir, 'link.json')).isSymbolicLink()).toBe(true);
    expect(readlinkSync(join(dir, 'link.json'))).toBe(join(dir, 'reports/real.json'));
    expect(json(readFileSync(join(dir, 'reports/real.json'), 'utf8')).summary.error).toBe(1);
  });

  it('a dangling link creates the file it names', async () => {
    const dir = tree({ 'a.md': RIGHT });
    symlinkSync(join(dir, 'made.txt'), join(dir, 'link.txt'));
    expect((await cli(['a.md', '-o', 'link.txt'], { cwd: dir })).code).toBe(0);
    expect(lstatSync(join(dir, 'link.txt')).isSymbolicLink()).toBe(true);
    expect(readFileSync(join(dir, 'made.txt'), 'utf8')).toContain('1 result found');
  });

  it('writes directly to a FIFO: it stays a FIFO and its reader gets the report', async () => {
    const dir = tree({ 'a.md': WRONG });
    const fifo = join(dir, 'pipe');
    expect(spawnSync('mkfifo', [fifo]).status).toBe(0);
    const reader = spawn('cat', [fifo]);
    let got = '';
    reader.stdout.on('data', (d: Buffer) => (got += d.toString()));
    const done = new Promise((r) => reader.on('close', r));
    const out = await cli(['a.md', '-f', 'lines', '-o', fifo], { cwd: dir });
    await done;
    expect(out.code).toBe(1);
    expect(statSync(fifo).isFIFO()).toBe(true);
    expect(got).toMatch(/^a\.md:1:\d+: error significance-follows-from-t /);
  });

  it('writes directly to a device: /dev/null stays a character device', async () => {
    const dir = tree({ 'a.md': WRONG });
    expect((await cli(['a.md', '-o', '/dev/null'], { cwd: dir })).code).toBe(1);
    expect(statSync('/dev/null').isCharacterDevice()).toBe(true);
    expect(lstatSync('/dev/null').isFile()).toBe(false);
  });

  it('-o /dev/stdout reaches standard output through the magic link (the installed command)', () => {
    const dir = tree({ 'a.md': WRONG });
    const r = spawnSync(process.execPath, [main, 'a.md', '-f', 'lines', '-o', '/dev/stdout'], { cwd: dir, encoding: 'utf8' });
    expect(r.status).toBe(1);
    expect(r.stdout).toMatch(/^a\.md:1:\d+: error significance-follows-from-t /);
    expect(lstatSync('/dev/stdout').isSymbolicLink()).toBe(true);
  });

  it('a regular file is still replaced atomically, and never when it is one of the inputs', async () => {
    const dir = tree({ 'a.md': WRONG, 'out.txt': 'earlier report' });
    expect((await cli(['a.md', '-o', 'out.txt'], { cwd: dir })).code).toBe(1);
    expect(readFileSync(join(dir, 'out.txt'), 'utf8')).toContain('significance-follows-from-t');
    symlinkSync(join(dir, 'a.md'), join(dir, 'alias.md'));
    const refused = await cli(['a.md', '-o', 'alias.md'], { cwd: dir });
    expect(refused.code).toBe(2);
    expect(refused.stderr).toContain('refusing to write over an input file: a.md');
    expect(readFileSync(join(dir, 'a.md'), 'utf8')).toBe(WRONG);
  });
});

describe('a reader that closes early', () => {
  it('stops writing quietly: no EPIPE trace, and the exit status is what the findings decide', async () => {
    // enough output to fill a pipe many times over
    const dir = tree({ 'big.md': Array.from({ length: 400 }, (_, i) => `Item ${i} changed, t(40) = 3.10, p = .20.\n\n`).join('') });
    const child = spawn(process.execPath, [main, 'big.md', '-f', 'json'], { cwd: dir, stdio: ['ignore', 'pipe', 'pipe'] });
    let stderr = '';
    child.stderr.on('data', (d: Buffer) => (stderr += d.toString()));
    // like `| head -c 10`: read the first chunk, then close the pipe
    await new Promise<void>((r) => child.stdout.once('data', () => r()));
    child.stdout.destroy();
    const code = await new Promise<number | null>((r) => child.on('close', r));
    expect(stderr).not.toMatch(/EPIPE|Error|at /);
    expect(code).toBe(1);
  }, 60_000);

  it('under a shell pipe into head', () => {
    const dir = tree({ 'big.md': Array.from({ length: 400 }, (_, i) => `Item ${i} changed, t(40) = 3.10, p = .20.\n\n`).join('') });
    const r = spawnSync('bash', ['-c', `set -o pipefail; "${process.execPath}" "${main}" big.md -f lines | head -n 1`], { cwd: dir, encoding: 'utf8' });
    expect(r.stdout.split('\n').filter(Boolean)).toHaveLength(1);
    expect(r.stderr).toBe('');
    expect(r.status).toBe(1);
  }, 60_000);
});

describe('options are validated, each named in its message (exit 2)', () => {
  const dir = tree({ 'a.md': RIGHT });
  it.each([
    [['--max-warnings', 'abc', 'a.md'], '--max-warnings must be a whole number, 0 or more; got "abc"'],
    [['--max-warnings', '-1', 'a.md'], '--max-warnings must be a whole number, 0 or more; got "-1"'],
    [['--max-warnings', '1.5', 'a.md'], '--max-warnings must be a whole number'],
    [['--jobs', '0', 'a.md'], '--jobs must be a whole number, 1 or more; got "0"'],
    [['--jobs', 'abc', 'a.md'], '--jobs must be a whole number, 1 or more; got "abc"'],
    [['a.md', '--format'], '--format needs a value (human, lines, json, sarif, checklist, html)'],
    [['--format', 'xml', 'a.md'], '--format must be one of human, lines, json, sarif, checklist, html; got "xml"'],
    [['--alpha', '0.05', '--alpha', '0.01', 'a.md'], '--alpha is given more than once'],
    [['--alpha', '5', 'a.md'], '--alpha must be a number between 0 and 1'],
    [['--tails', 'three', 'a.md'], '--tails must be one or two; got "three"'],
    [['--max-file-bytes', '0', 'a.md'], '--max-file-bytes must be a whole number of bytes'],
    [['rules', '--format', 'sarif'], '--format must be one of human, json for "rules"'],
    [['a.md', '--output'], '--output needs a value'],
  ])('%j', async (args, message) => {
    const out = await cli(args, { cwd: dir });
    expect(out.code).toBe(2);
    expect(out.stderr).toContain(message);
    expect(out.stdout).toBe('');
  });

  // an option that means nothing to a command is refused, never silently ignored
  it.each([
    [['rules', '--alpha', '0.2', '-j', '3'], '--alpha, --jobs do not apply to rules'],
    [['explain', 'p-follows-from-t', '-f', 'json'], '--format does not apply to explain'],
    [['summarize', '--tails', 'one', 'a.md'], '--tails does not apply to summarize'],
    [['summarize', '--quiet', 'a.md'], '--quiet applies to checking files only'],
    [['lsp', '--config', 'x.json'], '--config does not apply to lsp'],
    [['a.md', '--stdio'], '--stdio applies to lsp only'],
    [['rules', '-o', 'rules.txt'], '--output does not apply to rules'],
    [['batch', '--watch'], '--watch applies to checking files only'],
  ])('misplaced: %j', async (args, message) => {
    const out = await cli(args, { cwd: dir });
    expect(out.code).toBe(2);
    expect(out.stderr).toContain(message);
    expect(out.stdout).toBe('');
    expect(existsSync(join(dir, 'rules.txt'))).toBe(false);
  });

  it('every option is accepted by at least one command, and each command it names exists', () => {
    for (const o of OPTIONS) {
      expect(o.commands.length, o.name).toBeGreaterThan(0);
      for (const c of o.commands) expect(COMMAND_NAMES, o.name).toContain(c);
    }
  });

  it('an unknown option is named once, with its dashes', async () => {
    const out = await cli(['--bogus', '--bogus', 'a.md'], { cwd: dir });
    expect(out.code).toBe(2);
    expect(out.stderr.match(/--bogus/g)).toHaveLength(1);
    expect(out.stderr).toContain('unknown option --bogus');
  });

  it('a file name after -- is read as a file, even one that looks like an option', async () => {
    const d = tree({ '--weird.md': WRONG, '-x.md': RIGHT });
    const out = await cli(['-f', 'json', '--', '--weird.md', '-x.md'], { cwd: d });
    expect(out.code).toBe(1);
    expect(json(out.stdout).files.map((f) => f.path)).toEqual(['--weird.md', '-x.md']);
  });

  it('-h and -v are --help and --version', async () => {
    const help = await cli(['-h']);
    expect(help.code).toBe(0);
    expect(help.stdout).toContain('--write-baseline FILE');
    expect((await cli(['--help'])).stdout).toBe(help.stdout);
    const version = await cli(['-v']);
    expect(version.stdout.trim()).toBe(JSON.parse(readFileSync(join(root, 'package.json'), 'utf8')).version);
  });

  it('help wraps at word boundaries at any width: no line over the width, no word cut', async () => {
    const words = new Set((await cli(['--help'], { columns: 400 })).stdout.split(/\s+/).filter(Boolean));
    for (const columns of [20, 27, 40, 59, 60, 61, 80, 100, 133]) {
      const text = (await cli(['--help'], { columns })).stdout;
      for (const line of text.split('\n')) {
        const tokens = line.split(/\s+/).filter(Boolean);
        // a line may pass the width only when it holds a single word longer than the width
        if (line.length > columns) expect(tokens).toHaveLength(1);
        for (const t of tokens) expect(words.has(t), `"${t}" at ${columns} columns`).toBe(true);
      }
    }
  });
});

describe('diagnostics go to standard error in every format', () => {
  const formats = ['human', 'lines', 'json', 'sarif', 'checklist', 'html'];
  it.each(formats)('%s: a missing file, a path through a file, a binary file, a bad configuration', async (format) => {
    const dir = tree({ 'a.md': RIGHT, 'bin.md': 'x\u0000y', 'sub/.plumbline.json': '{"alpah": 0.05}', 'sub/b.md': RIGHT });
    const out = await cli(['a.md', 'missing.md', 'a.md/inside.md', 'bin.md', 'sub/b.md', '-f', format], { cwd: dir });
    expect(out.code).toBe(2);
    expect(out.stderr).toContain('missing.md: no such file or folder');
    expect(out.stderr).toContain('a.md/inside.md:');
    expect(out.stderr).toContain('bin.md: skipped: binary file');
    expect(out.stderr).toContain('unknown key "alpah"');
    if (format === 'human' || format === 'lines') {
      expect(out.stdout).not.toContain('missing.md');
      expect(out.stdout).not.toContain('alpah');
    }
  });

  it('a bad configuration is reported once for all the manuscripts under it', async () => {
    const dir = tree({ '.plumbline.json': '{\n  "alpha": 0.05,\n}', 'a.md': RIGHT, 'b.md': RIGHT, 'c/d.md': RIGHT });
    const out = await cli(['.'], { cwd: dir });
    expect(out.code).toBe(2);
    expect(out.stderr.match(/invalid JSON/g)).toHaveLength(1);
    expect(out.stderr).toContain('(not checked because of it: a.md, b.md, c/d.md)');
  });

  it('the configuration file is read once per run, and its content is never echoed', async () => {
    const dir = tree({ '.plumbline.json': 'secret-token-123', 'a.md': RIGHT, 'b.md': RIGHT });
    const out = await cli(['a.md', 'b.md', '-f', 'json'], { cwd: dir });
    expect(out.stderr.match(/invalid JSON/g)).toHaveLength(1);
    expect(out.stderr + out.stdout).not.toContain('secret');
  });

  it('a missing --config file says so in words', async () => {
    const dir = tree({ 'a.md': RIGHT });
    const out = await cli(['a.md', '--config', 'nope.json'], { cwd: dir });
    expect(out.code).toBe(2);
    expect(out.stderr).toContain('nope.json: cannot read configuration: no such file');
    expect(out.stderr).not.toMatch(/ENOENT|errno/);
  });

  it('a configuration that is a FIFO or a device is refused unread (it could block or never end)', async () => {
    const dir = tree({ 'a.md': RIGHT });
    symlinkSync('/dev/zero', join(dir, '.plumbline.json'));
    const out = await cli(['a.md'], { cwd: dir });
    expect(out.code).toBe(2);
    expect(out.stderr).toContain('not a regular file');
  });

  // issue 18: a FIFO configuration blocked for ever; one linked to /dev/stdin swallowed the batch input
  it('a configuration that is a FIFO is refused unread, without blocking', async () => {
    const dir = tree({ 'a.md': RIGHT });
    expect(spawnSync('mkfifo', [join(dir, '.plumbline.yaml')]).status).toBe(0);
    const out = await cli(['a.md'], { cwd: dir });
    expect(out.code).toBe(2);
    expect(out.stderr).toContain('.plumbline.yaml: cannot read configuration: not a regular file (not checked because of it: a.md)');
  });

  // issue 18: configurations are read within a size limit, found or named with --config alike
  it('a configuration over the size limit, found or named with --config, is refused unread; so is --config naming a device', async () => {
    // a valid JSON configuration, padded with spaces past the limit: refused for its size, not its text
    const big = `{"alpha": 0.05${' '.repeat(1024 * 1024)}}`;
    const dir = tree({ 'a.md': RIGHT, 'sub/a.md': RIGHT, 'sub/.plumbline.json': big, 'named.json': big });
    const found = await cli(['sub/a.md'], { cwd: dir });
    expect(found.code).toBe(2);
    expect(found.stderr).toContain(`.plumbline.json: cannot read configuration: ${big.length} bytes is over the limit of 1048576 (not checked because of it: sub/a.md)`);
    const named = await cli(['a.md', '--config', 'named.json'], { cwd: dir });
    expect(named.code).toBe(2);
    expect(named.stderr).toContain(`named.json: cannot read configuration: ${big.length} bytes is over the limit of 1048576`);
    const device = await cli(['a.md', '--config', '/dev/urandom'], { cwd: dir });
    expect(device.code).toBe(2);
    expect(device.stderr).toContain('/dev/urandom: cannot read configuration: not a regular file');
  });

  it('in batch mode, a configuration linked to /dev/stdin reads none of the input: every line gets its own output line', () => {
    const dir = tree({});
    symlinkSync('/dev/stdin', join(dir, '.plumbline.json'));
    const input = ['a', 'b', 'c'].map((id) => JSON.stringify({ id, text: RIGHT })).join('\n');
    const r = spawnSync(process.execPath, [main, 'batch'], { cwd: dir, input, encoding: 'utf8', timeout: 60_000 });
    const ids = r.stdout.split('\n').filter(Boolean).map((l) => (JSON.parse(l) as { id: string; error?: string }));
    expect(ids.map((o) => o.id)).toEqual(['a', 'b', 'c']);
    expect(ids.every((o) => o.error?.endsWith('cannot read configuration: not a regular file'))).toBe(true);
    expect(r.status).toBe(2);
  });

  it('a JSON configuration beginning with a byte-order mark is read', async () => {
    // read as without the mark: no error, and the same report (alpha .01 against a p of .021 said significant)
    const dir = tree({ 'a.md': 'Recall improved with spacing, t(23) = 2.47, p = .021, a significant difference.\n' });
    writeFileSync(join(dir, '.plumbline.json'), '\ufeff{ "alpha": 0.01 }');
    const withBom = await cli(['a.md', '-f', 'json'], { cwd: dir });
    expect(withBom.stderr).toBe('');
    expect(withBom.code).not.toBe(2);
    writeFileSync(join(dir, '.plumbline.json'), '{ "alpha": 0.01 }');
    const without = await cli(['a.md', '-f', 'json'], { cwd: dir });
    expect(withBom.stdout).toBe(without.stdout);
  });
});

describe('the cautions and --quiet', () => {
  const dir = tree({ 'wrong.md': WRONG, 'warned.md': WARNED, 'right.md': RIGHT });
  const caution = 'An inconsistency is a question';
  it('print once, after the findings, only when there are findings', async () => {
    const flagged = await cli(['wrong.md', 'warned.md']);
    const withFindings = await cli(['wrong.md', 'warned.md'], { cwd: dir });
    expect(flagged.code).toBe(2); // not found from the test's folder
    expect(withFindings.stdout.split(caution)).toHaveLength(2);
    expect((await cli(['right.md'], { cwd: dir })).stdout).not.toContain(caution);
  });
  it('--format lines says them on standard error, once, only on a terminal', async () => {
    expect((await cli(['wrong.md', 'warned.md', '-f', 'lines'], { cwd: dir, stderrIsTTY: true })).stderr.split(caution)).toHaveLength(2);
    expect((await cli(['wrong.md', '-f', 'lines'], { cwd: dir })).stderr).toBe('');
    expect((await cli(['right.md', '-f', 'lines'], { cwd: dir, stderrIsTTY: true })).stderr).toBe('');
  });
  it.each(['json', 'sarif', 'checklist', 'html'])('%s reports keep them, clean or not', async (format) => {
    expect((await cli(['right.md', '-f', format], { cwd: dir })).stdout).toContain(caution);
  });
  it('--quiet shows errors only, and warnings no longer count against --max-warnings', async () => {
    const loud = await cli(['wrong.md', 'warned.md', '-f', 'lines'], { cwd: dir });
    expect(loud.stdout).toContain(' warning ');
    const quiet = await cli(['wrong.md', 'warned.md', '-f', 'lines', '--quiet'], { cwd: dir });
    expect(quiet.stdout.trim().split('\n').every((l) => / error /.test(l))).toBe(true);
    expect(quiet.stdout).toContain('wrong.md');
    const warnedOnly = await cli(['warned.md', '-q', '--max-warnings', '0'], { cwd: dir });
    expect(warnedOnly.code).toBe(0);
    expect(warnedOnly.stdout).not.toContain(caution);
    expect((await cli(['warned.md', '--max-warnings', '0'], { cwd: dir })).code).toBe(1);
  });
});

describe('alpha and tails: the documented precedence, with the basis of each value', () => {
  // README "Configuration": the text, then front matter, then --alpha/--tails, then the configuration file, then the defaults
  const front = '---\nplumbline:\n  alpha: 0.01\n---\n';
  it.each([
    ['the default', {}, [], { value: 0.05, basis: 'default' }],
    ['a configuration file', { '.plumbline.json': '{"alpha": 0.1}' }, [], { value: 0.1, basis: 'configuration' }],
    ['the command line over a configuration file', { '.plumbline.json': '{"alpha": 0.1}' }, ['--alpha', '0.02'], { value: 0.02, basis: 'command-line' }],
    ['front matter over the command line', { prefix: front }, ['--alpha', '0.02'], { value: 0.01, basis: 'front-matter' }],
    ['the text over front matter', { prefix: front, text: 'Significance was set at α = .005.\n\n' }, ['--alpha', '0.02'], { value: 0.005, basis: 'document-text' }],
  ] as const)('%s', async (_name, files, args, expected) => {
    const f = files as { prefix?: string; text?: string; '.plumbline.json'?: string };
    const dir = tree({ 'a.md': `${f.prefix ?? ''}${f.text ?? ''}${RIGHT}`, ...(f['.plumbline.json'] ? { '.plumbline.json': f['.plumbline.json'] } : {}) });
    const out = await cli(['a.md', '-f', 'json', ...args], { cwd: dir });
    const file = json(out.stdout).files[0]!;
    expect(file.alpha).toMatchObject(expected);
    expect(file.results[0]!.alpha).toMatchObject({ value: expected.value });
  });
  it('tails from the command line carry their basis too', async () => {
    const dir = tree({ 'a.md': RIGHT });
    expect(json((await cli(['a.md', '-f', 'json', '--tails', 'one'], { cwd: dir })).stdout).files[0]!.sidedness).toMatchObject({ basis: 'command-line' });
  });
});

describe('--format lines', () => {
  it('one finding per line: path:line:column: level rule-id message, the message on one line', async () => {
    const dir = tree({ 'paper/results.md': `# Results\n\n${WRONG}\n${WARNED}`, 'paper/ok.md': RIGHT });
    const out = await cli(['paper', '-f', 'lines'], { cwd: dir });
    const lines = out.stdout.trimEnd().split('\n');
    const full = json((await cli(['paper', '-f', 'json'], { cwd: dir })).stdout);
    expect(lines).toHaveLength(full.files.reduce((n, f) => n + f.findings.length, 0));
    for (const line of lines) expect(line).toMatch(/^paper\/results\.md:\d+:\d+: (error|warning|note) [a-z-]+ \S.* — check: \S.*$/);
    expect(lines[0]).toMatch(/^paper\/results\.md:3:\d+: error significance-follows-from-t Reported p = \.20/);
    expect(out.code).toBe(1);
  });
});

describe('plumbline rules --format json', () => {
  it('lists every rule with id, summary, kind, default level and options schema (schema/rules.schema.json)', async () => {
    const out = await cli(['rules', '--format', 'json']);
    const data = JSON.parse(out.stdout) as { rules: Array<{ id: string }> };
    const validate = new Ajv2020({ strict: false }).compile(JSON.parse(readFileSync(join(root, 'schema/rules.schema.json'), 'utf8')));
    expect(validate(data), JSON.stringify(validate.errors)).toBe(true);
    expect(data.rules.map((r) => r.id)).toEqual(RULES.map((r) => r.id));
  });
});

describe('baselines for manuscripts under revision', () => {
  const draft = `# Results\n\n${WRONG}\n${WARNED}\n${WARNED}`;

  it('--write-baseline records the findings; --baseline then reports none of them, after lines are inserted above', async () => {
    const dir = tree({ 'ms/paper.md': draft });
    const first = await cli(['ms', '--write-baseline', 'baseline.json'], { cwd: dir });
    expect(first.code).toBe(0);
    expect(first.stderr).toContain('recorded 3 findings in baseline.json');
    const recorded = readBaseline(join(dir, 'baseline.json'));
    expect(recorded.entries.map((e) => [e.path, e.rule])).toEqual([
      ['ms/paper.md', 'significance-follows-from-t'],
      ['ms/paper.md', 'p-follows-from-t'],
      ['ms/paper.md', 'p-follows-from-t'],
    ]);
    // two identical sentences: told apart by their occurrence, not their line
    expect(new Set(recorded.entries.map((e) => e.fingerprint)).size).toBe(3);

    writeFileSync(join(dir, 'ms/paper.md'), `# Results\n\nA new opening paragraph.\n\nAnd another, with a consistent result, t(23) = 2.47, p = .021.\n\n${draft.slice('# Results\n\n'.length)}`);
    const again = await cli(['ms', '-f', 'json', '--baseline', 'baseline.json'], { cwd: dir });
    expect(again.code).toBe(0);
    const report = json(again.stdout);
    expect(report.files[0]!.findings).toEqual([]);
    expect(report.summary.hiddenByBaseline).toBe(3);
  });

  it('a new finding is reported, and exit status and --max-warnings count only new findings', async () => {
    const dir = tree({ 'paper.md': draft });
    await cli(['paper.md', '--write-baseline', 'b.json'], { cwd: dir });
    expect((await cli(['paper.md', '--baseline', 'b.json', '--max-warnings', '0'], { cwd: dir })).code).toBe(0);
    writeFileSync(join(dir, 'paper.md'), `${draft}\nSleep was longer, t(30) = 1.50, p = .51.\n`);
    const out = await cli(['paper.md', '--baseline', 'b.json', '-f', 'lines', '--max-warnings', '0'], { cwd: dir });
    expect(out.stdout.trim().split('\n')).toHaveLength(1);
    expect(out.stdout).toMatch(/^paper\.md:9:\d+: warning p-follows-from-t /);
    expect(out.code).toBe(1);
    expect((await cli(['paper.md', '--baseline', 'b.json', '--max-warnings', '1'], { cwd: dir })).code).toBe(0);
  });

  it('editing a flagged result makes it new; the stale entry is said', async () => {
    const dir = tree({ 'paper.md': WRONG });
    await cli(['paper.md', '--write-baseline', 'b.json'], { cwd: dir });
    writeFileSync(join(dir, 'paper.md'), WRONG.replace('p = .20', 'p = .30'));
    const out = await cli(['paper.md', '--baseline', 'b.json'], { cwd: dir });
    expect(out.code).toBe(1);
    expect(out.stderr).toContain('1 baseline entry matches no finding any more');
  });

  it('an entry may carry a reason; writing the baseline again keeps it; reports count what was hidden, by quiet comments too', async () => {
    const quieted = `<!-- plumbline quiet significance-follows-from-t: this p is Holm-adjusted -->\nScores changed, t(40) = 3.10, p = .20.\n\n${WARNED}`;
    const dir = tree({ 'paper.md': quieted });
    await cli(['paper.md', '--write-baseline', 'b.json'], { cwd: dir });
    const b = JSON.parse(readFileSync(join(dir, 'b.json'), 'utf8')) as { findings: Array<{ reason?: string }> };
    expect(b.findings).toHaveLength(1);
    b.findings[0]!.reason = 'p is Holm-adjusted, see Methods';
    writeFileSync(join(dir, 'b.json'), JSON.stringify(b));
    await cli(['paper.md', '--write-baseline', 'b.json'], { cwd: dir });
    expect(readBaseline(join(dir, 'b.json')).entries[0]!.reason).toBe('p is Holm-adjusted, see Methods');
    const human = await cli(['paper.md', '--baseline', 'b.json'], { cwd: dir });
    expect(human.stdout).toContain('2 findings hidden (1 by quiet comments, 1 by the baseline)');
    const summary = json((await cli(['paper.md', '--baseline', 'b.json', '-f', 'json'], { cwd: dir })).stdout).summary;
    expect([summary.hiddenByQuiet, summary.hiddenByBaseline]).toEqual([1, 1]);
    const html = (await cli(['paper.md', '--baseline', 'b.json', '-f', 'html'], { cwd: dir })).stdout;
    expect(html).toContain('<tr><th>Hidden by quiet comments</th><td>1</td></tr>');
    expect(html).toContain('<tr><th>Hidden by the baseline</th><td>1</td></tr>');
    const sarif = JSON.parse((await cli(['paper.md', '--baseline', 'b.json', '-f', 'sarif'], { cwd: dir })).stdout);
    expect(sarif.runs[0].properties).toMatchObject({ hiddenByQuietComments: 1, hiddenByBaseline: 1 });
  });

  it('a baseline that is missing or malformed is said, exit 2', async () => {
    const dir = tree({ 'paper.md': WRONG, 'bad.json': '{"format": "other"}' });
    const missing = await cli(['paper.md', '--baseline', 'none.json'], { cwd: dir });
    expect([missing.code, missing.stderr]).toEqual([2, 'plumbline: baseline none.json: no such file (write one with --write-baseline)\n']);
    expect((await cli(['paper.md', '--baseline', 'bad.json'], { cwd: dir })).stderr).toContain('not a baseline');
  });

  it('the baseline file follows schema/baseline.schema.json', async () => {
    const dir = tree({ 'paper.md': draft });
    await cli(['paper.md', '--write-baseline', 'b.json'], { cwd: dir });
    const validate = new Ajv2020({ strict: false }).compile(JSON.parse(readFileSync(join(root, 'schema/baseline.schema.json'), 'utf8')));
    expect(validate(JSON.parse(readFileSync(join(dir, 'b.json'), 'utf8'))), JSON.stringify(validate.errors)).toBe(true);
  });
});

describe('SARIF for code-scanning dashboards', () => {
  it('partialFingerprints from the same fingerprint, unchanged by lines inserted above; helpUri; relative paths on a uriBaseId', async () => {
    const dir = tree({ 'ms/paper.md': `${WRONG}\n${WARNED}` });
    const before = JSON.parse((await cli(['ms', '-f', 'sarif'], { cwd: dir })).stdout);
    const fromJson = json((await cli(['ms', '-f', 'json'], { cwd: dir })).stdout).files[0]!.findings.map((f) => f.fingerprint);
    writeFileSync(join(dir, 'ms/paper.md'), `# Inserted heading\n\nSome new text.\n\n${WRONG}\n${WARNED}`);
    const after = JSON.parse((await cli(['ms', '-f', 'sarif'], { cwd: dir })).stdout);
    const prints = (log: { runs: Array<{ results: Array<{ partialFingerprints: Record<string, string> }> }> }) => log.runs[0]!.results.map((r) => r.partialFingerprints['plumbline/finding/v1']);
    expect(prints(before)).toEqual(fromJson);
    expect(prints(after)).toEqual(prints(before));
    const run = after.runs[0];
    expect(run.results[0].locations[0].physicalLocation.artifactLocation).toEqual({ uri: 'ms/paper.md', uriBaseId: 'SRCROOT' });
    expect(run.results[0].locations[0].physicalLocation.region.startLine).toBe(5);
    expect(run.originalUriBaseIds.SRCROOT.uri).toBe(`file://${dir}/`);
    for (const rule of run.tool.driver.rules) expect(rule.helpUri).toMatch(new RegExp(`^https://\\S+/rules/${rule.id}\\.md$`));
  });
});

describe('ignore patterns when walking folders', () => {
  it('rendered output (_site, _book) is not checked twice; .gitignore and the configuration\'s "ignore" are respected; a named file is always checked', async () => {
    const dir = tree({
      '.git/HEAD': 'ref: refs/heads/main\n',
      '.gitignore': 'build/\n*.tmp.md\n',
      '.plumbline.json': '{"ignore": ["drafts/", "notes-*.md"]}',
      'paper.md': WRONG,
      '_site/paper.md': WRONG,
      '_book/chapter.md': WRONG,
      'build/copy.md': WRONG,
      'scratch.tmp.md': WRONG,
      'drafts/old.md': WRONG,
      'notes-1.md': WRONG,
      'chapters/two.md': WARNED,
      'chapters/.gitignore': 'private.md\n',
      'chapters/private.md': WRONG,
    });
    const walked = json((await cli(['.', '-f', 'json'], { cwd: dir })).stdout).files.map((f) => f.path);
    expect(walked).toEqual(['chapters/two.md', 'paper.md']);
    const globbed = json((await cli(['**/*.md', '-f', 'json'], { cwd: dir })).stdout).files.map((f) => f.path);
    expect(globbed).toEqual(['chapters/two.md', 'paper.md']);
    const named = json((await cli(['drafts/old.md', '-f', 'json'], { cwd: dir })).stdout).files.map((f) => f.path);
    expect(named).toEqual(['drafts/old.md']);
  });

  it('the extensions walked: the default list, a configuration\'s "extensions" in its folder and below, --extensions over both; named files always read', async () => {
    const dir = tree({
      'paper.md': WRONG,
      'paper.tex': WRONG,
      'notes.txt': WRONG,
      'analysis.R': WRONG,
      'appendix/.plumbline.json': '{"extensions": ["TEX"]}',
      'appendix/extra.md': WRONG,
      'appendix/extra.tex': WRONG,
      'appendix/deeper/more.md': WRONG,
      'appendix/deeper/more.tex': WRONG,
    });
    const paths = async (args: string[]) => json((await cli(args, { cwd: dir })).stdout).files.map((f) => f.path);
    // the default list (MANUSCRIPT_EXTENSIONS), except below appendix/, where its configuration's list applies
    expect(await paths(['.', '-f', 'json'])).toEqual(['appendix/deeper/more.tex', 'appendix/extra.tex', 'notes.txt', 'paper.md', 'paper.tex']);
    // the command line over every configuration, with or without the dot, any case
    expect(await paths(['.', '-f', 'json', '--extensions', 'md,.R'])).toEqual(['analysis.R', 'appendix/deeper/more.md', 'appendix/extra.md', 'paper.md']);
    // a file named is read whatever its ending
    expect(await paths(['analysis.R', 'paper.md', '-f', 'json', '--extensions', 'tex'])).toEqual(['analysis.R', 'paper.md']);
    const bad = await cli(['.', '--extensions', 'md,*.tex'], { cwd: dir });
    expect(bad.code).toBe(2);
    expect(bad.stderr).toContain('--extensions takes file name endings separated by commas, such as md,tex,docx; got "md,*.tex"');
    // a configuration's list is checked by the schema like every key
    writeFileSync(join(dir, 'appendix/.plumbline.json'), '{"extensions": ["*.tex"]}');
    const refused = await cli(['appendix/extra.md', '-f', 'json'], { cwd: dir });
    expect(refused.code).toBe(2);
    expect(refused.stderr).toContain('extensions');
  });
});

describe('a package ready to publish', () => {
  const pkg = JSON.parse(readFileSync(join(root, 'package.json'), 'utf8')) as Record<string, unknown> & { exports: Record<string, unknown>; files: string[] };
  it('has a LICENSE matching package.json, and repository, homepage, bugs and keywords', () => {
    expect(pkg.license).toBe('MIT');
    expect(readFileSync(join(root, 'LICENSE'), 'utf8')).toMatch(/^MIT License/);
    expect(pkg.repository).toMatchObject({ type: 'git', url: expect.stringMatching(/^git\+https:\/\//) });
    expect(pkg.homepage).toMatch(/^https:\/\//);
    expect(pkg.bugs).toMatchObject({ url: expect.stringMatching(/^https:\/\//) });
    expect((pkg.keywords as string[]).length).toBeGreaterThan(3);
  });
  it('npm pack ships the offline page, the output-format docs, the schemas and the licence', () => {
    const r = spawnSync('npm', ['pack', '--dry-run', '--json', '--ignore-scripts'], { cwd: root, encoding: 'utf8' });
    expect(r.status, r.stderr).toBe(0);
    const files = (readReport(r.stdout) as Array<{ files: Array<{ path: string }> }>)[0]!.files.map((f) => f.path);
    for (const f of ['dist/web/index.html', 'docs/output-formats.md', 'schema/report.schema.json', 'schema/config.schema.json', 'schema/baseline.schema.json', 'schema/rules.schema.json', 'LICENSE', 'dist/src/index.d.ts', 'dist/bin/plumbline.js', 'dist/bin/worker.js'])
      expect(files).toContain(f);
    expect(files.filter((f) => f.startsWith('test/') || f.startsWith('src/'))).toEqual([]);
  }, 60_000);
  it('exports make the JSON schemas importable by package name', () => {
    const r = spawnSync(process.execPath, ['--input-type=module', '-e', "const s = await import('plumbline/schema/report.schema.json', { with: { type: 'json' } }); const b = await import('plumbline/schema/baseline.schema.json', { with: { type: 'json' } }); console.log(s.default.title + '|' + b.default.title)"], { cwd: root, encoding: 'utf8' });
    expect(r.stdout.trim()).toBe('plumbline JSON report|plumbline baseline');
  });
  it('the programmatic API runs the file-level runner (configuration, folders, baselines) and every formatter', async () => {
    const dir = tree({ '.plumbline.json': '{"rules": {"p-follows-from-t": "off"}}', 'ms/a.md': `${WRONG}\n${WARNED}` });
    const first = await checkFiles(['ms'], { cwd: dir });
    expect(first.report.files[0]!.findings.map((f) => f.ruleId)).toEqual(['significance-follows-from-t']);
    const baseline = { file: join(dir, 'b.json'), entries: [{ path: 'ms/a.md', rule: 'significance-follows-from-t', fingerprint: first.report.files[0]!.findings[0]!.fingerprint, text: '' }] };
    const second = await checkFiles(['ms'], { cwd: dir, baseline });
    expect(second.report.files[0]!.findings).toEqual([]);
    expect(readReport(formatJson(second.report)).summary.hiddenByBaseline).toBe(1);
    const api = await import('../../src/index.js');
    for (const name of ['formatHuman', 'formatLines', 'formatJson', 'formatSarif', 'formatChecklist', 'formatHtml', 'formatRulesJson']) expect(typeof (api as Record<string, unknown>)[name]).toBe('function');
  });
});

it.skipIf(isRoot)('an unreadable file is named on standard error (not as root, who reads everything)', async () => {
  const dir = tree({ 'a.md': RIGHT });
  chmodSync(join(dir, 'a.md'), 0o000);
  const out = await cli(['a.md'], { cwd: dir });
  expect(out.stderr).toContain('a.md: cannot read: permission denied');
  expect(existsSync(join(dir, 'a.md'))).toBe(true);
});

describe('what the run writes is never lost or misplaced', () => {
  it('--write-baseline never over a manuscript, nor over the --output file', async () => {
    const dir = tree({ 'paper.md': WRONG });
    const over = await cli(['paper.md', '--write-baseline', 'paper.md'], { cwd: dir });
    expect(over.code).toBe(2);
    expect(over.stderr).toContain('refusing to write over an input file: paper.md');
    expect(readFileSync(join(dir, 'paper.md'), 'utf8')).toBe(WRONG);
    const same = await cli(['paper.md', '-o', 'r.json', '--write-baseline', 'r.json'], { cwd: dir });
    expect(same.code).toBe(2);
    expect(same.stderr).toContain('--output and --write-baseline name the same file');
    expect(existsSync(join(dir, 'r.json'))).toBe(false);
  });

  it('a report over a file met in a walked folder is refused too (it could be a manuscript), with a way out', async () => {
    const dir = tree({ 'docs/paper.md': WRONG });
    expect((await cli(['docs', '-o', 'docs/report.md'], { cwd: dir })).code).toBe(1);
    const again = await cli(['docs', '-o', 'docs/report.md'], { cwd: dir });
    expect(again.code).toBe(2);
    expect(again.stderr).toContain('refusing to write over an input file: docs/report.md (write the report outside the files checked');
    expect((await cli(['docs', '-o', 'docs/report.html', '-f', 'html'], { cwd: dir })).code).toBe(1);
  });

  it('a run that stops before checking leaves an earlier report as it was; a replaced report keeps its permissions', async () => {
    const dir = tree({ 'paper.md': WRONG });
    await cli(['paper.md', '-f', 'json', '-o', 'rep.json'], { cwd: dir });
    chmodSync(join(dir, 'rep.json'), 0o600);
    const before = readFileSync(join(dir, 'rep.json'), 'utf8');
    expect((await cli(['paper.md', '-f', 'json', '-o', 'rep.json', '--baseline', 'missing.json'], { cwd: dir })).code).toBe(2);
    expect(readFileSync(join(dir, 'rep.json'), 'utf8')).toBe(before);
    expect((await cli(['paper.md', '-o', 'rep.json'], { cwd: dir })).code).toBe(1);
    expect(readFileSync(join(dir, 'rep.json'), 'utf8')).toContain('significance-follows-from-t');
    expect(statSync(join(dir, 'rep.json')).mode & 0o777).toBe(0o600);
  });

  it('a device that cannot take the report is said, exit 2 (not a stack trace, not "findings")', async () => {
    const dir = tree({ 'paper.md': WRONG });
    const out = await cli(['paper.md', '-o', '/dev/full'], { cwd: dir });
    expect(out.code).toBe(2);
    expect(out.stderr).toContain('cannot write /dev/full: no space left on the device');
  });

  it("-o /dev/fd/N writes a descriptor the shell handed over, and refuses plumbline's own", () => {
    const dir = tree({ 'paper.md': WRONG });
    const handed = spawnSync('bash', ['-c', `"${process.execPath}" "${main}" paper.md -f lines -o /dev/fd/9 9>nine.txt`], { cwd: dir, encoding: 'utf8' });
    expect(handed.status).toBe(1);
    expect(readFileSync(join(dir, 'nine.txt'), 'utf8')).toMatch(/^paper\.md:1:\d+: error /);
    for (const n of [3, 4, 5, 7, 12, 50]) {
      const own = spawnSync(process.execPath, [main, 'paper.md', '-o', `/dev/fd/${n}`], { cwd: dir, encoding: 'utf8' });
      expect(own.status, `fd ${n}: ${own.stderr}`).toBe(2);
      expect(own.stderr).toMatch(new RegExp(`cannot write /dev/fd/${n}: descriptor ${n} is (one of plumbline's own|not open)`));
    }
  });

  it('a baseline that is a FIFO is refused unread (it would block)', async () => {
    const dir = tree({ 'paper.md': WRONG });
    expect(spawnSync('mkfifo', [join(dir, 'bf')]).status).toBe(0);
    const read = await cli(['paper.md', '--baseline', 'bf'], { cwd: dir });
    expect([read.code, read.stderr]).toEqual([2, 'plumbline: baseline bf: not a regular file\n']);
    const written = await cli(['paper.md', '--write-baseline', 'bf'], { cwd: dir });
    expect(written.code).toBe(2);
    expect(written.stderr).toContain('cannot write the baseline bf: not a regular file');
  });
});

describe('options read as meant', () => {
  it('"-o -" writes to standard output and does not read standard input', async () => {
    const dir = tree({ 'paper.md': WRONG });
    const { PassThrough } = await import('node:stream');
    const never = new PassThrough(); // standard input that never ends
    const { run } = await import('../../src/cli/run.js');
    let stdout = '';
    const code = await run(['-o', '-', 'paper.md', '-f', 'lines'], { stdout: (s) => void (stdout += s), stderr: () => {}, stdin: never, cwd: dir, env: {}, isTTY: false });
    expect(code).toBe(1);
    expect(stdout).toMatch(/^paper\.md:1:/);
  });

  it.each([
    [['--no-output', 'paper.md'], 'unknown option --no-output'],
    [['--no-baseline', 'paper.md'], 'unknown option --no-baseline'],
    [['--max-warnings=', 'paper.md'], '--max-warnings must be a whole number, 0 or more; got ""'],
    [['--max-warnings', '0x1', 'paper.md'], '--max-warnings must be a whole number, 0 or more; got "0x1"'],
    [['--jobs', '1e1', 'paper.md'], '--jobs must be a whole number, 1 or more; got "1e1"'],
  ])('%j', async (args, message) => {
    const dir = tree({ 'paper.md': WRONG });
    const out = await cli(args, { cwd: dir });
    expect(out.code).toBe(2);
    expect(out.stderr).toContain(message);
    expect(existsSync(join(dir, 'false'))).toBe(false);
  });

  it('options that make no sense for batch are refused, not ignored', async () => {
    const out = await cli(['batch', '--baseline', 'b.json', '-q', '-f', 'sarif'], { stdin: 'paper.md\n' });
    expect(out.code).toBe(2);
    expect(out.stderr).toContain('--baseline, --quiet, --format do not apply to batch');
  });

  it('help wraps at very narrow widths too', async () => {
    const text = (await cli(['--help'], { columns: 12 })).stdout;
    for (const line of text.split('\n')) if (line.length > 12) expect(line.trim().split(/\s+/)).toHaveLength(1);
  });
});

describe('baselines over part of a manuscript set', () => {
  it('entries of files not checked this run are neither called stale nor dropped when the baseline is written again', async () => {
    const dir = tree({ 'q.md': WRONG, 'r.md': WARNED });
    await cli(['q.md', 'r.md', '--write-baseline', 'both.json'], { cwd: dir });
    const partial = await cli(['q.md', '--baseline', 'both.json'], { cwd: dir });
    expect(partial.code).toBe(0);
    expect(partial.stderr).not.toContain('matches no finding');
    await cli(['q.md', '--write-baseline', 'both.json'], { cwd: dir });
    expect(readBaseline(join(dir, 'both.json')).entries.map((e) => e.path)).toEqual(['q.md', 'r.md']);
  });

  it('a hand-written path such as "./q.md" matches', async () => {
    const dir = tree({ 'q.md': WRONG });
    await cli(['q.md', '--write-baseline', 'b.json'], { cwd: dir });
    const b = JSON.parse(readFileSync(join(dir, 'b.json'), 'utf8')) as { findings: Array<{ path: string }> };
    b.findings[0]!.path = './q.md';
    writeFileSync(join(dir, 'b.json'), JSON.stringify(b));
    expect((await cli(['q.md', '--baseline', 'b.json'], { cwd: dir })).code).toBe(0);
  });
});

describe('configuration and ignore details', () => {
  it('a .gitignore outside a repository applies below the folder walked, not only to its direct children', async () => {
    const dir = tree({ '.gitignore': '*.draft.md\n', 'w.draft.md': WRONG, 'sub/z.draft.md': WRONG, 'sub/kept.md': WARNED });
    expect(json((await cli(['.', '-f', 'json'], { cwd: dir })).stdout).files.map((f) => f.path)).toEqual(['sub/kept.md']);
  });

  it("a JSON syntax error keeps V8's words; the place is data (SARIF region, not part of the URI)", async () => {
    const dir = tree({ 'a/.plumbline.json': '{"rules": {', 'a/p.md': RIGHT });
    const out = await cli(['a', '-f', 'sarif'], { cwd: dir });
    expect(out.stderr).toContain("plumbline: a/.plumbline.json:1:12: configuration: invalid JSON: Expected property name or '}'");
    const note = readReport(out.stdout).runs[0].invocations[0].toolExecutionNotifications[0];
    expect(note.locations[0].physicalLocation).toEqual({ artifactLocation: { uri: 'a/.plumbline.json', uriBaseId: 'SRCROOT' }, region: { startLine: 1, startColumn: 12 } });
  });

  it('the summary counts the manuscripts a bad configuration kept from being checked; a human report in a file names them', async () => {
    const dir = tree({ 'n/.plumbline.json': '{"alpah": 1}', 'n/a.md': RIGHT, 'n/b.md': RIGHT, 'n/c/d.md': RIGHT, 'ok.md': RIGHT });
    const out = await cli(['.', '-f', 'json'], { cwd: dir });
    expect(readReport(out.stdout).summary.failures).toBe(3);
    await cli(['.', '-o', 'report.txt'], { cwd: dir });
    const text = readFileSync(join(dir, 'report.txt'), 'utf8');
    expect(text).toContain('not checked n/.plumbline.json: configuration: unknown key "alpah"');
    expect(text).toContain('3 files not checked');
  });
});

describe('checklist entries in the line-by-line formats', () => {
  const paper = `# Results\n\n${WRONG}\n${WARNED}`;
  it('lines: a missing document item has no line and column; per-result entries keep theirs', async () => {
    const dir = tree({ 'paper.md': paper });
    const lines = (await cli(['paper.md', '--checklist', '-f', 'lines'], { cwd: dir })).stdout.trimEnd().split('\n');
    expect(lines).toContain(lines.find((l) => l.startsWith('paper.md: note software-is-named ')));
    for (const l of lines) expect(l).toMatch(/^paper\.md(:\d+:\d+)?: (error|warning|note) [a-z-]+ /);
  });
  it('html: checklist entries are summarised in the checklist table, not one card each; no card says "line 1" for the whole document', async () => {
    const dir = tree({ 'paper.md': paper });
    const html = (await cli(['paper.md', '--checklist', '-f', 'html'], { cwd: dir })).stdout;
    const plain = (await cli(['paper.md', '-f', 'html'], { cwd: dir })).stdout;
    const cards = (s: string) => (s.match(/<details class="card /g) ?? []).length;
    expect(cards(html)).toBe(cards(plain));
    expect(html).toMatch(/checklist entr(y|ies), summarised in the checklist below/);
    expect(html).not.toMatch(/software-is-named <a class="where"[^>]*>line 1,/);
  });
  it('human: the summary says how many findings are checklist entries', async () => {
    const dir = tree({ 'paper.md': paper });
    expect((await cli(['paper.md', '--checklist'], { cwd: dir })).stdout).toMatch(/\d+ notes \(\d+ of the findings are checklist entries, summarised by item\)/);
  });
});
