/**
 * `npm run measure`: plumbline measured from outside its own code, on three sets.
 * 1. The invented manuscripts of scripts/generate_manuscripts.py (committed in
 *    fixtures/generated): recall per seeded error type, false alarms per house and report style.
 * 2. ../shared/realworld: 115 real reported t-tests with independent labels.
 * 3. ../shared/wholedocs: whole public manuscripts, every finding judged by hand (the set's own
 *    scorer prints precision and extraction recall).
 * 4. ../shared/documents: real .docx and .pdf files, their t-tests listed by hand: extraction at
 *    the right paragraph or page per file kind, and flags on consistent results (goal 0).
 * The two shared sets are third-party text, read from beside the project, never copied into it;
 * when they are absent, their part is skipped and said so.
 *
 *   npm run measure [-- --verbose]
 */
import { measureDocuments } from './measure-documents.js';
import { measureGenerated } from './measure-generated.js';
import { measureRealworld } from './measure-realworld.js';
import { measureWholedocs } from './measure-wholedocs.js';

const verbose = process.argv.includes('--verbose');
const section = (title: string, lines: string[]) => {
  console.log(`\n== ${title}\n`);
  console.log(lines.join('\n'));
};

const generated = measureGenerated(verbose);
section('Invented manuscripts (fixtures/generated)', generated.lines);
const realworld = measureRealworld(verbose);
section('Real reported t-tests (../shared/realworld)', realworld.lines);
const wholedocs = measureWholedocs(verbose);
section('Whole real manuscripts (../shared/wholedocs)', wholedocs.lines);
const documents = await measureDocuments(verbose);
section('Real Word and PDF files (../shared/documents)', documents.lines);

const recallMet = Object.values(generated.recallByType).every((r) => r.n === 0 || r.found / r.n >= 0.95);
const alarmsMet = Object.values(generated.falseAlarmsByHouseStyle).every((r) => r.correct === 0 || r.flagged / r.correct <= 0.005);
const statRecallMet = Object.values(generated.statisticRecallByType).every((r) => r.n === 0 || r.found / r.n >= 0.95);
const statAlarmsMet = Object.values(generated.statisticFalseAlarmsByKind).every((r) => r.correct === 0 || r.flagged / r.correct <= 0.005);
const consistent = realworld.byLabel.consistent;
const summary = [
  `invented manuscripts: recall >= 0.95 for every error type: ${recallMet ? 'met' : 'not met'}; false alarms <= 0.5% in every house style: ${alarmsMet ? 'met' : 'not met'}`,
  `invented F, χ², r and z results: recall >= 0.95 for every error type: ${statRecallMet ? 'met' : 'not met'}; false alarms <= 0.5% for every kind: ${statAlarmsMet ? 'met' : 'not met'}`,
  consistent ? `real reported t-tests: ${consistent.extracted} of ${consistent.n} consistent results extracted, ${consistent.flagged} flagged` : 'real reported t-tests: skipped',
  wholedocs.precision !== undefined
    ? `whole manuscripts: precision ${wholedocs.precision.toFixed(3)} over judged findings (goal >= 0.9), ${wholedocs.unjudged ?? 0} not in the key (judge them by hand); extraction recall ${wholedocs.recall?.toFixed(3)} (goal >= 0.9); true findings kept ${wholedocs.trueKept}; known false alarms still raised ${wholedocs.knownFalse}`
    : 'whole manuscripts: skipped',
  ...Object.entries(documents.byKind).map(([kind, v]) => {
    const all = Object.values(v).reduce((a, s) => ({ n: a.n + s.n, extracted: a.extracted + s.extracted }), { n: 0, extracted: 0 });
    const quiet = (v.consistent?.flagged ?? 0) + (v['not-checkable']?.flagged ?? 0);
    return `${kind} files: ${all.extracted} of ${all.n} expected t-tests extracted at their place (goal: all); ${quiet} consistent or not-checkable results flagged (goal 0)${v.inconsistent ? `; the inconsistent one ${v.inconsistent.flagged > 0 ? 'flagged' : 'not flagged'}` : ''}`;
  }),
];
section('Goals', summary);
