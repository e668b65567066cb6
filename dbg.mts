import { parseDocument } from './src/parse/index.js';
import { extract } from './src/extract/index.js';
const texts = [
  'Helmet wearers scored higher (M = 40.40, SD = 18.18) than cap wearers (M = 31.06, SD = 13.29), t(78) = 2.63, p = .01, d = 0.59.',
  'the first group (*n* = 4, *M* = 4.00, *SD* = 2.45) and the second group (*n* = 3, *M* = 6.00, *SD* = 2.45), t(6) = -2.31, p = .060, 95% CI [-8.24, 0.24], d = -1.63.',
  'accuracy was greater (59.1% ± 9.1% (s.d.); two-tailed one-sample t-test: t(149) = 12.2, P < 0.001, d = 1.00) than chance (50%).',
  'selected option A 33.88% of the time (SD = 31%), while those in the framed condition selected it 47.90% of the time (SD = 33%). t(82) = 2.00, p = .049.',
  'Fatigue was 41.2 ± 3.1 before and 38.0 ± 2.9 after (mean ± SEM, N = 1,024).',
  'Scores, mean (SD): standing 4.1 (1.2), seated 5.0 (1.3); 12 (40%) reported pain.',
  '| Group | Mean | SD | n |\n|---|---|---|---|\n| Standing | 41.2 | 9.8 | 24 |\n| Seated | 45.0 | 10.1 | 24 |',
  '| Group | M (SD) |\n|---|---|\n| A | 4.1 (1.2) |\n| B | 5.0 (1.3) |',
];
for (const t of texts) {
  const e = extract(parseDocument('x.md', t + '\n'));
  console.log('---', t.slice(0, 60));
  for (const s of e.summaries) console.log('  G', JSON.stringify(s.label), s.mean?.printed, s.spread?.number.printed, s.spread?.kind, s.n?.printed, s.percent ? '%' : '');
  for (const s of e.sampleSizes) console.log('  N', s.n.printed, s.scope);
  for (const s of e.intervals) console.log('  CI', s.level, s.low.printed, s.high.printed);
  for (const s of e.effectSizes) console.log('  ES', s.kind, s.value.printed);
  for (const s of e.designs) console.log('  D', s.design, s.printed);
  for (const s of e.references) console.log('  R', s.value.printed);
  for (const s of e.counts) console.log('  C', s.count.printed, s.percent.printed);
}
