import { mkdirSync, mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { pathToFileURL } from 'node:url';
import { afterAll, describe, expect, it } from 'vitest';
import { TinyClient, type Message } from './client.js';

/**
 * A LaTeX manuscript in the language server: checked as LaTeX, with hover and code actions, and
 * its \input and \include files followed within its folder as the command line follows them
 * (src/cli/includes.ts): each included file's diagnostics published under its own URI, a
 * refused include said at the command. Invented text.
 */
const dir = mkdtempSync(join(tmpdir(), 'pl-lsp-tex-'));
mkdirSync(join(dir, 'sections'));
const main = '\\documentclass{article}\n\\begin{document}\nScores rose, $t(23) = 5.90$, $p = .000$.\n\n\\input{sections/results}\n\\input{../outside}\n\\end{document}\n';
writeFileSync(join(dir, 'main.tex'), main);
writeFileSync(join(dir, 'sections', 'results.tex'), 'Recall fell, \\textit{t}(30) = 2.50, \\textit{p} = .000.\n');
const uri = pathToFileURL(join(dir, 'main.tex')).href;
const sectionUri = pathToFileURL(join(dir, 'sections', 'results.tex')).href;
const client = new TinyClient(process.execPath, [resolve('dist/src/cli/main.js'), 'lsp'], dir);
afterAll(() => {
  if (client.child.exitCode === null) client.child.kill();
});
type Diagnostic = { code?: string; message: string; range: { start: { line: number; character: number } } };
const diagnosticsFor = (target: string) => (m: Message) => m.method === 'textDocument/publishDiagnostics' && (m.params as { uri: string }).uri === target;
const diagnostics = (m: Message) => (m.params as { diagnostics: Diagnostic[] }).diagnostics;

describe('LaTeX in the language server', { timeout: 60_000 }, () => {
  it('checks an open .tex manuscript, and the file it \\input-s, and says which include it refused', async () => {
    await client.request('initialize', { processId: process.pid, rootUri: pathToFileURL(dir).href, capabilities: {} });
    client.notify('initialized', {});
    const since = client.received.length;
    client.notify('textDocument/didOpen', { textDocument: { uri, languageId: 'latex', version: 1, text: main } });
    const own = diagnostics(await client.waitFor(diagnosticsFor(uri), since));
    expect(own.find((d) => d.code === 'zero-p-is-a-bound')?.range.start).toEqual({ line: 2, character: main.split('\n')[2]?.indexOf('p = .000') as number });
    const refused = own.find((d) => d.code === 'input-is-readable');
    expect(refused?.message).toContain('\\input{../outside}');
    expect(refused?.range.start.line).toBe(5);
    const section = diagnostics(await client.waitFor(diagnosticsFor(sectionUri), since));
    expect(section.map((d) => d.code)).toContain('zero-p-is-a-bound');
  });

  it('hover on the result and a quiet comment as a % line', async () => {
    const line = main.split('\n')[2] as string;
    const hover = await client.request('textDocument/hover', { textDocument: { uri }, position: { line: 2, character: line.indexOf('t(23)') + 1 } });
    expect((hover.result as { contents: { value: string } }).contents.value).toContain('23');
    const at = line.indexOf('p = .000');
    const m = await client.request('textDocument/codeAction', { textDocument: { uri }, range: { start: { line: 2, character: at }, end: { line: 2, character: at } }, context: { diagnostics: [] } });
    const texts = (m.result as Array<{ title: string; edit?: { documentChanges: Array<{ edits: Array<{ newText: string }> }> } }>).flatMap((a) => a.edit?.documentChanges.flatMap((c) => c.edits.map((e) => e.newText)) ?? []);
    expect(texts).toContain('% plumbline quiet zero-p-is-a-bound:\n');
  });

  it('closing the manuscript clears the included file\'s diagnostics', async () => {
    const since = client.received.length;
    client.notify('textDocument/didClose', { textDocument: { uri } });
    expect(diagnostics(await client.waitFor(diagnosticsFor(sectionUri), since))).toEqual([]);
    await client.request('shutdown', null);
    client.notify('exit', null);
  });
});
