import { readFileSync } from 'node:fs';
import { readPdfText } from './src/parse/pdf/read.ts';
const r = await readPdfText(readFileSync(process.argv[2]!));
const page = Number(process.argv[3]);
for (const b of r.blocks) { if (!b.pieces.some((p) => p.page === page)) continue; console.log(b.kind, b.table ? JSON.stringify(b.table) : '', b.pieces.map((p) => `[${p.line}] ${p.text}`).join(' ‖ ')); }
