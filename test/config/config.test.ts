import { mkdirSync, mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { ConfigError, ConfigFinder, parseConfigText, SCHEMA_RULE_IDS } from '../../src/config/index.js';
import { CONFIG_YAML_LIMITS, duplicateJsonKey } from '../../src/config/load.js';
import { YAML_LIMITS } from '../../src/parse/frontMatter.js';
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

// issue 18: a configuration may come from a stranger. JSON.parse keeps the last of two equal keys
// (ECMA-262, JSON.parse; RFC 8259 §4 says names SHOULD be unique); YAML 1.2 requires unique keys.
describe('duplicate keys and oversized YAML', () => {
  function problem(text: string, file: string): ConfigError {
    try {
      parseConfigText(text, file, RULE_IDS);
    } catch (e) {
      if (e instanceof ConfigError) return e;
      throw e;
    }
    throw new Error('no error');
  }
  it('a JSON key given twice in one object is refused with the key, its line and column', () => {
    const e = problem('{\n  "alpha": 0.05,\n  "rules": {},\n  "alpha": 0.01\n}', 'c.json');
    expect(e.message).toBe('duplicate key "alpha" (JSON keeps only the last; write it once)');
    expect([e.line, e.column]).toEqual([4, 3]);
    // nested, and written with an escape: the same key as JSON.parse reads it
    expect(problem('{"rules": {"p-follows-from-t": "off", "p-follows-from-\\u0074": "error"}}', 'c.json').message).toContain('"p-follows-from-t"');
    // the YAML reader refuses the same
    expect(problem('alpha: 0.05\nalpha: 0.01\n', 'c.yaml').message).toMatch(/invalid YAML: Map keys must be unique/);
  });
  it('equal keys in different objects, in arrays, or inside strings are not duplicates', () => {
    expect(duplicateJsonKey('{"a": {"a": 1}, "b": [{"a": 1}, {"a": 2}], "c": "\\"a\\": \\"a\\""}')).toBeUndefined();
    expect(duplicateJsonKey('[{"x": 1, "y": ["x", "x"]}, {"x": 2}]')).toBeUndefined();
    expect(duplicateJsonKey('{"a": 1, "b": {"c": [1, {"d": 2}], "c2": 3}, "b": 4}')).toEqual({ key: 'b', line: 1, column: 46 });
    expect(parseConfigText('{"alpha": 0.05, "rules": {"p-follows-from-t": "off"}}', 'c.json', RULE_IDS)).toEqual({ alpha: 0.05, rules: { 'p-follows-from-t': 'off' } });
  });
  it('a key shown in a message has its control characters escaped and is cut short', () => {
    const e = problem(`{"\\u001b[31m${'k'.repeat(200)}": 1, "\\u001b[31m${'k'.repeat(200)}": 2}`, 'c.json');
    expect(e.message).not.toContain('\u001b');
    expect(e.message).toContain('\\u001b[31m');
    expect(e.message.length).toBeLessThan(160);
  });
  it('YAML with very many keys or characters is refused before the YAML library sees it, fast', () => {
    // 100,000 keys took the yaml library minutes (each key compared with every earlier one)
    const many = Array.from({ length: 100_000 }, (_, i) => `key${i}: ${i}`).join('\n');
    const start = performance.now();
    const e = problem(many, 'c.yaml');
    expect(performance.now() - start).toBeLessThan(2000);
    expect(e.message).toMatch(/^YAML not read: \d+ characters is over the limit of 262144$/);
    // under the size limit, but a flow mapping of 3,000 keys
    const flow = `rules: {${Array.from({ length: 3000 }, (_, i) => `k${i}: 1`).join(', ')}}\n`;
    expect(problem(flow, 'c.yaml').message).toBe('YAML not read: 3001 lines and commas is over the limit of 2000 (very many keys make the YAML reader slow)');
    // a configuration of ordinary size passes the limits (and is then judged by the schema)
    expect(parseConfigText(`alpha: 0.05\n${'# a comment, with commas, kept\n'.repeat(100)}`, 'c.yaml', RULE_IDS)).toEqual({ alpha: 0.05 });
  });
  it('configuration and front matter share the same YAML limits', () => {
    expect(CONFIG_YAML_LIMITS).toEqual(YAML_LIMITS);
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
