import { MappedText } from './builder.js';

/** A piece of replacement text and the part of the match (relative indices) it stands for. */
interface Piece {
  text: string;
  from: number;
  to: number;
}

interface Rewrite {
  /** Global, sticky-free pattern; must use the `d` flag when `replace` reads group indices. */
  pattern: RegExp;
  replace: (m: RegExpExecArray) => Piece[];
}

const whole = (text: string) => (m: RegExpExecArray): Piece[] => [{ text, from: 0, to: m[0].length }];

/** Keep capture group 1, character for character, with its own source map. */
const keepGroup1 = (m: RegExpExecArray): Piece[] => {
  const g = m.indices?.[1];
  const value = m[1] ?? '';
  if (!g) return [{ text: value, from: 0, to: m[0].length }];
  const rel = g[0] - m.index;
  return [...value].map((ch, i) => ({ text: ch, from: rel + i, to: rel + i + 1 }));
};

const SUPERSCRIPT: Record<string, string> = {
  '⁰': '0', '¹': '1', '²': '2', '³': '3', '⁴': '4', '⁵': '5', '⁶': '6', '⁷': '7', '⁸': '8', '⁹': '9',
  '⁻': '-', '⁺': '+',
};

/**
 * Invisible characters that can sit inside a statistic and hide it or split its number:
 * direction marks (U+200E, U+200F, Arabic letter mark U+061C), bidi embeddings, overrides and
 * isolates (U+202A–202E, U+2066–2069), a byte-order mark inside the text (U+FEFF) and variation
 * selectors (U+FE00–FE0F, and U+E0100–E01EF as surrogate pairs). They carry no text of their own.
 */
export const INVISIBLE = /[\u200E\u200F\u061C\u202A-\u202E\u2066-\u2069\uFEFF\uFE00-\uFE0F]|\uDB40[\uDD00-\uDDEF]/g;

/**
 * Combining marks where they cannot be part of a letter's spelling: after a digit, punctuation or
 * a space (`2.1\u03010`). A mark on a letter stays, even a lone one: x̄ is a mean and p̂ an
 * estimate, not x and p.
 */
export const LOOSE_MARKS = /(?<=[\x20-\x40\x5B-\x60\x7B-\x7E])[\u0300-\u036F\u1AB0-\u1AFF\u1DC0-\u1DFF\u20D0-\u20FF\uFE20-\uFE2F]{1,16}/g;

/**
 * Spelling variants folded before extraction, in order. Each keeps the source map: a
 * replacement character maps to the whole source run it replaces, a kept character to
 * its own source character. Every pattern is linear (no nested quantifiers).
 */
