import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { pathToFileURL } from 'node:url';
import { afterAll, describe, expect, it } from 'vitest';
import { TinyClient, type Message } from './client.js';

/**
 * `plumbline lsp` end to end: the built command line (`npm test` builds it first) spawned as an
 * editor would, spoken to over standard input and output. Positions are in UTF-16 code units,
 * the protocol's default (LSP 3.17, "Position"); the line below starts with an emoji, two code
 * units, so an offset counted in code points or bytes would land elsewhere.
 */
const dir = mkdtempSync(join(tmpdir(), 'pl-lsp-'));
const text = '😀 Scores rose, t(23) = 5.90, p = .000.\n\nTyping improved, t(30) = 2.5, p = .018.\n';
writeFileSync(join(dir, 'm.md'), text);
writeFileSync(join(dir, '.plumbline.json'), JSON.stringify({ rules: { 'zero-p-is-a-bound': 'error' } }));
const uri = pathToFileURL(join(dir, 'm.md')).href;
// --stdio, as LSP clients that launch a server over standard input and output add it
const client = new TinyClient(process.execPath, [resolve('dist/src/cli/main.js'), 'lsp', '--stdio'], dir);
afterAll(() => {
  if (client.child.exitCode === null) client.child.kill();
});

interface Diagnostic {
  range: { start: { line: number; character: number }; end: { line: number; character: number } };
  severity: number;
  code: string;
  codeDescription: { href: string };
  message: string;
}
const diagnosticsOf = (m: Message) => (m.params as { diagnostics: Diagnostic[] }).diagnostics;
const published = (version: number) => (m: Message) => m.method === 'textDocument/publishDiagnostics' && (m.params as { uri: string; version?: number }).uri === uri && (m.params as { version?: number }).version === version;

