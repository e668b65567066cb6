import { mkdirSync, mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { ConfigError, ConfigFinder, parseConfigText, SCHEMA_RULE_IDS } from '../../src/config/index.js';
import { RULE_IDS } from '../../src/engine/index.js';

describe('configuration schema', () => {
  it('names exactly the registered rules', () => {
    expect([...SCHEMA_RULE_IDS].sort()).toEqual([...RULE_IDS].sort());
  });
  it('accepts a full valid configuration', () => {
    expect(parseConfigText('{"alpha": 0.01, "sidedness": "one", "root": true, "rules": {"p-follows-from-t": "error"}}', 'c.json', RULE_IDS)).toEqual({
      alpha: 0.01,
      sidedness: 'one',
      root: true,
      rules: { 'p-follows-from-t': 'error' },
    });
  });
  const bad: Array<[string, string, string, RegExp]> = [
    ['alpha out of range', '{"alpha": 1.5}', 'c.json', /"alpha" must be < 1/],
    ['sidedness misspelt', 'sidedness: three\n', 'c.yaml', /"sidedness" must be one of: two, one/],
    ['rules not an object', '{"rules": 3}', 'c.json', /"rules" must be object/],
    ['a YAML custom tag is read as plain data (never run), so the value is rejected', 'alpha: !!js/function "x"\n', 'c.yaml', /"alpha" must be number/],
    ['YAML syntax error with its line', 'rules:\n  a: [b\n', 'c.yaml', /invalid YAML/],
  ];
  it.each(bad)('%s', (_name, text, file, message) => {
    let error: unknown;
    try {
      parseConfigText(text, file, RULE_IDS);
    } catch (e) {
      error = e;
    }
    expect(error).toBeInstanceOf(ConfigError);
    expect((error as ConfigError).message).toMatch(message);
  });
  it('gives the line and column of a YAML error', () => {
    try {
      parseConfigText('alpha: 0.05\nrules:\n  a: [b\n', 'c.yaml', RULE_IDS);
      expect.fail('no error');
    } catch (e) {
      expect((e as ConfigError).line).toBeGreaterThanOrEqual(3);
    }
  });
});

describe('finding configuration upward', () => {
  it('merges nearer files over farther ones and stops at root: true', () => {
    const dir = mkdtempSync(join(tmpdir(), 'plumbline-config-'));
    mkdirSync(join(dir, 'a/b/c'), { recursive: true });
    writeFileSync(join(dir, '.plumbline.json'), '{"alpha": 0.2}');
    writeFileSync(join(dir, 'a/.plumbline.yaml'), 'root: true\nalpha: 0.01\nrules:\n  p-follows-from-t: error\n');
    writeFileSync(join(dir, 'a/b/.plumbline.yml'), 'rules:\n  zero-p-is-a-bound: "off"\n');
    const found = new ConfigFinder(RULE_IDS).forFile(join(dir, 'a/b/c/paper.md'));
    expect(found.config).toEqual({ alpha: 0.01, rules: { 'p-follows-from-t': 'error', 'zero-p-is-a-bound': 'off' } });
    expect(found.files).toEqual([join(dir, 'a/.plumbline.yaml'), join(dir, 'a/b/.plumbline.yml')]);
  });
});
