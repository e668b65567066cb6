import { MappedText } from './builder.js';

/**
 * TeX math as the prose it prints. PDF-to-Markdown converters write every token of a formula
 * apart (`$t ( 8 2 ) = 3 . 0 3$`, `$\mathit { M } = 5 . 8 8$`, `$S D = 0 . 8 9$`); in math mode
 * those spaces are not printed, so the reader joins what TeX joins: digits and decimal points,
 * letters spelled apart inside a font command or forming a statistic label, and it drops what
 * TeX does not print (`\left`, style switches, grouping braces, empty sub- and superscripts).
 * Ordinary math (`$t(28) = 2.10$`) holds none of these and comes out unchanged. Every output
 * character maps to the source of the token that printed it; the pass is linear in the input.
 */
export function readMath(input: MappedText): MappedText {
  return joinSpaced(readCommands(input));
}

/** Commands that only choose the font of their argument (`\mathit { M }` prints M). */
const FONT_ARGUMENT = new Set([
  'mathit', 'mathrm', 'mathbf', 'mathcal', 'mathsf', 'mathtt', 'mathfrak', 'mathbb', 'mathscr', 'mathnormal',
  'boldsymbol', 'bm', 'pmb', 'mathord', 'mathop', 'mathbin', 'mathrel', 'mathpunct', 'mathopen', 'mathclose',
  'operatorname', 'overbrace', 'underbrace', 'underline',
]);
/** Accents over one letter, printed as the letter with its combining mark (`\bar{x}` is x̄). */
const ACCENT: Record<string, string> = {
  bar: '\u0304', overline: '\u0305', hat: '\u0302', widehat: '\u0302', tilde: '\u0303', widetilde: '\u0303',
  dot: '\u0307', ddot: '\u0308', vec: '\u20D7', acute: '\u0301', grave: '\u0300', check: '\u030C', breve: '\u0306',
};
/** Text-mode arguments: their spaces are printed. */
const TEXT_ARGUMENT = new Set(['text', 'textrm', 'textit', 'textbf', 'textsf', 'texttt', 'textnormal', 'textup', 'emph', 'mbox', 'hbox']);
/** Font switches for the rest of the group (`{ \tt h a z y }`). */
const FONT_SWITCH = new Set(['rm', 'it', 'bf', 'tt', 'sf', 'cal', 'mit', 'sl', 'boldmath']);
/** Printed as nothing: delimiter sizing and style switches. */
const SILENT = new Set([
  'left', 'right', 'middle', 'big', 'Big', 'bigg', 'Bigg', 'bigl', 'bigr', 'Bigl', 'Bigr', 'biggl', 'biggr', 'Biggl', 'Biggr',
  'displaystyle', 'textstyle', 'scriptstyle', 'scriptscriptstyle', 'limits', 'nolimits', 'nonumber', 'notag',
]);
/** Printed as (a little) space. */
const SPACING = new Set(['quad', 'qquad', 'enspace', 'thinspace', 'medspace', 'thickspace']);
/** Sizing commands may take `.` (no delimiter). */
const SIZING = new Set(['left', 'right', 'middle', 'bigl', 'bigr', 'Bigl', 'Bigr', 'biggl', 'biggr', 'Biggl', 'Biggr']);
const LETTERS: Record<string, string> = {
  alpha: 'α', beta: 'β', gamma: 'γ', delta: 'δ', epsilon: 'ε', varepsilon: 'ε', zeta: 'ζ', eta: 'η', theta: 'θ',
  vartheta: 'θ', iota: 'ι', kappa: 'κ', lambda: 'λ', mu: 'μ', nu: 'ν', xi: 'ξ', pi: 'π', rho: 'ρ', varrho: 'ρ',
  sigma: 'σ', varsigma: 'ς', tau: 'τ', upsilon: 'υ', phi: 'φ', varphi: 'φ', chi: 'χ', psi: 'ψ', omega: 'ω',
  Gamma: 'Γ', Delta: 'Δ', Theta: 'Θ', Lambda: 'Λ', Xi: 'Ξ', Pi: 'Π', Sigma: 'Σ', Upsilon: 'Υ', Phi: 'Φ', Psi: 'Ψ', Omega: 'Ω',
  varGamma: 'Γ', varDelta: 'Δ', varTheta: 'Θ', varLambda: 'Λ', varXi: 'Ξ', varPi: 'Π', varSigma: 'Σ', varPhi: 'Φ', varPsi: 'Ψ', varOmega: 'Ω',
  vert: '|', lvert: '|', rvert: '|', mid: '|', langle: '⟨', rangle: '⟩', lbrack: '[', rbrack: ']',
};
/** Statistic labels spelled letter by letter (`S D`), joined as TeX prints them. */
const LABELS = ['S E M', 'M S E', 'S D', 'S E', 'd f', 'C I', 'O R', 'B F', 'n s', 'S S', 'M S'];
/** How far a sub- or superscript's closing brace is looked for (keeps the pass linear). */
const SCRIPT_LOOKAHEAD = 80;