describe('plumbline lsp', { timeout: 60_000 }, () => {
  it('initializes with incremental sync, hover, code actions and the explain command', async () => {
    const m = await client.request('initialize', {
      processId: process.pid,
      rootUri: pathToFileURL(dir).href,
      capabilities: { window: { showDocument: { support: true } }, workspace: { didChangeWatchedFiles: { dynamicRegistration: false } }, textDocument: { publishDiagnostics: { versionSupport: true } } },
    });
    const caps = (m.result as { capabilities: Record<string, unknown> }).capabilities;
    expect(caps.textDocumentSync).toMatchObject({ openClose: true, change: 2 });
    expect(caps.hoverProvider).toBe(true);
    expect(caps.executeCommandProvider).toEqual({ commands: ['plumbline.explainRule'] });
    client.notify('initialized', {});
  });

  it('publishes diagnostics on open: exact UTF-16 range, rule id as code, rule page, severity from the configuration beside the file', async () => {
    client.notify('textDocument/didOpen', { textDocument: { uri, languageId: 'markdown', version: 1, text } });
    const diags = diagnosticsOf(await client.waitFor(published(1)));
    const zero = diags.find((d) => d.code === 'zero-p-is-a-bound');
    const at = text.indexOf('p = .000'); // a JavaScript string index: UTF-16 code units
    expect(zero?.range).toEqual({ start: { line: 0, character: at }, end: { line: 0, character: at + 'p = .000'.length } });
    expect(zero?.severity).toBe(1); // error, as .plumbline.json says (1 = Error in LSP's DiagnosticSeverity)
    expect(zero?.codeDescription.href).toMatch(/rules\/zero-p-is-a-bound\.md$/);
    // t(30) = 2.5 with p = .018 is consistent (scipy.stats.t.sf: two-tailed .0181): nothing on line 2 but notes
    expect(diags.filter((d) => d.range.start.line === 2 && d.severity < 3)).toEqual([]);
  });

  it('re-reads the configuration when it changes: the rule turned off disappears', async () => {
    writeFileSync(join(dir, '.plumbline.json'), JSON.stringify({ rules: { 'zero-p-is-a-bound': 'off' } }));
    const since = client.received.length;
    client.notify('workspace/didChangeWatchedFiles', { changes: [{ uri: pathToFileURL(join(dir, '.plumbline.json')).href, type: 2 }] });
    const diags = diagnosticsOf(await client.waitFor(published(1), since));
    expect(diags.map((d) => d.code)).not.toContain('zero-p-is-a-bound');
    writeFileSync(join(dir, '.plumbline.json'), JSON.stringify({ rules: { 'zero-p-is-a-bound': 'warning' } }));
    const again = client.received.length;
    client.notify('workspace/didChangeWatchedFiles', { changes: [{ uri: pathToFileURL(join(dir, '.plumbline.json')).href, type: 2 }] });
    const back = diagnosticsOf(await client.waitFor(published(1), again));
    expect(back.find((d) => d.code === 'zero-p-is-a-bound')?.severity).toBe(2);
  });

  it('checks incremental edits once typing pauses, and never publishes an older version after a newer one', async () => {
    const since = client.received.length;
    // three keystrokes in a row: "2.5" → "2.50" → "2.501" → "2.5012" on line 2
    const col = text.split('\n')[2]?.indexOf('2.5') as number;
    for (const [version, added, offset] of [[2, '0', 3], [3, '1', 4], [4, '2', 5]] as const) {
      client.notify('textDocument/didChange', { textDocument: { uri, version }, contentChanges: [{ range: { start: { line: 2, character: col + offset }, end: { line: 2, character: col + offset } }, text: added }] });
    }
    await client.waitFor(published(4), since);
    const versions = client.received.slice(since).filter((m) => m.method === 'textDocument/publishDiagnostics').map((m) => (m.params as { version: number }).version);
    expect(versions.at(-1)).toBe(4);
    expect([...versions].sort((a, b) => a - b)).toEqual(versions);
  });

  it('hover on a result shows what was read and recomputed', async () => {
    const m = await client.request('textDocument/hover', { textDocument: { uri }, position: { line: 2, character: text.split('\n')[2]?.indexOf('t(30)') as number } });
    const value = (m.result as { contents: { value: string } }).contents.value;
    expect(value).toContain('t = 2.5012');
    expect(value).toContain('df = 30');
    expect(value).toContain('p = .018');
    expect(value).toMatch(/two-tailed p in \[0\.01\d+, 0\.01\d+\]/);
  });

  it('offers the safe fix, a quiet comment and the rule page for a finding', async () => {
    const at = text.indexOf('p = .000');
    const m = await client.request('textDocument/codeAction', { textDocument: { uri }, range: { start: { line: 0, character: at }, end: { line: 0, character: at } }, context: { diagnostics: [] } });
    const actions = m.result as Array<{ title: string; edit?: { documentChanges: Array<{ edits: Array<{ range: Diagnostic['range']; newText: string }> }> }; command?: { command: string; arguments: string[] } }>;
    const titles = actions.map((a) => a.title);
    expect(titles).toContain('Write p < .001');
    expect(titles).toContain('Add a quiet comment for zero-p-is-a-bound (then write its reason after the colon)');
    expect(titles).toContain('Explain the rule zero-p-is-a-bound');
    const fix = actions.find((a) => a.title === 'Write p < .001')?.edit?.documentChanges[0]?.edits ?? [];
    // applied from the end, as an editor applies a text edit list
    let line = text.split('\n')[0] as string;
    for (const e of [...fix].sort((a, b) => b.range.start.character - a.range.start.character)) line = line.slice(0, e.range.start.character) + e.newText + line.slice(e.range.end.character);
    expect(line).toBe('😀 Scores rose, t(23) = 5.90, p < .001.');
    const quiet = actions.find((a) => a.title.startsWith('Add a quiet comment'))?.edit?.documentChanges[0]?.edits[0];
    expect(quiet).toEqual({ range: { start: { line: 0, character: 0 }, end: { line: 0, character: 0 } }, newText: '<!-- plumbline quiet zero-p-is-a-bound: -->\n' });
    const explain = actions.find((a) => a.title.startsWith('Explain'))?.command;
    client.answers.set('window/showDocument', () => ({ success: true }));
    const since = client.received.length;
    const done = await client.request('workspace/executeCommand', { command: explain?.command, arguments: explain?.arguments });
    const shown = await client.waitFor((x) => x.method === 'window/showDocument', since);
    expect((shown.params as { uri: string }).uri).toMatch(/rules\/zero-p-is-a-bound\.md$/);
    expect(done.result).toBe((shown.params as { uri: string }).uri);
  });

  it('front matter applies as on the command line, and a second place is related information', async () => {
    const second = pathToFileURL(join(dir, 'second.md')).href;
    const body = '---\nplumbline:\n  alpha: 0.01\n---\n\n## Methods\n\nWe recruited 120 participants.\n\n## Results\n\nFatigue fell, t(94) = 2.47, p = .015. Alertness rose, t(94) = 1.12, p = .27.\n';
    client.notify('textDocument/didOpen', { textDocument: { uri: second, languageId: 'markdown', version: 7, text: body } });
    const m = await client.waitFor((x) => x.method === 'textDocument/publishDiagnostics' && (x.params as { uri: string }).uri === second);
    expect((m.params as { version: number }).version).toBe(7);
    const sample = diagnosticsOf(m).find((d) => d.code === 'sample-size-agrees-with-df') as Diagnostic & { relatedInformation?: Array<{ location: { uri: string; range: Diagnostic['range'] } }> };
    const line = body.split('\n').findIndex((l) => l.startsWith('Fatigue'));
    const col = (body.split('\n')[line] as string).indexOf('t(94) = 2.47');
    expect(sample.relatedInformation?.[0]?.location).toEqual({ uri: second, range: { start: { line, character: col }, end: { line, character: col + 't(94) = 2.47, p = .015'.length } } });
    const hover = await client.request('textDocument/hover', { textDocument: { uri: second }, position: { line, character: col + 2 } });
    expect((hover.result as { contents: { value: string } }).contents.value).toContain('alpha: 0.01 (front-matter)');
  });

  it('shuts down and exits with status 0', async () => {
    const m = await client.request('shutdown', null);
    expect(m.error).toBeUndefined();
    client.notify('exit', null);
    expect(await client.exited()).toBe(0);
  });
});
