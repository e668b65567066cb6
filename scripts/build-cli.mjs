// Builds the command line as a bundle (dist/bin/): `plumbline.js` (the `bin` of package.json)
// and `worker.js` (the pool's worker thread), with the code they share and each module loaded
// on demand (formatters, the progress bar, the rest of the run after --version and --help) in
// chunks beside them. One file read and compiled costs far less at start-up than the hundreds of
// small modules the compiled sources import, and the configuration schema's validator is
// generated ahead of time instead of compiled by Ajv on every run. The library
// (dist/src/index.js) is tsc's output and does not use this.
import { chmodSync, rmSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { build } from 'esbuild';
import { precompiledSchema, writeStandaloneValidator } from './standalone-validator.mjs';

const root = resolve(dirname(fileURLToPath(import.meta.url)), '..');
const out = join(root, 'dist/bin');
rmSync(out, { recursive: true, force: true });
const validator = writeStandaloneValidator(root, join(root, 'dist/generated/schema-validator.mjs'));

const result = await build({
  // the worker sits beside the chunk that starts it: src/cli/pool.ts finds it as ./worker.js
  entryPoints: { plumbline: join(root, 'src/cli/main.ts'), worker: join(root, 'src/cli/worker.ts') },
  outdir: out,
  chunkNames: 'chunk-[hash]',
  bundle: true,
  splitting: true,
  format: 'esm',
  platform: 'node',
  target: 'node20',
  minify: true,
  sourcemap: 'linked',
  metafile: true,
  logLevel: 'warning',
  // CommonJS dependencies (Ajv's runtime, jstat, @stdlib, cli-progress) call require for Node's modules
  banner: { js: "import { createRequire as plumblineCreateRequire } from 'node:module'; const require = plumblineCreateRequire(import.meta.url);" },
  plugins: [precompiledSchema(validator)],
});
chmodSync(join(out, 'plumbline.js'), 0o755);
const sizes = Object.entries(result.metafile.outputs)
  .filter(([file]) => file.endsWith('.js'))
  .map(([file, o]) => `${file.replace(/^.*dist\/bin\//, '')} ${(o.bytes / 1024).toFixed(0)} KB`);
console.log(`dist/bin: ${sizes.join(', ')}`);
