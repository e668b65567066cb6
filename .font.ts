import { readFileSync } from 'node:fs';
import { loadPdfJs } from './src/parse/pdf/read.ts';
const pdfjs = await loadPdfJs();
const d = await pdfjs.getDocument({ data: new Uint8Array(readFileSync(process.argv[2]!)), verbosity: 0, isEvalSupported: false, disableFontFace: true, useSystemFonts: false }).promise;
const p = await d.getPage(4);
const tc = await p.getTextContent();
const names = new Set(tc.items.map((i: any) => i.fontName));
console.log([...names].map((n) => [n, JSON.stringify(tc.styles[n as string]), p.commonObjs.has(n as string)]));
for (const it of tc.items as any[]) if (/t\(44\)/.test(it.str)) { const i = tc.items.indexOf(it); console.log(tc.items.slice(i, i + 6).map((x: any) => [x.str, x.fontName])); break; }
