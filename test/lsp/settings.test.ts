import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { pathToFileURL } from 'node:url';
import { afterAll, describe, expect, it } from 'vitest';
import { readClientSettings } from '../../src/lsp/server.js';
import { TinyClient, type Message } from './client.js';

/**
 * The editor's settings for the server: `initializationOptions`, then
 * `workspace/didChangeConfiguration` (LSP 3.17), applied like a configuration file and read again
 * when they change. End to end through the built command line, as test/lsp/server.test.ts does.
 */
const dir = mkdtempSync(join(tmpdir(), 'pl-lsp-settings-'));
const text = 'Scores rose, t(23) = 5.90, p = .000.\n';
writeFileSync(join(dir, 'm.md'), text);
// the file beside the manuscript turns the rule off; the settings say otherwise below
writeFileSync(join(dir, '.plumbline.json'), JSON.stringify({ rules: { 'zero-p-is-a-bound': 'off' } }));
writeFileSync(join(dir, 'elsewhere.json'), JSON.stringify({ rules: { 'zero-p-is-a-bound': 'warning' } }));
const uri = pathToFileURL(join(dir, 'm.md')).href;
const client = new TinyClient(process.execPath, [resolve('dist/src/cli/main.js'), 'lsp'], dir);
afterAll(() => {
  if (client.child.exitCode === null) client.child.kill();
});
const diagnostics = (m: Message) => (m.params as { diagnostics: Array<{ code?: string; severity: number; message: string }> }).diagnostics;
const forDoc = (m: Message) => m.method === 'textDocument/publishDiagnostics' && (m.params as { uri: string }).uri === uri;

describe('client settings', { timeout: 60_000 }, () => {
  it('initializationOptions: configuration keys over the configuration file beside the manuscript', async () => {
    await client.request('initialize', {
      processId: process.pid,
      rootUri: pathToFileURL(dir).href,
      capabilities: {},
      initializationOptions: { configuration: { rules: { 'zero-p-is-a-bound': 'error' } }, debounceMs: 0 },
    });
    client.notify('initialized', {});
    client.notify('textDocument/didOpen', { textDocument: { uri, languageId: 'markdown', version: 1, text } });
    const zero = diagnostics(await client.waitFor(forDoc)).find((d) => d.code === 'zero-p-is-a-bound');
    expect(zero?.severity).toBe(1); // Error
  });

  it('didChangeConfiguration: a configuration file named relative to the workspace replaces the one found beside it', async () => {
    const since = client.received.length;
    client.notify('workspace/didChangeConfiguration', { settings: { plumbline: { configFile: 'elsewhere.json' } } });
    const zero = diagnostics(await client.waitFor(forDoc, since)).find((d) => d.code === 'zero-p-is-a-bound');
    expect(zero?.severity).toBe(2); // Warning, as elsewhere.json says
  });

  it('settings with a problem: the document is not checked, and says why', async () => {
    const since = client.received.length;
    client.notify('workspace/didChangeConfiguration', { settings: { plumbline: { debounceMs: -5 } } });
    const diags = diagnostics(await client.waitFor(forDoc, since));
    expect(diags).toHaveLength(1);
    expect(diags[0]?.message).toMatch(/^Not checked: the editor's plumbline settings: "debounceMs" must be a whole number/);
  });

  it('settings cleared: back to the configuration file beside the manuscript (the rule off)', async () => {
    const since = client.received.length;
    client.notify('workspace/didChangeConfiguration', { settings: {} });
    const diags = diagnostics(await client.waitFor(forDoc, since));
    expect(diags.map((d) => d.code)).not.toContain('zero-p-is-a-bound');
    await client.request('shutdown', null);
    client.notify('exit', null);
  });
});

describe('readClientSettings', () => {
  it('reads the three settings, a relative file from the root', () => {
    expect(readClientSettings({ configFile: 'c.json', configuration: { alpha: 0.01 }, debounceMs: 50 }, '/w')).toEqual({ settings: { configFile: resolve('/w', 'c.json'), configuration: { alpha: 0.01 }, debounceMs: 50 }, problems: [] });
  });
  it('names each problem: unknown keys, a rule that does not exist, a relative file without a root', () => {
    const { problems } = readClientSettings({ colour: 'red', configuration: { rules: { 'no-such-rule': 'off' } }, configFile: 'c.json' }, undefined);
    expect(problems).toHaveLength(3);
    expect(problems[0]).toContain('unknown setting "colour"');
    expect(problems[1]).toContain('"configFile" c.json is relative');
    expect(problems[2]).toContain('no-such-rule');
  });
});
