import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { checkSource } from '../../src/engine/index.js';
import { correctResult, isPRule, wrongP } from './results.js';

/**
 * Properties over Markdown built from a grammar (fast-check): front matter, headings, nested
 * lists and block quotes, tables, emphasis, links, inline and display math, raw HTML, comments
 * and code, with one generated result spliced into a prose slot somewhere in it (results.ts says
 * what "correct" is measured against); the grammar follows CommonMark and GFM (common practice,
 * no source).
 * fast-check prints the seed and the shrunk document on failure.
 */
const RUNS = Number(process.env.PLUMBLINE_PROPERTY_RUNS ?? 10_000);

// Prose without digits or words that name a test, a tail or an alpha, so the only statistic
// in a document is the spliced one.
const word = fc.constantFrom('fatigue', 'ward', 'scores', 'rose', 'fell', 'in', 'the', 'weeks', 'after', 'session', 'and', 'nurses', 'é', 'naïve', '😀', 'co-op', '(see', 'below)', '—', '«quote»');
const inlineToken = fc.oneof(
  { weight: 16, arbitrary: word },
  { weight: 1, arbitrary: word.map((w) => `*${w}*`) },
  { weight: 1, arbitrary: word.map((w) => `**${w}**`) },
  { weight: 1, arbitrary: word.map((w) => `_${w}_`) },
  { weight: 1, arbitrary: word.map((w) => `~~${w}~~`) },
  { weight: 1, arbitrary: word.map((w) => `\`${w}\``) },
  { weight: 1, arbitrary: fc.constantFrom('$x^2$', '$\\bar{x}$', '$\\mu$') },
  { weight: 1, arbitrary: word.map((w) => `[${w}](https://example.org/${w})`) },
  { weight: 1, arbitrary: fc.constantFrom('<span>ward</span>', '<sup>a</sup>', '<br>', '<!-- a remark -->', '&amp;', '&nbsp;', '\\*', 'www.example.org', '[^n]') },
);
const line = fc.array(inlineToken, { minLength: 1, maxLength: 6 }).map((ts) => ts.join(' '));
// A sentence starts with a plain word: a line that starts with a comment or a lone tag is an
// HTML block in CommonMark, not prose.
const sentence = fc.tuple(word, fc.array(inlineToken, { maxLength: 6 })).map(([w, ts]) => `${w[0]?.toUpperCase() ?? ''}${w.slice(1)}${ts.map((t) => ` ${t}`).join('')}.`);

/** A block tree; `slot` marks where the statistic goes (at most one per document, placed below). */
type Block =
  | { kind: 'para'; text: string; slot: boolean }
  | { kind: 'heading'; level: number; text: string; slot: boolean }
  | { kind: 'list'; ordered: boolean; items: Block[][] }
  | { kind: 'quote'; body: Block[] }
  | { kind: 'table'; header: string[]; rows: string[][]; slotRow: number; slotCol: number }
  | { kind: 'fence'; body: string }
  | { kind: 'math'; body: string }
  | { kind: 'html'; body: string }
  | { kind: 'comment'; body: string }
  | { kind: 'rule' };

