// Builds the command line as a bundle (dist/bin/): `plumbline.js` (the `bin` of package.json)
// and `worker.js` (the pool's worker thread), with the code they share and each module loaded
// on demand (formatters, the progress bar, the rest of the run after --version and --help) in
// chunks beside them. One file read and compiled costs far less at start-up than the hundreds of
// small modules the compiled sources import, and the configuration schema's validator is
// generated ahead of time instead of compiled by Ajv on every run. The library
// (dist/src/index.js) is tsc's output and does not use this.
import { chmodSync, readFileSync, rmSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { build } from 'esbuild';
import { precompiledSchema, writeStandaloneValidator } from './standalone-validator.mjs';

const root = resolve(dirname(fileURLToPath(import.meta.url)), '..');
const out = join(root, 'dist/bin');
rmSync(out, { recursive: true, force: true });
const validator = writeStandaloneValidator(root, join(root, 'dist/generated/schema-validator.mjs'));

/**
 * Modules the start-up bundle (run.cjs, below) leaves out, each built as an ES module of its
 * own here, beside it: pdf.js and pdf-lib, which only a PDF needs and which are as large as all
 * the rest. In run.cjs each is a module of the same exports that imports the real one through
 * the wrapper's `__plumblineImport` (src/cli/load.ts), so each export must be a function that
 * returns a promise. They take and give plain data only, so their own copies of our modules
 * cannot meet the bundle's.
 */
const islands = [
  { entry: 'pdfjs', source: 'src/parse/pdf/pdfjs.ts', exports: ['importPdfJs'] },
  { entry: 'annotate-pdf', source: 'src/report/annotatePdf.ts', exports: ['annotatePdf'] },
];

/**
 * fdir (tinyglobby's folder walker) in its CommonJS build: its ES build looks picomatch up on
 * disk as it loads (createRequire), some four files read and compiled on every start-up for a
 * glob feature tinyglobby does not use, where the CommonJS build's require is bundled.
 */
const fdirCommonJs = {
  name: 'fdir-commonjs',
  setup(b) {
    b.onResolve({ filter: /^fdir$/ }, async (args) => {
      if (args.pluginData?.fdirCommonJs) return undefined;
      const r = await b.resolve('fdir', { kind: 'require-call', resolveDir: args.resolveDir, pluginData: { fdirCommonJs: true } });
      return r.errors.length > 0 ? undefined : { path: r.path };
    });
  },
};

/**
 * yargs' factory guesses the program's version as it makes each parser (`yargs.version()` in
 * yargs-factory.js): it walks up from the folder above node_modules — the current folder, when
 * the command runs from a checkout — listing each folder until one holds a package.json, and
 * reads that. parser() in src/cli/args.ts turns the version option off at once (the command
 * answers --version itself), so the guess is never used: it cost 6-8 ms of every run, and some
 * 14 ms from a folder of 5,000 manuscripts (Dec 5). The call is left out of the bundled factory;
 * the build stops if the factory does not hold it exactly once (another yargs), rather than
 * bundle an unknown text.
 */
const VERSION_GUESS = '        yargs.version();\n';
const yargsWithoutVersionGuess = {
  name: 'yargs-without-version-guess',
  setup(b) {
    // a build that bundles yargs from another file (a factory that moved) must stop too
    let patched = false;
    b.onStart(() => {
      patched = false;
    });
    b.onLoad({ filter: /[\\/]yargs[\\/]build[\\/]lib[\\/]yargs-factory\.js$/ }, (args) => {
      const text = readFileSync(args.path, 'utf8');
      const at = text.indexOf(VERSION_GUESS);
      if (at < 0 || text.indexOf(VERSION_GUESS, at + 1) >= 0) throw new Error(`build-cli: ${args.path} does not call yargs.version() once as expected; see yargsWithoutVersionGuess`);
      patched = true;
      return { contents: `${text.slice(0, at)}${text.slice(at + VERSION_GUESS.length)}`, loader: 'js' };
    });
    b.onEnd((result) => {
      if (!patched && result.errors.length === 0) throw new Error("build-cli: yargs' factory (yargs/build/lib/yargs-factory.js) was not bundled; see yargsWithoutVersionGuess");
    });
  },
};

const result = await build({
  // the worker sits beside the chunk that starts it: src/cli/pool.ts finds it as ./worker.js
  entryPoints: {
    plumbline: join(root, 'src/cli/main.ts'),
    worker: join(root, 'src/cli/worker.ts'),
    ...Object.fromEntries(islands.map((i) => [i.entry, join(root, i.source)])),
  },
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
  plugins: [precompiledSchema(validator), fdirCommonJs, yargsWithoutVersionGuess],
});
chmodSync(join(out, 'plumbline.js'), 0o755);
for (const island of islands) {
  const built = result.metafile.outputs[`dist/bin/${island.entry}.js`]?.exports ?? [];
  const missing = island.exports.filter((e) => !built.includes(e));
  if (missing.length > 0) throw new Error(`build-cli: ${island.source} does not export ${missing.join(', ')}`);
}

/**
 * The start-up bundle: run.ts and everything it loads, the islands aside, as one CommonJS
 * script that src/cli/load.ts compiles with a V8 code cache. Node 20 caches no compiled ES
 * module; a script compiled through vm.Script takes the bytecode of its last run of the same
 * kind, so a run parses and compiles next to nothing. Modules that run.ts imports on demand stay
 * behind esbuild's lazy module wrappers, so a formatter not asked for is never run nor compiled.
 */
const islandStub = (island) => ({
  contents: island.exports
    .map((name) => `export const ${name} = (...args) => __plumblineImport('./${island.entry}.js').then((m) => m.${name}(...args));`)
    .join('\n'),
  loader: 'js',
});
const startup = await build({
  entryPoints: { run: join(root, 'src/cli/run.ts') },
  outdir: out,
  outExtension: { '.js': '.cjs' },
  // src/cli/load.ts reads an ASCII bundle as Latin-1, the fastest way to a string
  charset: 'ascii',
  bundle: true,
  format: 'cjs',
  platform: 'node',
  target: 'node20',
  minify: true,
  sourcemap: 'linked',
  metafile: true,
  logLevel: 'warning',
  // the bundle's place, for the modules that find files beside themselves (the worker, the package's folder)
  define: { 'import.meta.url': 'plumblineBundleUrl' },
  banner: { js: "const plumblineBundleUrl = require('node:url').pathToFileURL(__filename).href;" },
  plugins: [
    precompiledSchema(validator),
    fdirCommonJs,
    yargsWithoutVersionGuess,
    {
      name: 'islands',
      setup(b) {
        const byPath = new Map(islands.map((i) => [join(root, i.source), i]));
        b.onLoad({ filter: /\.ts$/ }, (args) => {
          const island = byPath.get(args.path);
          return island ? islandStub(island) : undefined;
        });
      },
    },
  ],
});
// a script compiled by vm.Script cannot import(): everything it loads is in it or an island
const dynamic = Object.values(startup.metafile.outputs).flatMap((o) => o.imports ?? []).filter((i) => i.kind === 'dynamic-import' && i.external);
if (dynamic.length > 0) throw new Error(`build-cli: run.cjs would import() ${dynamic.map((i) => i.path).join(', ')}`);
const sizes = [...Object.entries(result.metafile.outputs), ...Object.entries(startup.metafile.outputs)]
  .filter(([file]) => file.endsWith('.js') || file.endsWith('.cjs'))
  .map(([file, o]) => `${file.replace(/^.*dist\/bin\//, '')} ${(o.bytes / 1024).toFixed(0)} KB`);
console.log(`dist/bin: ${sizes.join(', ')}`);
