import { unified } from 'unified'; import remarkParse from 'remark-parse'; import remarkGfm from 'remark-gfm';
const p = unified().use(remarkParse).use(remarkGfm);
const prose = 'Participants in the trial walked between the two wings of the building each morning. ';
const size = 200_000;
const mk = (unit: string, T: number) => { let s=''; while (s.length < size) s += unit.repeat(T) + '\n\n'; return s; };
const t = (s: string) => { const t0 = performance.now(); p.parse(s); return (performance.now()-t0) / (s.length/1e6); };
console.log('prose ms/MB', t(mk(prose, 10)).toFixed(0));
for (const T of [16, 32, 64, 128, 256, 512]) console.log(T, 'alt', t(mk('*a', T)).toFixed(0), 'under', t(mk('_a', T)).toFixed(0), 'nest', t(mk('*', T)+'x').toFixed(0), 'br', t(mk('[a', T)).toFixed(0), 'img', t(mk('![', T) ).toFixed(0), 'imgc', t(('!['.repeat(T)+'x'+'](u)'.repeat(T)+'\n\n').repeat(Math.ceil(size/(T*6)))).toFixed(0));