const leaf: fc.Arbitrary<Block> = fc.oneof(
  { weight: 6, arbitrary: fc.array(sentence, { minLength: 1, maxLength: 2 }).map((s) => ({ kind: 'para' as const, text: s.join(' '), slot: false })) },
  { weight: 1, arbitrary: fc.record({ level: fc.integer({ min: 1, max: 4 }), text: line }).map(({ level, text }) => ({ kind: 'heading' as const, level, text, slot: false })) },
  { weight: 1, arbitrary: fc.record({ header: fc.array(word, { minLength: 1, maxLength: 3 }), rows: fc.array(fc.array(line, { minLength: 1, maxLength: 3 }), { minLength: 1, maxLength: 3 }) }).map(({ header, rows }) => ({ kind: 'table' as const, header, rows, slotRow: -1, slotCol: -1 })) },
  { weight: 1, arbitrary: line.map((body) => ({ kind: 'fence' as const, body })) },
  { weight: 1, arbitrary: fc.constantFrom('\\bar{x} = \\frac{1}{n}\\sum x_i', 'a^2 + b^2').map((body) => ({ kind: 'math' as const, body })) },
  { weight: 1, arbitrary: line.map((body) => ({ kind: 'html' as const, body })) },
  { weight: 1, arbitrary: line.map((body) => ({ kind: 'comment' as const, body })) },
  { weight: 1, arbitrary: fc.constant({ kind: 'rule' as const }) },
);
const { block } = fc.letrec<{ block: Block; blocks: Block[] }>((tie) => ({
  block: fc.oneof(
    { depthSize: 'small', withCrossShrink: true },
    { weight: 6, arbitrary: leaf },
    { weight: 1, arbitrary: fc.record({ ordered: fc.boolean(), items: fc.array(tie('blocks'), { minLength: 1, maxLength: 2 }) }).map(({ ordered, items }) => ({ kind: 'list' as const, ordered, items })) },
    { weight: 1, arbitrary: tie('blocks').map((body) => ({ kind: 'quote' as const, body })) },
  ),
  blocks: fc.array(tie('block'), { minLength: 1, maxLength: 2 }),
}));
const frontMatter = fc.constantFrom('', '', '---\ntitle: Ward study\nkeywords: [fatigue, nurses]\n---\n\n', '---\ntitle: [unclosed\n---\n\n', '---\n: : :\n---\n\n');
// Documents average about 220 characters (at most some 1,300): small, so 10,000 cases stay within CI time.
const documentBlocks = fc.array(block, { minLength: 1, maxLength: 4 });

/** Every prose slot of a document (paragraphs, headings, table cells, at any depth). */
function slots(blocks: Block[]): Array<() => void> {
  const out: Array<() => void> = [];
  for (const b of blocks) {
    if (b.kind === 'para' || b.kind === 'heading') out.push(() => { b.slot = true; });
    else if (b.kind === 'list') for (const item of b.items) out.push(...slots(item));
    else if (b.kind === 'quote') out.push(...slots(b.body));
    else if (b.kind === 'table') {
      b.rows.forEach((row, r) => row.forEach((_, c) => out.push(() => { b.slotRow = r; b.slotCol = c; })));
    }
  }
  return out;
}

function render(blocks: Block[], stat: string): string {
  return blocks.map((b) => renderBlock(b, stat)).join('\n\n');
}

function renderBlock(b: Block, stat: string): string {
  switch (b.kind) {
    case 'para':
      return b.slot ? `${b.text} Scores rose, ${stat}, in the ward.` : b.text;
    case 'heading':
      return `${'#'.repeat(b.level)} ${b.slot ? `Scores rose, ${stat}` : b.text}`;
    case 'list':
      return b.items
        .map((item, i) => {
          const marker = b.ordered ? `${i + 1}. ` : '- ';
          const pad = ' '.repeat(marker.length);
          // a rule opening an item is written `***`: `- ---` (and `- - ---`) is itself a thematic break
          const body = render(item, stat).replace(/^---/, '***');
          return marker + body.replace(/\n/g, `\n${pad}`).replace(new RegExp(`\\n${pad}(?=\\n)`, 'g'), '\n');
        })
        .join('\n\n');
    case 'quote':
      return `> ${render(b.body, stat).replace(/\n/g, '\n> ')}`;
    case 'table': {
      const cell = (r: number, c: number, text: string) => (r === b.slotRow && c === b.slotCol ? stat : text);
      return [
        `| ${b.header.join(' | ')} |`,
        `|${b.header.map(() => '---').join('|')}|`,
        ...b.rows.map((row, r) => `| ${row.map((text, c) => cell(r, c, text)).join(' | ')} |`),
      ].join('\n');
    }
    case 'fence':
      return `\`\`\`\n${b.body}\n\`\`\``;
    case 'math':
      return `$$\n${b.body}\n$$`;
    case 'html':
      return `<div class="note">\n${b.body}\n</div>`;
    case 'comment':
      return `<!-- ${b.body} -->`;
    case 'rule':
      return '---';
  }
}

