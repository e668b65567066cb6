/**
 * pdf.js's two modules, imported on demand. A module of its own because the command line's
 * start-up bundle (dist/bin/run.cjs, scripts/build-cli.mjs) leaves pdf.js out and loads this
 * module as an ES module beside it instead: a text check never reads pdf.js's 1.5 MB.
 */
export async function importPdfJs(): Promise<{ worker: unknown; pdfjs: typeof import('pdfjs-dist/legacy/build/pdf.mjs') }> {
  const worker: unknown = await import('pdfjs-dist/legacy/build/pdf.worker.mjs');
  const pdfjs = await import('pdfjs-dist/legacy/build/pdf.mjs');
  return { worker, pdfjs };
}
