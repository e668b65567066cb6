// Builds the browser page: one self-contained dist/web/index.html with the bundled checker
// inline, its script allowed by hash and every network load forbidden by its
// Content-Security-Policy. The configuration validator is generated ahead of time (Ajv
// standalone code), since the page may not compile code at run time.
import { createHash } from 'node:crypto';
import { mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { build } from 'esbuild';
import { precompiledSchema, writeStandaloneValidator } from './standalone-validator.mjs';

const root = resolve(dirname(fileURLToPath(import.meta.url)), '..');
const out = join(root, 'dist/web');
mkdirSync(out, { recursive: true });

const validator = writeStandaloneValidator(root, join(out, 'schema-validator.generated.mjs'));

const result = await build({
  entryPoints: [join(root, 'src/web/main.ts')],
  bundle: true,
  format: 'iife',
  platform: 'browser',
  target: 'es2022',
  minify: true,
  write: false,
  legalComments: 'none',
  plugins: [precompiledSchema(validator)],
});
const script = result.outputFiles[0].text.replace(/<\/script/gi, '<\\/script');
const hash = createHash('sha256').update(script).digest('base64');
const css = readFileSync(join(root, 'src/web/page.css'), 'utf8');
const reportCss = (await import(join(root, 'dist/src/report/html.js'))).REPORT_CSS;
const template = readFileSync(join(root, 'src/web/page.html'), 'utf8');
const html = template
  .replace('{{csp}}', `default-src 'none'; script-src 'sha256-${hash}'; style-src 'unsafe-inline'; img-src data:; base-uri 'none'; form-action 'none'`)
  .replace('{{style}}', () => `${reportCss}\n${css}`)
  .replace('{{script}}', () => script);
writeFileSync(join(out, 'index.html'), html);
console.log(`dist/web/index.html: ${(html.length / 1024).toFixed(0)} KB`);
