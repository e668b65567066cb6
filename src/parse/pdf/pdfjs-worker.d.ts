// pdf.js ships no types for its worker module; it is only handed back to pdf.js as `globalThis.pdfjsWorker`.
declare module 'pdfjs-dist/legacy/build/pdf.worker.mjs' {
  export const WorkerMessageHandler: unknown;
}
