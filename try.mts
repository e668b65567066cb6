import { readFileSync, readdirSync } from 'node:fs';
import { parseDocument } from './src/parse/index.js';
import { extract } from './src/extract/index.js';
import { LineIndex } from './src/parse/lines.js';
const dir = process.argv[2];
const key = JSON.parse(readFileSync(dir + '/answer_key.json', 'utf8'));
const byLine = new Map<string, any[]>();
for (const f of readdirSync(dir).filter((f) => f.endsWith('.md'))) {
  const src = readFileSync(dir + '/' + f, 'utf8');
  const doc = parseDocument(f, src); const li = new LineIndex(src);
  const ex = extract(doc);
  for (const t of ex.tests) { const k = f + ':' + li.position(t.span.start).line; (byLine.get(k) ?? byLine.set(k, []).get(k))!.push(t); }
}
for (const [id, v] of Object.entries<any>(key)) {
  const got = byLine.get(v.file + ':' + v.line) ?? [];
  const r = v.reported;
  const show = got.map((t) => `[${t.tOp}${t.t.printed} df=${t.df?.printed ?? '-'} p=${t.p ? t.p.op + (t.p.number?.printed ?? 'ns') : '-'}${t.statedSidedness ? ' ' + t.statedSidedness.value : ''}]`).join(' ');
  const ok = got.some((t) => String(t.t.value) === String(Number(String(r.t).replace('−','-'))) || Math.abs(t.t.value) === Math.abs(Number(String(r.t).replace('−','-'))));
  console.log(ok ? 'OK ' : 'MISS', id, v.label, JSON.stringify(r), show);
}
