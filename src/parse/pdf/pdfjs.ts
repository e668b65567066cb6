/**
 * pdf.js's two modules, imported on demand. A module of its own because the command line's
 * start-up bundle (dist/bin/run.cjs, scripts/build-cli.mjs) leaves pdf.js out and loads this
 * module as an ES module beside it instead: a text check never reads pdf.js's 1.5 MB.
 *
 * pdf.js's legacy build (the one that runs on Node 20) carries polyfills that replace built-in
 * methods for the whole process, not only for pdf.js: `Array.prototype.push` becomes a script
 * some three times slower than V8's, `JSON.parse` a wrapper around it, and
 * `Function.prototype.toString` is patched so that both still print as native code. Every check
 * after the first PDF would run on them. So the built-ins' methods are noted before the import
 * and any that the import replaced is put back (`keepBuiltIns`); what the polyfills add (methods
 * Node 20 lacks, such as `Promise.withResolvers`) stays, as pdf.js needs it.
 */
export async function importPdfJs(): Promise<{ worker: unknown; pdfjs: typeof import('pdfjs-dist/legacy/build/pdf.mjs') }> {
  return keepBuiltIns(async () => {
    const worker: unknown = await import('pdfjs-dist/legacy/build/pdf.worker.mjs');
    const pdfjs = await import('pdfjs-dist/legacy/build/pdf.mjs');
    return { worker, pdfjs };
  });
}

/** The built-in objects whose methods an import must leave as they were: the global object, each constructor and namespace on it, and their prototypes. */
function builtIns(): object[] {
  const seen = new Set<object>([globalThis]);
  const typedArray = Object.getPrototypeOf(Uint8Array) as object;
  for (const o of [Array, Object, Function, String, Number, Boolean, Symbol, BigInt, Promise, Map, Set, WeakMap, WeakSet, RegExp, Date, Error, ArrayBuffer, DataView, typedArray, Uint8Array, Int32Array, Float64Array, JSON, Math, Reflect]) {
    seen.add(o);
    const proto = (o as { prototype?: unknown }).prototype;
    // Function.prototype is itself a function
    if ((typeof proto === 'object' || typeof proto === 'function') && proto !== null) seen.add(proto);
  }
  return [...seen];
}

/**
 * Runs `load` and then puts back every method of the built-ins (`builtIns`) that it replaced:
 * each own property whose value was a function and now is another. Properties it added, and
 * accessors (Node's lazily created globals, which become plain values when first read), are
 * left alone.
 */
export async function keepBuiltIns<T>(load: () => Promise<T>): Promise<T> {
  const before = builtIns().map((o) => {
    const methods = new Map<PropertyKey, PropertyDescriptor>();
    for (const key of Reflect.ownKeys(o)) {
      const d = Object.getOwnPropertyDescriptor(o, key);
      if (d !== undefined && typeof d.value === 'function') methods.set(key, d);
    }
    return { o, methods };
  });
  try {
    return await load();
  } finally {
    for (const { o, methods } of before) {
      for (const [key, d] of methods) {
        const now = Object.getOwnPropertyDescriptor(o, key);
        if (now?.value !== d.value && (now === undefined || now.configurable === true)) Object.defineProperty(o, key, d);
      }
    }
  }
}