const REWRITES: Rewrite[] = [
  { pattern: /[\u200B-\u200D\u2060\u00AD]/g, replace: () => [] },
  { pattern: INVISIBLE, replace: () => [] },
  { pattern: LOOSE_MARKS, replace: () => [] },
  // a thin, narrow no-break or no-break space between digit groups is a thousands separator
  // ("2 391", "n = 1 204", SI and journal style): the number is read whole
  { pattern: /(?<=(?<![0-9.,])[0-9]{1,3})[\u00A0\u2009\u202F](?=[0-9]{3}(?![0-9]))/g, replace: () => [] },
  { pattern: /[\u00A0\u2000-\u200A\u202F\u205F\u3000\t]/g, replace: whole(' ') },
  { pattern: /\r\n?|\n/g, replace: whole(' ') },
  { pattern: /\\(?:textit|emph|textbf|textsl|mathit|mathrm|mathbf|mathnormal|textrm|text|mbox)\{([^{}\n]{0,80})\}/dg, replace: keepGroup1 },
  { pattern: /\\textless(?:\{\})?|\\lt(?![A-Za-z])/g, replace: whole('<') },
  { pattern: /\\textgreater(?:\{\})?|\\gt(?![A-Za-z])/g, replace: whole('>') },
  { pattern: /\\leq?(?![A-Za-z])|\\leqslant/g, replace: whole('≤') },
  { pattern: /\\geq?(?![A-Za-z])|\\geqslant/g, replace: whole('≥') },
  { pattern: /\\times(?![A-Za-z])/g, replace: whole('×') },
  { pattern: /\\cdot(?![A-Za-z])/g, replace: whole('·') },
  { pattern: /\\pm(?![A-Za-z])/g, replace: whole('±') },
  { pattern: /\\%/g, replace: whole('%') },
  { pattern: /\{\[\}/g, replace: whole('[') },
  { pattern: /\{\]\}/g, replace: whole(']') },
  { pattern: /\\[,;:! ]/g, replace: whole(' ') },
  { pattern: /&lt;/g, replace: whole('<') },
  { pattern: /&gt;/g, replace: whole('>') },
  { pattern: /&le;/g, replace: whole('≤') },
  { pattern: /&ge;/g, replace: whole('≥') },
  { pattern: /&minus;/g, replace: whole('-') },
  { pattern: /&times;/g, replace: whole('×') },
  { pattern: /&nbsp;/g, replace: whole(' ') },
  { pattern: /&amp;/g, replace: whole('&') },
  { pattern: /\^\{ ?([-+\u2212]? ?[0-9]{1,4}) ?\}/dg, replace: (m) => [{ text: '^', from: 0, to: 1 }, ...keepGroup1(m)] },
  {
    pattern: /[⁻⁺]?[⁰¹²³⁴⁵⁶⁷⁸⁹]{1,4}/g,
    replace: (m) => [{ text: '^', from: 0, to: 1 }, ...[...m[0]].map((ch, i) => ({ text: SUPERSCRIPT[ch] ?? ch, from: i, to: i + 1 }))],
  },
  { pattern: /[\u2212\u2012\uFE63\uFF0D]/g, replace: whole('-') },
  { pattern: /(?<=[=(\[,:] ?)[\u2013\u2014](?= ?[.0-9])/g, replace: whole('-') },
  { pattern: /(?<=[0-9])[\u00B7\u2219](?=[0-9])/g, replace: whole('.') },
  { pattern: /[\uFF1D]/g, replace: whole('=') },
  { pattern: /[\uFF1C]/g, replace: whole('<') },
  { pattern: /[\uFF1E]/g, replace: whole('>') },
  { pattern: /[\u2266\u2A7D]/g, replace: whole('≤') },
  { pattern: /[\u2267\u2A7E]/g, replace: whole('≥') },
  { pattern: /[\u060C\uFF0C]/g, replace: whole(',') },
  // full-width brackets, colon and semicolon (CJK typesetting around Latin statistics)
  { pattern: /\uFF08/g, replace: whole('(') },
  { pattern: /\uFF09/g, replace: whole(')') },
  { pattern: /\uFF1A/g, replace: whole(':') },
  { pattern: /\uFF1B/g, replace: whole(';') },
];

/** Quick test: characters that any rewrite above starts with. */
const MAY_REWRITE = /[\u200E\u200F\u061C\u202A-\u202E\u2066-\u2069\uFEFF\uFE00-\uFE0F\uDB40\u0300-\u036F\u1AB0-\u1AFF\u1DC0-\u1DFF\u20D0-\u20FF\uFE20-\uFE2F\r\n\u200B-\u200D\u2060\u00AD\u00A0\u2000-\u200A\u202F\u205F\u3000\t\\&{^⁰¹²³⁴⁵⁶⁷⁸⁹⁻⁺\u2212\u2012\uFE63\uFF0D\u2013\u2014\u00B7\u2219\uFF1C-\uFF1E\u2266\u2267\u2A7D\u2A7E\u060C\uFF0C\uFF08\uFF09\uFF1A\uFF1B]/;

/** Apply every rewrite to `input`, returning a new mapped text. */
export function normalize(input: MappedText): MappedText {
  if (!MAY_REWRITE.test(input.text)) return input;
  let current = input;
  for (const rw of REWRITES) {
    rw.pattern.lastIndex = 0;
    if (!rw.pattern.test(current.text)) continue;
    rw.pattern.lastIndex = 0;
    const out = new MappedText();
    let last = 0;
    for (let m = rw.pattern.exec(current.text); m; m = rw.pattern.exec(current.text)) {
      if (m[0].length === 0) {
        rw.pattern.lastIndex += 1;
        continue;
      }
      copyRange(current, out, last, m.index);
      for (const piece of rw.replace(m)) {
        const a = m.index + piece.from;
        const b = Math.max(a, m.index + piece.to - 1);
        out.pushSynthetic(piece.text, current.starts[a] as number, current.ends[b] as number);
      }
      last = m.index + m[0].length;
    }
    copyRange(current, out, last, current.text.length);
    current = out;
  }
  return current;
}

function copyRange(from: MappedText, to: MappedText, a: number, b: number): void {
  to.text += from.text.slice(a, b);
  for (let i = a; i < b; i += 1) {
    to.starts.push(from.starts[i] as number);
    to.ends.push(from.ends[i] as number);
  }
}
