import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join, relative, resolve } from 'node:path';
import { describe, expect, it } from 'vitest';

/**
 * The pipeline's import arrows point one way (DEVELOPERS.md): each layer may import only the
 * layers listed for it. A rule never parses (no unified/remark), never imports another rule;
 * a formatter never imports the statistics.
 */
const ALLOWED: Record<string, string[]> = {
  'src/stats': [],
  'src/parse': [],
  'src/extract': ['src/parse'],
  'src/link': ['src/parse', 'src/extract'],
  'src/rule-api': ['src/parse', 'src/extract', 'src/link', 'src/stats'],
  rules: ['src/rule-api', 'src/stats'],
  // configuration files share the YAML limits of front matter (src/parse/frontMatter.ts)
  'src/config': ['src/parse', 'src/rule-api', 'schema'],
  schema: [],
  'src/engine': ['src/parse', 'src/extract', 'src/link', 'src/stats', 'src/rule-api', 'rules', 'src/config'],
  // the corpus summary of batch output: counting only, on the JSON lines batch wrote
  'src/corpus': [],
  'src/report': ['src/engine', 'src/rule-api', 'src/parse', 'src/corpus'],
  'src/cli': ['src/engine', 'src/report', 'src/config', 'src/corpus', 'src/fix', 'src/lsp'],
  // safe fixes: applied to the source by offsets the findings carry
  'src/fix': ['src/engine', 'src/rule-api'],
  // the language server: the engine on worker threads, the command line's configuration discovery and budgets
  'src/lsp': ['src/engine', 'src/config', 'src/cli', 'src/fix'],
  // the browser page: the same core as the command line, nothing that needs Node
  'src/web': ['src/engine', 'src/report'],
};
const FORBIDDEN_PACKAGES: Record<string, RegExp> = {
  rules: /^(unified|remark-|micromark|mdast)/,
  'src/report': /^(jstat|@stdlib\/)/,
  'src/stats': /^(unified|remark-|yargs)/,
  'src/web': /^(node:|yargs|cli-progress|tinyglobby)/,
};

const root = resolve(import.meta.dirname, '..');
function tsFiles(dir: string): string[] {
  return readdirSync(join(root, dir)).flatMap((name) => {
    const path = join(dir, name);
    if (statSync(join(root, path)).isDirectory()) return tsFiles(path);
    return name.endsWith('.ts') ? [path] : [];
  });
}
const layerOf = (path: string) => Object.keys(ALLOWED).find((l) => path === l || path.startsWith(`${l}/`));

const files = ['src', 'rules'].flatMap(tsFiles).filter((f) => layerOf(f) !== undefined);

describe('import arrows', () => {
  it('every source file belongs to a layer', () => {
    const loose = ['src', 'rules'].flatMap(tsFiles).filter((f) => layerOf(f) === undefined && f !== 'src/index.ts');
    expect(loose).toEqual([]);
  });
  it.each(files)('%s', (file) => {
    const layer = layerOf(file) as string;
    const text = readFileSync(join(root, file), 'utf8');
    for (const m of text.matchAll(/^\s*(?:import|export)\b[^'"]*?from\s+['"]([^'"]+)['"]/gm)) {
      const spec = m[1] as string;
      if (spec.startsWith('.')) {
        const target = relative(root, resolve(join(root, file, '..'), spec));
        const targetLayer = layerOf(target);
        if (targetLayer === layer) {
          if (layer === 'rules') expect.fail(`${file} imports another rule (${spec})`);
          continue;
        }
        expect(ALLOWED[layer], `${file} imports ${target}`).toContain(targetLayer);
      } else {
        const forbidden = FORBIDDEN_PACKAGES[layer];
        if (forbidden) expect(spec, `${file} imports ${spec}`).not.toMatch(forbidden);
      }
    }
  });
  it('the check can fail: a rule importing the parser would be caught', () => {
    expect(ALLOWED.rules).not.toContain('src/parse');
    expect('unified').toMatch(FORBIDDEN_PACKAGES.rules as RegExp);
  });
});
