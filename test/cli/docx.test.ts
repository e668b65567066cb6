import { copyFileSync, mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { Ajv2020 } from 'ajv/dist/2020.js';
import AjvDraft04Module from 'ajv-draft-04';
import { describe, expect, it } from 'vitest';
import { cli } from './harness.js';
import { readReport } from '../helpers.js';

// fixtures/docx/features.docx is invented (scripts/make-docx-fixtures.mjs). Its footnote's
// t(12) = 3.50, p = .40 cannot hold: scipy.stats.t.sf(3.50, 12) * 2 = 0.0044.
const FEATURES = new URL('../../fixtures/docx/features.docx', import.meta.url).pathname;
const AjvDraft04 = AjvDraft04Module.default;

function folder(): string {
  const dir = mkdtempSync(join(tmpdir(), 'plumbline-docx-'));
  copyFileSync(FEATURES, join(dir, 'plants.docx'));
  // an encrypted Word file: an OLE compound file holding EncryptionInfo (MS-OFFCRYPTO 2.3.4)
  const name = [...'EncryptionInfo'].flatMap((c) => [c.charCodeAt(0), 0]);
  writeFileSync(join(dir, 'locked.docx'), new Uint8Array([0xd0, 0xcf, 0x11, 0xe0, 0xa1, 0xb1, 0x1a, 0xe1, ...new Array(504).fill(0), ...name]));
  // Word's owner file of an open document: not a manuscript
  writeFileSync(join(dir, '~$plants.docx'), 'owner');
  writeFileSync(join(dir, 'notes.md'), 'Soil was dry, t(28) = 2.10, p = .045.\n');
  return dir;
}

describe('Word files on the command line', () => {
  it('a folder walk reads .docx, names the encrypted one as not checked (exit 2) and checks the others', async () => {
    const out = await cli(['--format', 'json', '.'], { cwd: folder() });
    expect(out.code).toBe(2);
    const report = readReport(out.stdout) as { files: Array<{ path: string; format: string; original?: unknown; findings: Array<{ level: string; ruleId: string; original?: unknown }> }>; failures: Array<{ path: string; message: string }> };
    expect(report.files.map((f) => [f.path, f.format])).toEqual([['notes.md', 'markdown'], ['plants.docx', 'docx']]);
    expect(report.failures).toEqual([{ path: 'locked.docx', message: expect.stringMatching(/^encrypted: this Word file is protected by a password/) }]);
    expect(out.stderr).toContain('locked.docx: encrypted');
    const plants = report.files[1];
    expect(plants?.original).toMatchObject({ kind: 'docx', trackedChanges: true });
    expect(plants?.findings.filter((f) => f.level === 'error').map((f) => [f.ruleId, f.original])).toEqual([
      ['significance-follows-from-t', { kind: 'paragraph', paragraph: 1, char: 27, opening: 'A check of the pots gave …', note: { kind: 'footnote', number: 1 } }],
    ]);
    const validate = new Ajv2020({ allErrors: true, strict: false }).compile(JSON.parse(readFileSync('schema/report.schema.json', 'utf8')));
    expect(validate(JSON.parse(out.stdout)), JSON.stringify(validate.errors?.slice(0, 3))).toBe(true);
  });

  it('human and lines name the paragraph, its opening words and the character', async () => {
    const dir = folder();
    const human = await cli(['plants.docx'], { cwd: dir });
    expect(human.stdout).toContain('footnote 1 ¶1 (“A check of the pots gave …”) char 27');
    expect(human.stdout).toContain('tracked changes');
    const lines = await cli(['--format', 'lines', 'plants.docx'], { cwd: dir });
    expect(lines.stdout).toContain('plants.docx footnote 1 ¶1 (“A check of the pots gave …”) char 27: error significance-follows-from-t');
  });

  it('SARIF gives a logical location for a Word place, no line of the binary file, and stays schema-valid', async () => {
    const out = await cli(['--format', 'sarif', 'plants.docx'], { cwd: folder() });
    const log = readReport(out.stdout) as { runs: Array<{ results: Array<{ ruleId: string; locations: Array<{ physicalLocation: { region?: unknown }; logicalLocations?: Array<{ name: string }> }> }> }> };
    const result = log.runs[0]?.results.find((r) => r.ruleId === 'significance-follows-from-t');
    expect(result?.locations[0]?.physicalLocation.region).toBeUndefined();
    expect(result?.locations[0]?.logicalLocations?.[0]?.name).toBe('footnote 1 ¶1');
    const validate = new AjvDraft04({ allErrors: true, strict: false, validateFormats: false, unicodeRegExp: false }).compile(JSON.parse(readFileSync('test/fixtures/standards/sarif-2.1.0-rtm.5.json', 'utf8')));
    expect(validate(log), JSON.stringify(validate.errors?.slice(0, 3))).toBe(true);
  });

  it('standard input named .docx is read as Word', async () => {
    const out = await cli(['-', '--stdin-name', 'paper.docx', '--format', 'json'], { stdin: readFileSync(FEATURES) });
    const report = readReport(out.stdout) as { files: Array<{ format: string; results: unknown[] }> };
    expect(report.files.map((f) => [f.format, f.results.length])).toEqual([['docx', 8]]);
  });
});

describe('Word files in the HTML report', () => {
  it('labels the lines of extracted text by the paragraphs they start, and names each finding\'s paragraph', async () => {
    const out = await cli(['--format', 'html', 'plants.docx'], { cwd: folder() });
    expect(out.stdout).toContain('<div class="manuscript places">');
    // paragraph 2 of the body, and the footnote's first paragraph (fixtures/docx/features.docx)
    expect(out.stdout).toContain('<span class="ln">¶2</span><span class="tx">Bench height was read from a field');
    expect(out.stdout).toContain('<span class="ln">fn 1 ¶1</span>');
    expect(out.stdout).toContain('footnote 1 ¶1 (“A check of the pots gave …”) char 27');
  });
});