const statistic = fc.tuple(correctResult, fc.constantFrom('plain', 'italic', 'math')).map(([c, style]) => ({ ...c, style }));
const shown = (s: { df: number; t: string; style: string }, p: string) =>
  s.style === 'italic' ? `*t*(${s.df}) = ${s.t}, *p* ${p}` : s.style === 'math' ? `$t(${s.df}) = ${s.t}, p ${p}$` : `t(${s.df}) = ${s.t}, p ${p}`;

/** A generated document with the statistic in one of its prose slots (picked by `pick`). */
const withSlot = fc.record({ front: frontMatter, blocks: documentBlocks, pick: fc.nat(), tail: sentence });
function build(d: { front: string; blocks: Block[]; pick: number; tail: string }, stat: string): string {
  const blocks = structuredClone(d.blocks);
  const places = slots(blocks);
  if (places.length > 0) places[d.pick % places.length]!();
  const body = render(blocks, stat);
  // no slot in the tree: the statistic goes into a closing paragraph
  return `${d.front}${body}${places.length === 0 ? `\n\n${d.tail} Scores rose, ${stat}, in the ward.` : ''}\n`;
}

const pRules = (ids: string[]) => ids.filter(isPRule);

describe('properties of generated Markdown with a spliced result', () => {
  it('never throws; every span is in the document; the spliced correct result is found at its characters and never flagged; CRLF and a BOM change no finding', () => {
    fc.assert(
      fc.property(withSlot, statistic, (d, s) => {
        const stat = shown(s, s.printed.slice(2)); // '< .001' or '= .021'
        const doc = build(d, stat);
        const r = checkSource('g.md', doc);
        for (const x of [...r.results, ...r.findings]) {
          expect(x.span.start).toBeGreaterThanOrEqual(0);
          expect(x.span.end).toBeLessThanOrEqual(doc.length);
          expect(x.span.end).toBeGreaterThanOrEqual(x.span.start);
        }
        expect(r.results).toHaveLength(1);
        const res = r.results[0]!;
        const at = doc.indexOf(stat);
        const core = s.style === 'math' ? stat.slice(1, -1) : stat.slice(s.style === 'italic' ? 1 : 0);
        expect(doc.slice(res.span.start, res.span.end)).toBe(core);
        expect(res.span.start).toBe(at + stat.indexOf(core));
        expect(pRules(r.findings.map((f) => f.ruleId))).toEqual([]);
        const shape = (text: string) => checkSource('g.md', text).findings.map((f) => [f.ruleId, f.messageId, f.start.line, f.start.column, f.end.line, f.end.column, f.message]);
        const base = r.findings.map((f) => [f.ruleId, f.messageId, f.start.line, f.start.column, f.end.line, f.end.column, f.message]);
        expect(shape(doc.replace(/\n/g, '\r\n'))).toEqual(base);
        expect(shape(`\uFEFF${doc}`)).toEqual(base);
      }),
      { numRuns: RUNS },
    );
  }, 600_000);

  it('a spliced wrong p (outside every reading) is always flagged, wherever it sits', () => {
    fc.assert(
      fc.property(withSlot, statistic.filter((s) => s.p > 0.002 && s.p < 0.9), (d, s) => {
        const doc = build(d, shown(s, `= ${wrongP(s.p)}`));
        const r = checkSource('g.md', doc);
        expect(r.results).toHaveLength(1);
        expect(pRules(r.findings.map((f) => f.ruleId)).length).toBeGreaterThan(0);
      }),
      { numRuns: RUNS },
    );
  }, 600_000);
});