interface Group {
  /** Whether the closing brace is printed (kept arguments and scripts) or dropped. */
  keepBrace: boolean;
  /** Inside a font argument: letters spelled apart are one word. */
  word: boolean;
  /** Inside a text argument: spaces are printed. */
  text: boolean;
}

interface Marked {
  out: MappedText;
  /** Characters whose spaces are printed (text arguments): pass two leaves them alone. */
  keep: boolean[];
}

const isLetter = (c: string | undefined) => c !== undefined && ((c >= 'a' && c <= 'z') || (c >= 'A' && c <= 'Z'));
const isDigit = (c: string | undefined) => c !== undefined && c >= '0' && c <= '9';
const isSpace = (c: string | undefined) => c === ' ' || c === '\n' || c === '\t' || c === '\r';
/** Whether `c` is one of the characters of `set` (never for a missing character). */
const oneOf = (set: string, c: string | undefined) => c !== undefined && c.length === 1 && set.includes(c);
/** `&lt;` and the like: left for the normaliser (math is read raw, like code). */
const ENTITY_AHEAD = /^&(?:[A-Za-z]{2,8}|#[0-9]{1,7});/;

/** Pass one: commands, braces and scripts; whitespace runs become one space. */
function readCommands(input: MappedText): Marked {
  const src = input.text;
  const n = src.length;
  const out = new MappedText();
  const keep: boolean[] = [];
  const root: Group = { keepBrace: false, word: false, text: false };
  const stack: Group[] = [root];
  let argumentFollows = false;
  // the last character written (reading it back from the growing string would copy it each time)
  let last = '';
  const top = () => stack[stack.length - 1] as Group;
  const emit = (s: string, from: number, to: number) => {
    out.pushSynthetic(s, input.starts[from] as number, input.ends[to - 1] as number);
    for (let k = 0; k < s.length; k += 1) keep.push(top().text);
    last = s.slice(-1);
  };
  const skipSpaces = (from: number) => {
    let j = from;
    while (j < n && isSpace(src[j])) j += 1;
    return j;
  };
  const open = (g: Partial<Group>) => stack.push({ keepBrace: false, word: top().word, text: top().text, ...g });

  let i = 0;
  while (i < n) {
    const c = src[i] as string;
    // an unknown command's braces are its arguments (`\frac{1}{2}`), kept as written
    const afterCommand = argumentFollows;
    if (isSpace(c) || c === '~' || (c === '&' && !ENTITY_AHEAD.test(src.slice(i, i + 12)))) {
      const j = skipSpaces(i + 1);
      // in a font argument, letters spelled apart are one word (`\mathrm { a g e }`)
      const joined = top().word && isLetter(last) && isLetter(src[j]);
      if (!joined && last !== ' ') emit(' ', i, i + 1);
      i = j;
      continue;
    }
    argumentFollows = false;
    if (c === '\\') {
      if (i + 1 >= n) break; // a stray backslash before the closing `$` (`\$` read as the end)
      let j = i + 1;
      if (isLetter(src[j])) while (j < n && isLetter(src[j])) j += 1;
      else j += 1;
      const name = src.slice(i + 1, j);
      if (SILENT.has(name)) {
        i = skipSpaces(j);
        if (SIZING.has(name) && src[i] === '.') i += 1;
        continue;
      }
      if (FONT_ARGUMENT.has(name) || TEXT_ARGUMENT.has(name)) {
        const k = skipSpaces(j);
        if (src[k] === '{') {
          open(TEXT_ARGUMENT.has(name) ? { text: true, word: false } : { word: true });
          i = k + 1;
        } else i = k;
        continue;
      }
      const accent = ACCENT[name];
      if (accent !== undefined) {
        // `\bar { x }` or `\bar x`: one letter takes the mark; a longer argument is printed as is
        const k = skipSpaces(j);
        const close = src[k] === '{' ? matchingBrace(src, k, SCRIPT_LOOKAHEAD) : -1;
        const inner = close >= 0 ? src.slice(k + 1, close).trim() : '';
        // both characters stand for the whole construct
        if (close >= 0 && inner.length === 1 && isLetter(inner)) {
          emit(inner + accent, i, close + 1);
          i = close + 1;
        } else if (close < 0 && isLetter(src[k])) {
          emit((src[k] as string) + accent, i, k + 1);
          i = k + 1;
        } else if (close >= 0) {
          open({});
          i = k + 1;
        } else i = k;
        continue;
      }
      if (FONT_SWITCH.has(name)) {
        top().word = true;
        i = skipSpaces(j);
        continue;
      }
      if (name === 'begin' || name === 'end') {
        i = skipBraced(src, skipSpaces(j), 40);
        // an array's column specification follows its name
        if (name === 'begin' && src[skipSpaces(i)] === '{' && /^(?:array|tabular)\b/.test(src.slice(j, i).replace(/[\s{]/g, ''))) i = skipBraced(src, skipSpaces(i), 40);
        continue;
      }
      if (SPACING.has(name) || name === ',' || name === ':' || name === ';' || name === ' ' || name === '\\') {
        if (last !== ' ') emit(' ', i, j);
        i = j;
        continue;
      }
      if (name === '!') {
        i = j;
        continue;
      }
      if (name === '{' || name === '}') {
        emit(name, i, j);
        i = j;
        continue;
      }
      const letter = LETTERS[name];
      if (letter) {
        emit(letter, i, j);
        i = j;
        continue;
      }
      // anything else stays as written (the normaliser folds \leq, \times, \pm, …)
      emit(src.slice(i, j), i, j);
      i = j;
      argumentFollows = isLetter(name[0]);
      continue;
    }
    if (c === '^' || c === '_') {
      const j = skipSpaces(i + 1);
      if (src[j] === '{') {
        const close = matchingBrace(src, j, SCRIPT_LOOKAHEAD);
        if (close >= 0) {
          const content = src.slice(j + 1, close);
          if (/^\s*\\circ\s*$/.test(content)) {
            emit('°', i, close + 1);
            i = close + 1;
            continue;
          }
          if (!hasSubstance(content)) {
            // `_ { , }`, `^ { \prime }`: conversion debris that prints no value
            i = close + 1;
            continue;
          }
          const nothingYet = out.starts.length === 0 || (out.starts.length === 1 && last === ' ');
          if (nothingYet && /[=<>]/.test(content)) {
            // `$_ { t = 1 . 9 5 }$`: a "script" without a base is a misread statement
            open({});
            i = j + 1;
            continue;
          }
        }
        emit(c, i, i + 1);
        emit('{', j, j + 1);
        open({ keepBrace: true, word: false });
        i = j + 1;
        continue;
      }
      emit(c, i, i + 1);
      i = j;
      continue;
    }
    if (c === '{') {
      if (afterCommand) {
        open({ keepBrace: true });
        emit('{', i, i + 1);
      } else open({});
      i += 1;
      continue;
    }
    if (c === '}') {
      if (stack.length > 1) {
        const g = stack.pop() as Group;
        if (g.keepBrace) emit('}', i, i + 1);
        // `\frac{a}{b}`: the next group is the command's next argument
        argumentFollows = g.keepBrace && src[i + 1] === '{';
      }
      i += 1;
      continue;
    }
    emit(c, i, i + 1);
    i += 1;
  }
  return { out, keep };
}

/** Index just past the brace group opening at `at` (bounded), or `at` when there is none. */
function skipBraced(src: string, at: number, limit: number): number {
  if (src[at] !== '{') return at;
  const close = matchingBrace(src, at, limit);
  return close < 0 ? at : close + 1;
}

/** The brace closing the one at `at`, within `limit` characters, or -1. */
function matchingBrace(src: string, at: number, limit: number): number {
  let depth = 0;
  const end = Math.min(src.length, at + limit);
  for (let k = at; k < end; k += 1) {
    const c = src[k];
    if (c === '\\') k += 1;
    else if (c === '{') depth += 1;
    else if (c === '}') {
      depth -= 1;
      if (depth === 0) return k;
    }
  }
  return -1;
}

/** Whether a script prints anything but punctuation and primes (`, `, `\cdot`, `\prime`). */
function hasSubstance(content: string): boolean {
  return /[A-Za-z0-9*+\-<>=|]/.test(content.replace(/\\[A-Za-z]{1,20}/g, ''));
}

/** Pass two: the spaces TeX would not print between digits, around decimal points and in labels. */
function joinSpaced({ out: mid, keep }: Marked): MappedText {
  const t = mid.text;
  const n = t.length;
  const out = new MappedText();
  // the last three characters written, newest first
  let p = '';
  let before = '';
  let third = '';
  const push = (k: number) => {
    const c = t[k] as string;
    out.text += c;
    out.starts.push(mid.starts[k] as number);
    out.ends.push(mid.ends[k] as number);
    third = before;
    before = p;
    p = c;
  };
  const nextAfterSpace = (k: number) => (t[k] === ' ' ? t[k + 1] : t[k]);
  for (let i = 0; i < n; i += 1) {
    const c = t[i] as string;
    if (c !== ' ' || keep[i]) {
      if (isLetter(c) && !keep[i] && !isLetter(p)) {
        const label = LABELS.find((l) => t.startsWith(l, i) && !isLetter(t[i + l.length]));
        if (label) {
          for (let k = i; k < i + label.length; k += 1) if (t[k] !== ' ') push(k);
          i += label.length - 1;
          continue;
        }
      }
      push(i);
      continue;
    }
    const next = t[i + 1];
    const drop =
      p === '' ||
      next === undefined ||
      (isDigit(p) && isDigit(next)) ||
      // 3 . 0 3 and = . 0 0 3: a decimal point joins the digits around it
      (isDigit(p) && next === '.' && isDigit(nextAfterSpace(i + 2))) ||
      (p === '.' && isDigit(next) && !isLetter(before)) ||
      // = - 2 . 5 0: a sign belongs to its number
      (oneOf('-+\u2212', p) && isDigit(next) && (before === '' || oneOf('{([^_', before) || (before === ' ' && oneOf('=<>≤≥,(', third)))) ||
      oneOf('{([^_', p) ||
      oneOf('})],;^_', next);
    if (!drop) push(i);
  }
  return out;
}
