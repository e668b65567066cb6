// The configuration schema's validator generated ahead of time with Ajv's standalone code, for
// the two bundles (the browser page and the command line): the page may not compile code at run
// time, and the command line should not spend its start-up compiling a schema that never changes.
// Both bundles put this file in place of src/config/schemaValidator.ts.
import { mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { Ajv2020 } from 'ajv/dist/2020.js';
import standaloneCode from 'ajv/dist/standalone/index.js';

/** Writes the validator module to `file` (an ES module exporting `validateSchema`) and returns `file`. */
export function writeStandaloneValidator(root, file) {
  const schema = JSON.parse(readFileSync(join(root, 'schema/config.schema.json'), 'utf8'));
  const ajv = new Ajv2020({ allErrors: true, strict: true, code: { source: true, esm: true } });
  const generate = standaloneCode.default ?? standaloneCode;
  mkdirSync(dirname(file), { recursive: true });
  writeFileSync(file, `${generate(ajv, ajv.compile(schema))}\nexport { validate as validateSchema };\n`);
  return file;
}

/** An esbuild plugin that resolves src/config/schemaValidator.js to the generated `file`. */
export function precompiledSchema(file) {
  return {
    name: 'precompiled-schema',
    setup(b) {
      b.onResolve({ filter: /schemaValidator\.js$/ }, () => ({ path: file }));
    },
  };
}
