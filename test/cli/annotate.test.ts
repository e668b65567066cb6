import { execFileSync } from 'node:child_process';
import { copyFileSync, existsSync, mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { strFromU8, unzipSync } from 'fflate';
import { describe, expect, it } from 'vitest';
import { cli } from './harness.js';

/**
 * --annotate on the invented Word fixtures (scripts/make-docx-fixtures.mjs). The copy must open
 * cleanly: LibreOffice (Debian's libreoffice-writer-nogui) converts it to OpenDocument, and the
 * comments must come through on exactly the flagged characters. Skipped when soffice is absent,
 * unless PLUMBLINE_REQUIRE_OFFICE=1 (.ci/run installs it and sets that).
 */
const SOFFICE = ['/usr/bin/soffice', '/usr/bin/libreoffice'].find((p) => existsSync(p));
const required = process.env.PLUMBLINE_REQUIRE_OFFICE === '1';
if (required && !SOFFICE) throw new Error('PLUMBLINE_REQUIRE_OFFICE=1 but soffice is missing');
const fixture = (name: string) => new URL(`../../fixtures/docx/${name}`, import.meta.url).pathname;

function workspace(...names: string[]): string {
  const dir = mkdtempSync(join(tmpdir(), 'plumbline-annotate-'));
  for (const n of names) copyFileSync(fixture(n), join(dir, n));
  return dir;
}

/** The annotations of an OpenDocument text's content.xml: the comment's text and the text it is anchored on. */
function annotations(contentXml: string): Array<{ comment: string; on: string }> {
  const out: Array<{ comment: string; on: string }> = [];
  const re = /<office:annotation\b[^>]*office:name="([^"]+)"[^>]*>([\s\S]*?)<\/office:annotation>([\s\S]*?)<office:annotation-end\b[^>]*office:name="\1"/g;
  for (let m = re.exec(contentXml); m; m = re.exec(contentXml)) {
    const plain = (s: string) => s.replace(/<[^>]+>/g, ' ').replace(/&quot;/g, '"').replace(/&apos;/g, "'").replace(/&lt;/g, '<').replace(/&gt;/g, '>').replace(/&amp;/g, '&').replace(/\s+/g, ' ').trim();
    out.push({ comment: plain(m[2] as string), on: plain(m[3] as string) });
  }
  return out;
}

