import { check } from 'recheck';
const NUM = String.raw`([-+]?(?:\d{1,3}(?:,\d{3}){1,3}|\d{1,12})(?:\.\d{1,12})?|[-+]?\.\d{1,12})`;
const PM = String.raw`${NUM}( ?%)? ?± ?${NUM}( ?%)?(?: ?\(? ?(SD|SE|SEM|s\.d\.|s\.e\.m\.|s\.e\.|standard deviations?|standard errors?)\)?)?`;
const d = await check(PM, 'gu', { timeout: 20000 });
console.log(d.status, JSON.stringify(d).slice(0, 600));
const re = new RegExp(PM, 'gu');
for (const n of [1e4, 2e4, 4e4]) { const s = '0000000000'.repeat(n/10); const t0 = performance.now(); re.lastIndex = 0; re.exec(s); console.log(n, (performance.now()-t0).toFixed(1)); }
const NUM2 = String.raw`(?<![\d.])` + NUM;
const d2 = await check(String.raw`${NUM2}( ?%)? ?± ?${NUM}( ?%)?`, 'gu', { timeout: 20000 }); console.log('lookbehind', d2.status, JSON.stringify(d2).slice(0,300));
const IW = String.raw`(?<![\p{L}])(single[- ]item|number of [\p{L}]{2,30}|counts? of [\p{L}]{2,30}|integer[- ]valued|whole numbers|(\d{1,3})-item (?:scale|measure|questionnaire|inventory)|scored (?:from )?\d{1,3} (?:to|–|-) ?\d{1,3})(?![\p{L}])`;
for (const [name, src, fl] of [['iw', IW, 'giu'], ['iw no i', IW, 'gu'], ['iw letters', IW.replaceAll('[\\p{L}]{2,30}', '\\p{L}{2,30}'), 'giu'], ['iw plus', IW.replaceAll('[\\p{L}]{2,30}', '\\p{L}+'), 'giu']] as const) { const t0=Date.now(); const r = await check(src, fl, { timeout: 30000 }); console.log(name, r.status, Date.now()-t0, JSON.stringify(r).slice(0,200)); }