describe('--annotate OUT.docx', () => {
  it('writes a copy with each finding as a Word comment on its characters; the original is unchanged', async () => {
    const dir = workspace('desk-plants.docx');
    const before = readFileSync(join(dir, 'desk-plants.docx'));
    const out = await cli(['desk-plants.docx', '--annotate', 'annotated.docx', '--format', 'lines'], { cwd: dir });
    expect(out.code).toBe(1);
    expect(out.stderr).toContain('wrote annotated.docx: desk-plants.docx with 3 findings as Word comments\n');
    expect(readFileSync(join(dir, 'desk-plants.docx')).equals(before)).toBe(true);
    const parts = unzipSync(readFileSync(join(dir, 'annotated.docx')));
    const document = strFromU8(parts['word/document.xml'] as Uint8Array);
    expect(document.match(/<w:commentRangeStart /g)?.length).toBe(3);
    expect(document.match(/<w:commentReference /g)?.length).toBe(3);
    // the footnote's finding sits on the note's reference mark in the body, and says where it is
    expect(strFromU8(parts['word/footnotes.xml'] as Uint8Array)).not.toContain('commentRange');
    const comments = strFromU8(parts['word/comments.xml'] as Uint8Array);
    expect(comments).toContain('plumbline error (significance-follows-from-t): Reported p = .45');
    expect(comments).toContain('What to check: Check t, df and p against the analysis output');
    expect(comments).toContain('In footnote 1, paragraph 1:');
    // every part of the original is still there
    expect(Object.keys(parts).sort()).toEqual(Object.keys(unzipSync(before)).sort());
  });

  it('creates the comments part, its content type and relationship when the file has none', async () => {
    const dir = workspace('features.docx');
    // features.docx has comments; a copy without them is made by dropping the part and its ties
    const parts = unzipSync(readFileSync(join(dir, 'features.docx')));
    delete parts['word/comments.xml'];
    const strip = (name: string, pattern: RegExp) => {
      parts[name] = new TextEncoder().encode(strFromU8(parts[name] as Uint8Array).replace(pattern, ''));
    };
    strip('word/_rels/document.xml.rels', /<Relationship Id="rId3"[^>]*\/>/);
    strip('[Content_Types].xml', /<Override PartName="\/word\/comments\.xml"[^>]*\/>/);
    strip('word/document.xml', /<w:commentRangeStart w:id="0"\/>|<w:commentRangeEnd w:id="0"\/>|<w:r><w:commentReference w:id="0"\/><\/w:r>/g);
    const { zipSync } = await import('fflate');
    writeFileSync(join(dir, 'plain.docx'), zipSync(parts));
    const out = await cli(['plain.docx', '--annotate', 'notes.docx'], { cwd: dir });
    expect(out.stderr).toContain('wrote notes.docx');
    const made = unzipSync(readFileSync(join(dir, 'notes.docx')));
    expect(strFromU8(made['[Content_Types].xml'] as Uint8Array)).toContain('<Override PartName="/word/comments.xml" ContentType="application/vnd.openxmlformats-officedocument.wordprocessingml.comments+xml"/>');
    expect(strFromU8(made['word/_rels/document.xml.rels'] as Uint8Array)).toContain('relationships/comments" Target="comments.xml"');
    expect(strFromU8(made['word/comments.xml'] as Uint8Array)).toContain('plumbline note (input-is-readable)');
  });

  it('refuses with more than one Word file, or none, and writes nothing', async () => {
    const dir = workspace('desk-plants.docx', 'features.docx');
    const two = await cli(['desk-plants.docx', 'features.docx', '--annotate', 'x.docx'], { cwd: dir });
    expect(two.code).toBe(2);
    expect(two.stderr).toContain('--annotate writes one annotated copy of one Word or PDF file, and 2 such files were checked');
    writeFileSync(join(dir, 'a.md'), 'Plain, t(28) = 2.10, p = .045.\n');
    const none = await cli(['a.md', '--annotate', 'x.docx'], { cwd: dir });
    expect(none.code).toBe(2);
    expect(none.stderr).toContain('no Word (.docx) or PDF file was checked');
    expect(existsSync(join(dir, 'x.docx'))).toBe(false);
  });

  it.skipIf(!SOFFICE)('opens cleanly in LibreOffice, with each comment on exactly the flagged characters', async () => {
    const dir = workspace('desk-plants.docx', 'features.docx');
    await cli(['desk-plants.docx', '--annotate', 'plants-annotated.docx'], { cwd: dir });
    await cli(['features.docx', '--annotate', 'features-annotated.docx'], { cwd: dir });
    execFileSync(SOFFICE as string, ['--headless', `-env:UserInstallation=file://${join(dir, 'profile')}`, '--convert-to', 'odt', '--outdir', join(dir, 'odt'), join(dir, 'plants-annotated.docx'), join(dir, 'features-annotated.docx')], { stdio: 'ignore', timeout: 180_000 });
    const content = (name: string) => strFromU8(unzipSync(readFileSync(join(dir, 'odt', name)))['content.xml'] as Uint8Array);
    const plants = annotations(content('plants-annotated.odt'));
    expect(plants.map((a) => a.on)).toEqual(['t(28) = 2.10, p = .45', '1.20 30 .024', '1 A check of the pots gave t(12) = 3.50, p = .40.']);
    expect(plants[2]?.comment).toContain('In footnote 1, paragraph 1: plumbline error (significance-follows-from-t): Reported p = .40');
    expect(plants[0]?.comment).toContain('plumbline error (significance-follows-from-t): Reported p = .45 (not significant at alpha 0.05)');
    expect(plants[0]?.comment).toContain('What to check:');
    const features = annotations(content('features-annotated.odt'));
    // the fixture's own comment is kept beside plumbline's
    expect(features.map((a) => a.on)).toEqual(['R', 'Two pots cracked.', '1 A check of the pots gave t(12) = 3.50, p = .40.']);
    expect(features[0]?.comment).toContain('plumbline note (input-is-readable): This Word file holds tracked changes');
  }, 240_000);
});
