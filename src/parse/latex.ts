import { MappedText, offsetArray } from './builder.js';
import { readDirective } from './directives.js';
import { markLegends } from './legends.js';
import { readMath } from './math.js';
import { normalize } from './normalize.js';
import type { Directive, ParsedDocument, ReadNote, Segment, SegmentKind, Span, TablePlace } from './types.js';

/** An `\input{…}` or `\include{…}` in the body of a LaTeX manuscript: the name as written and where. */
export interface LatexInclude {
  command: 'input' | 'include';
  /** The file name as written between the braces (or after `\input `), trimmed. */
  name: string;
  /** The whole command, `\input{methods}`. */
  span: Span;
}

/**
 * A LaTeX manuscript into the segments the Markdown reader makes, every character mapped to the
 * offset in the `.tex` source that printed it. What TeX does not print is not read: comments
 * (`%` to the end of the line, not `\%`), the preamble before `\begin{document}` (when there is
 * one) and everything after `\end{document}`, the `\begin`/`\end` markers and their options,
 * commands that print no prose with their arguments (`\label`, `\ref`, `\cite`, `\vspace`,
 * `\usepackage`, `\newcommand`, `\includegraphics`, …: a `\ref` is dropped, not read as its
 * key), and the `comment` environment. Font commands (`\textit{t}`, `\emph{p}`) print their
 * argument; `$…$`, `\(…\)` are inline math read as the Markdown reader reads `$…$` (readMath);
 * `$$…$$`, `\[…\]` and the display environments (`equation`, `align`, …) are math segments;
 * `verbatim` and `lstlisting` are code. `~`, `\,` and kin read as spaces, `--`/`---` as dashes,
 * `\%` as %. A blank line, `\par` or `\item` ends a paragraph; `\section{…}` and its kin are
 * headings; `\caption{…}` is a paragraph of its own (the caption of the table in its `table`
 * environment). `tabular` rows are table rows: cells split at `&`, rows at `\\`, the rules
 * (`\hline`, `\toprule`, `\midrule`, `\bottomrule`, `\cline`, `\cmidrule`) skipped, and
 * `\multicolumn`/`\multirow` read as spans. A tabular inside a cell is a table of its own, the
 * cell's text reading on around it; one of a single column (a cell's text broken over lines) is
 * that cell's text, its lines a space apart. A comment `% plumbline quiet RULE: reason` is a
 * directive, as `<!-- … -->` is in Markdown. `\input`/`\include` are listed (see
 * readLatexIncludes), not followed here: the parse layer reads one source. One linear pass.
 */
export function parseLatex(path: string, source: string): ParsedDocument {
  const reader = new LatexReader(source);
  reader.read();
  markLegends(reader.segments, source);
  reader.markCaptions();
  return {
    path,
    source,
    format: 'latex',
    segments: reader.segments,
    directives: reader.finishDirectives(),
    hadBom: source.charCodeAt(0) === 0xfeff,
    ...(reader.notes.length > 0 ? { readNotes: reader.notes } : {}),
  };
}

/** `\newcommand`, `\renewcommand`, `\providecommand` (and their starred forms). */
const DEFINITION = /\\(?:(?:re)?newcommand|providecommand)(?![A-Za-z])\*?/g;
/** A body that prints as it is written: no command, group, math, comment, parameter, tie, script or line break. */
const PLAIN_BODY = /^[^\\{}$%#&~^_\n\r]*$/;
/** Definitions read at most (a manuscript has a few dozen). */
const MACRO_LIMIT = 2000;

/** A command a manuscript defines: where, and what it prints when it takes no argument and its body is plain text. */
interface Macro {
  at: number;
  /** The body, when it can be printed in place; otherwise why it is not. */
  body: string | undefined;
  why?: string;
}

/**
 * The commands the source defines with `\newcommand` and kin (outside comments, preamble
 * included), by name, in source order. One pass: the comment state is carried along the text
 * between definitions, so each character is looked at once.
 */
function readMacros(src: string): Map<string, Macro[]> {
  const macros = new Map<string, Macro[]>();
  let scanned = 0;
  let inComment = false;
  let count = 0;
  DEFINITION.lastIndex = 0;
  for (let m = DEFINITION.exec(src); m && count < MACRO_LIMIT; m = DEFINITION.exec(src)) {
    for (; scanned < m.index; scanned += 1) {
      const c = src[scanned];
      if (c === '\n' || c === '\r') inComment = false;
      else if (c === '\\') scanned += 1;
      else if (c === '%') inComment = true;
    }
    if (inComment || scanned > m.index) continue; // in a comment, or the backslash was escaped
    let k = skipBlanks(src, m.index + m[0].length, src.length);
    let name: string | undefined;
    const braced = src[k] === '{';
    if (braced) k = skipBlanks(src, k + 1, src.length);
    if (src[k] === '\\') {
      let e = k + 1;
      while (e < src.length && isLetter(src[e])) e += 1;
      if (e > k + 1) name = src.slice(k + 1, e);
      k = e;
    }
    if (braced) {
      k = skipBlanks(src, k, src.length);
      if (src[k] !== '}') continue;
      k += 1;
    }
    if (name === undefined) continue;
    count += 1;
    k = skipBlanks(src, k, src.length);
    const takesArguments = src[k] === '[';
    while (src[skipBlanks(src, k, src.length)] === '[') k = skipOptional(src, skipBlanks(src, k, src.length), src.length);
    k = skipBlanks(src, k, src.length);
    const group = readGroup(src, k, src.length);
    const body = !takesArguments && group && PLAIN_BODY.test(group.text) ? group.text : undefined;
    const why = takesArguments ? 'it takes arguments' : group === undefined && src[k] !== '{' ? 'its definition could not be read' : body === undefined ? 'its definition is not plain text' : undefined;
    const list = macros.get(name) ?? [];
    list.push({ at: m.index, body, ...(why ? { why } : {}) });
    macros.set(name, list);
  }
  return macros;
}

/** The `\input{…}`/`\include{…}` commands of a LaTeX manuscript's body, in source order (comments and preamble skipped). */
export function readLatexIncludes(source: string): LatexInclude[] {
  const reader = new LatexReader(source);
  reader.read();
  return reader.includes;
}

/** Commands whose arguments print nothing: how many brace arguments each takes (optional `[…]` are skipped too). */
const SKIPPED: Record<string, number> = {
  label: 1, ref: 1, eqref: 1, pageref: 1, cref: 1, Cref: 1, autoref: 1, nameref: 1, vref: 1,
  cite: 1, citep: 1, citet: 1, citealp: 1, citealt: 1, citeauthor: 1, citeyear: 1, citeyearpar: 1, parencite: 1,
  textcite: 1, autocite: 1, footcite: 1, nocite: 1, Citet: 1, Citep: 1,
  vspace: 1, hspace: 1, vskip: 0, hskip: 0, usepackage: 1, RequirePackage: 1, documentclass: 1,
  newcommand: 2, renewcommand: 2, providecommand: 2, DeclareMathOperator: 2, newenvironment: 3, renewenvironment: 3,
  setlength: 2, addtolength: 2, setcounter: 2, addtocounter: 2, newlength: 1, newcounter: 1,
  includegraphics: 1, bibliography: 1, bibliographystyle: 1, addbibresource: 1, pagestyle: 1, thispagestyle: 1,
  url: 1, doi: 1, hypersetup: 1, graphicspath: 1, pagenumbering: 1, linespread: 1, fontsize: 2, selectfont: 0,
  color: 1, definecolor: 3, input: 1, include: 1, includeonly: 1, phantom: 1, hphantom: 1, vphantom: 1,
};
/** Commands whose first argument prints nothing and whose second prints as text (`\href{url}{text}`, `\textcolor{red}{x}`). */
const FIRST_SKIPPED = new Set(['href', 'textcolor', 'colorbox', 'foreignlanguage', 'resizebox', 'scalebox', 'makebox', 'framebox', 'parbox', 'raisebox']);
const HEADINGS = new Set(['part', 'chapter', 'section', 'subsection', 'subsubsection', 'paragraph', 'subparagraph']);
/** Commands that print a character or a few. */
const SYMBOLS: Record<string, string> = {
  ldots: '…', dots: '…', textellipsis: '…', textless: '<', textgreater: '>', textendash: '–', textemdash: '—',
  textminus: '−', textpm: '±', texttimes: '×', textdegree: '°', textperthousand: '‰', textasciitilde: '~',
  textbackslash: '\\', textbar: '|', textquotedblleft: '“', textquotedblright: '”', textquoteleft: '‘', textquoteright: '’',
  S: '§', P: '¶', ss: 'ß', LaTeX: 'LaTeX', TeX: 'TeX', copyright: '©', textregistered: '®', quad: ' ', qquad: ' ',
  enspace: ' ', thinspace: ' ', newline: ' ', linebreak: ' ', space: ' ', textasciicircum: '^', textunderscore: '_',
};
/** Accents written as a backslash and a sign (`\'e`), printed as the letter with its combining mark. */
const ACCENTS: Record<string, string> = { "'": '\u0301', '`': '\u0300', '^': '\u0302', '"': '\u0308', '~': '\u0303', '=': '\u0304', '.': '\u0307' };
/** Characters that print themselves after a backslash. */
const ESCAPED = new Set(['%', '&', '$', '#', '_', '{', '}']);
const MATH_ENVIRONMENT = /^(?:equation|align|alignat|gather|multline|flalign|displaymath|math|eqnarray|split)\*?$/;
const CODE_ENVIRONMENT = /^(?:verbatim\*?|Verbatim|lstlisting|minted|alltt)$/;
/** Column specifications longer than this are not counted (a tabular inside a cell is then a table of its own). */
const SPEC_LIMIT = 400;
/** Table environments and how many brace arguments come before the rows (`tabular*{width}{spec}`). */
const TABLE_ENVIRONMENT: Record<string, number> = { tabular: 1, 'tabular*': 2, tabularx: 2, tabulary: 2, longtable: 1, 'longtable*': 1, supertabular: 1, xtabular: 1 };
/** Other environments with brace arguments after their name (`minipage{0.5\textwidth}`). */
const ENVIRONMENT_ARGUMENTS: Record<string, number> = { minipage: 1, multicols: 1, 'multicols*': 1, wrapfigure: 2, wraptable: 2, thebibliography: 1, threeparttable: 0 };
const RULES = new Set(['hline', 'toprule', 'midrule', 'bottomrule', 'cline', 'cmidrule', 'addlinespace', 'specialrule', 'morecmidrules', 'endhead', 'endfirsthead', 'endfoot', 'endlastfoot']);
/** A plumbline directive in a comment: `% plumbline quiet RULE: reason`. */
const COMMENT_DIRECTIVE = /^%+[ \t]*plumbline[ \t]/;

type Frame = { kind: 'plain' } | { kind: 'heading' | 'caption' | 'footnote'; saved: MappedText };

interface TableState {
  index: number;
  row: number;
  column: number;
  rowHasCells: boolean;
  cell: MappedText;
  colSpan?: number;
  rowSpan?: number;
  /** The environment's name, so that its `\end` closes it. */
  environment: string;
  /** The table whose cell this one sits in (a tabular inside a tabular). */
  outer?: TableState;
  /**
   * A one-column tabular inside a cell (`\begin{tabular}{@{}c@{}}Mean\\(SD)\end{tabular}`, the
   * usual way to break a cell's text over lines): its lines are that cell's text, a space apart.
   */
  inline?: boolean;
}

interface Environment {
  name: string;
  /** The tables read inside it and the captions met in it (for `table` floats). */
  tables: number[];
  captions: Segment[];
}

const isLetter = (c: string | undefined) => c !== undefined && ((c >= 'a' && c <= 'z') || (c >= 'A' && c <= 'Z'));
const isBlank = (c: string | undefined) => c === ' ' || c === '\t';

class LatexReader {
  segments: Segment[] = [];
  includes: LatexInclude[] = [];
  private directives: Directive[] = [];
  private pending: Directive[] = [];
  private block = 0;
  private section: string | undefined;
  private para = new MappedText();
  /** Where printed text goes: the paragraph, a heading or caption argument, or a table cell. */
  private target: MappedText;
  private frames: Frame[] = [];
  private table: TableState | undefined;
  private tables = 0;
  private environments: Environment[] = [];
  /** Captions of `table` floats and the table each belongs to. */
  private captionOf: Array<{ segment: Segment; table: number }> = [];
  private failedClose = new Map<string, { from: number; stop: number }>();
  private readonly start: number;
  private readonly end: number;
  /** Commands the manuscript defines (readMacros). */
  private readonly macros: Map<string, Macro[]>;
  /** What could not be read as printed: a defined command left unexpanded, once per name. */
  notes: ReadNote[] = [];
  private noted = new Set<string>();

  constructor(private readonly src: string) {
    this.target = this.para;
    this.macros = src.includes('command') ? readMacros(src) : new Map();
    const bom = src.charCodeAt(0) === 0xfeff ? 1 : 0;
    const begin = findOutsideComments(src, /\\begin[ \t]*\{document\}/g);
    this.start = begin ? begin.index + begin.length : bom;
    this.end = src.length;
  }

  read(): void {
    const src = this.src;
    let i = this.start;
    const end = this.end;
    // after a comment, the line break it ends on prints nothing (TeX's comment eats it)
    let afterComment = false;
    while (i < end) {
      const c = src[i] as string;
      if (c === '%') {
        let j = src.indexOf('\n', i);
        if (j < 0) j = end;
        let k = j;
        if (k > i && src[k - 1] === '\r') k -= 1;
        this.comment(i, k);
        i = j;
        afterComment = true;
        if (i < end) i = this.lineBreak(i, true);
        afterComment = false;
        continue;
      }
      if (c === '\n' || c === '\r') {
        i = this.lineBreak(i, afterComment);
        continue;
      }
      if (c === '\\') {
        i = this.command(i);
        continue;
      }
      if (c === '$') {
        i = this.dollar(i);
        continue;
      }
      if (c === '{') {
        this.frames.push({ kind: 'plain' });
        i += 1;
        continue;
      }
      if (c === '}') {
        this.closeGroup();
        i += 1;
        continue;
      }
      if (c === '&' && this.table) {
        if (this.table.inline) this.target.pushSynthetic(' ', i, i + 1);
        else this.endCell(true);
        i += 1;
        continue;
      }
      if (c === '~') {
        this.target.pushSynthetic(' ', i, i + 1);
        i += 1;
        continue;
      }
      if (c === '-' && src[i + 1] === '-') {
        const three = src[i + 2] === '-';
        this.target.pushSynthetic(three ? '—' : '–', i, i + (three ? 3 : 2));
        i += three ? 3 : 2;
        continue;
      }
      if ((c === '`' || c === "'") && src[i + 1] === c) {
        this.target.pushSynthetic(c === '`' ? '“' : '”', i, i + 2);
        i += 2;
        continue;
      }
      this.target.pushVerbatim(c, i);
      i += 1;
    }
    while (this.table) this.finishTable();
    while (this.frames.length > 0) this.closeGroup();
    this.flush();
  }

  finishDirectives(): Directive[] {
    for (const d of this.pending) d.appliesToBlock = -1;
    return this.directives;
  }

  /** A caption inside a `table` float is the caption of the tabular in it (LaTeX prints `Table N` before it). */
  markCaptions(): void {
    for (const { segment, table } of this.captionOf) if (!segment.legendOf) segment.legendOf = { table, role: 'caption' };
  }

  /** A comment from `%` to `end`: skipped, or a directive when it is addressed to plumbline. */
  private comment(start: number, end: number): void {
    const text = this.src.slice(start, end);
    if (!COMMENT_DIRECTIVE.test(text)) return;
    const d = readDirective(`<!-- ${text.replace(/^%+/, '')} -->`, { start, end });
    if (d) {
      this.directives.push(d);
      this.pending.push(d);
    }
  }

  /**
   * The line break at `i`: a blank line after it ends the paragraph; otherwise it prints a space
   * (none after a comment). Returns the offset after what was read.
   */
  private lineBreak(i: number, afterComment: boolean): number {
    const src = this.src;
    const next = src[i] === '\r' && src[i + 1] === '\n' ? i + 2 : i + 1;
    let k = next;
    while (k < this.end && isBlank(src[k])) k += 1;
    if (k >= this.end || src[k] === '\n' || src[k] === '\r') {
      if (this.target === this.para) this.flush();
      else this.target.pushSynthetic(' ', i, next);
      return k;
    }
    if (!afterComment) this.target.pushSynthetic(' ', i, next);
    // TeX skips the spaces that open a line
    return k;
  }

  /** A command at `i` (the backslash). Returns the offset after it and the arguments read with it. */
  private command(i: number): number {
    const src = this.src;
    const c = src[i + 1];
    if (c === undefined) return i + 1;
    if (!isLetter(c)) return this.controlSymbol(i, c);
    let j = i + 1;
    while (j < this.end && isLetter(src[j])) j += 1;
    let name = src.slice(i + 1, j);
    if (src[j] === '*') {
      name += '*';
      j += 1;
    }
    const bare = name.replace(/\*$/, '');
    if (bare === 'begin' || bare === 'end') return this.environment(i, j, bare);
    if (bare === 'input' || bare === 'include') return this.include(i, j, bare);
    if (bare === 'par') {
      if (this.target === this.para) this.flush();
      return j;
    }
    if (bare === 'item') {
      if (this.target === this.para) this.flush();
      return skipOptional(src, skipBlanks(src, j, this.end), this.end);
    }
    if (bare === 'tabularnewline' && this.table) {
      if (this.table.inline) this.target.pushSynthetic(' ', i, j);
      else this.endRow();
      return skipOptional(src, skipBlanks(src, j, this.end), this.end);
    }
    if (RULES.has(bare) && this.table) {
      // `\cmidrule(lr){2-3}`, `\cline{2-3}`, `\specialrule{.1em}{.05em}{.05em}`
      let k = skipBlanks(src, j, this.end);
      if (src[k] === '(') {
        const close = src.indexOf(')', k);
        if (close >= 0 && close - k < 20) k = close + 1;
      }
      k = skipOptional(src, k, this.end);
      while (src[skipBlanks(src, k, this.end)] === '{') k = skipGroup(src, skipBlanks(src, k, this.end), this.end);
      return k;
    }
    if (bare === 'multicolumn' || bare === 'multirow') {
      // `\multicolumn{2}{c}{text}`, `\multirow{2}{*}{text}`: a span, then the text
      let k = skipBlanks(src, j, this.end);
      const count = readGroup(src, k, this.end);
      if (count) {
        const n = Number.parseInt(count.text.trim(), 10);
        if (this.table && !this.table.inline && Number.isFinite(n) && n > 1) {
          if (bare === 'multicolumn') this.table.colSpan = n;
          else this.table.rowSpan = n;
        }
        k = skipOptional(src, skipBlanks(src, count.end, this.end), this.end);
        if (src[skipBlanks(src, k, this.end)] === '{') k = skipGroup(src, skipBlanks(src, k, this.end), this.end);
      }
      return k;
    }
    if (HEADINGS.has(bare) || bare === 'caption' || bare === 'footnote') {
      const k = skipOptional(src, skipBlanks(src, j, this.end), this.end);
      if (src[k] !== '{') return k;
      // a footnote is read apart, and the sentence it sits in reads on around it
      if (this.target === this.para && bare !== 'footnote') this.flush();
      this.frames.push({ kind: bare === 'caption' ? 'caption' : bare === 'footnote' ? 'footnote' : 'heading', saved: this.target });
      this.target = new MappedText();
      return k + 1;
    }
    if (bare === 'verb') {
      // `\verb|code|`: code, not prose; a space keeps the words around it apart
      const delim = src[j];
      const close = delim === undefined ? -1 : src.indexOf(delim, j + 1);
      const stop = close < 0 || src.slice(j, close).includes('\n') ? j : close + 1;
      this.target.pushSynthetic(' ', i, stop);
      return stop;
    }
    if (bare === 'def' || bare === 'gdef' || bare === 'edef') {
      // `\def\name#1{…}`: the parameter text up to the body, then the body
      const open = src.indexOf('{', j);
      return open < 0 ? this.end : skipGroup(src, open, this.end);
    }
    if (bare in SKIPPED) {
      let k = skipOptional(src, skipBlanks(src, j, this.end), this.end);
      for (let n = 0; n < (SKIPPED[bare] as number); n += 1) {
        const at = skipBlanks(src, k, this.end);
        if (src[at] === '{') k = skipOptional(src, skipGroup(src, at, this.end), this.end);
        else if (src[at] === '\\' && n === 0 && /command$/.test(bare)) {
          // `\newcommand\name{…}`: the name without braces
          let e = at + 1;
          while (e < this.end && isLetter(src[e])) e += 1;
          k = skipOptional(src, e, this.end);
          while (src[skipBlanks(src, k, this.end)] === '[') k = skipOptional(src, skipBlanks(src, k, this.end), this.end);
        } else break;
      }
      return k;
    }
    if (FIRST_SKIPPED.has(bare)) {
      const at = skipBlanks(src, j, this.end);
      return src[at] === '{' ? skipOptional(src, skipGroup(src, at, this.end), this.end) : at;
    }
    const symbol = SYMBOLS[bare];
    if (symbol !== undefined) {
      this.target.pushSynthetic(symbol, i, j);
      return skipEmptyGroup(src, j);
    }
    const macro = this.macro(bare, i, j);
    if (macro !== undefined) {
      // the definition's text, every character placed at the command that printed it; a
      // control word takes the spaces after it, and `{}` after it ends it
      this.target.pushSynthetic(macro, i, j);
      return skipEmptyGroup(src, skipBlanks(src, j, this.end));
    }
    // Anything else prints its arguments, if any, as text (`\textit{t}`, `\emph{p}`, `\footnote{…}`)
    // and itself nothing (`\noindent`, `\centering`, `\small`); an optional argument right after it is an option.
    return skipOptional(src, skipBlanks(src, j, this.end), this.end);
  }

  /**
   * What the command `\name` at `i` (its name ending at `j`) prints, when the manuscript defines
   * it (the last definition before it) without arguments and with a plain-text body; otherwise
   * undefined, with a note the first time a defined command cannot be printed so.
   */
  private macro(name: string, i: number, j: number): string | undefined {
    const defs = this.macros.get(name);
    if (!defs) return undefined;
    // the last definition before the use (definitions are in source order)
    let lo = 0;
    let hi = defs.length;
    while (lo < hi) {
      const mid = (lo + hi) >> 1;
      if ((defs[mid] as Macro).at < i) lo = mid + 1;
      else hi = mid;
    }
    const def = defs[lo - 1];
    if (!def) return undefined;
    if (def.body !== undefined) return def.body;
    if (!this.noted.has(name)) {
      this.noted.add(name);
      this.notes.push({ kind: 'macro-not-expanded', message: `\\${name} (${def.why ?? 'its definition is not plain text'}) was not expanded where it is used, so what it prints was not read (the first use)`, span: { start: i, end: j } });
    }
    return undefined;
  }

  /** `\%`, `\&`, `\,`, `\\`, `\'e` and the other backslash-and-sign commands. */
  private controlSymbol(i: number, c: string): number {
    const src = this.src;
    if (ESCAPED.has(c)) {
      this.target.pushSynthetic(c, i, i + 2);
      return i + 2;
    }
    if (c === ',' || c === ';' || c === ':' || c === ' ' || c === '>' || c === '\t') {
      this.target.pushSynthetic(' ', i, i + 2);
      return i + 2;
    }
    if (c === '\n' || c === '\r') {
      // a backslash before the line break: a space, as TeX prints it
      this.target.pushSynthetic(' ', i, i + 1);
      return i + 1;
    }
    if (c === '\\') {
      // a forced line break; in a table, the end of a row. `\\*` and `\\[2pt]` take their options along.
      let k = i + 2;
      if (src[k] === '*') k += 1;
      k = skipOptional(src, skipBlanks(src, k, this.end), this.end);
      if (this.table && !this.table.inline) this.endRow();
      else this.target.pushSynthetic(' ', i, i + 2);
      return k;
    }
    if (c === '(') return this.inlineMath(i, i + 2, '\\)');
    if (c === '[') return this.displayMath(i, i + 2, '\\]');
    const accent = ACCENTS[c];
    if (accent !== undefined) {
      let k = i + 2;
      const braced = src[k] === '{';
      if (braced) k += 1;
      const letter = src[k];
      if (isLetter(letter) && (!braced || src[k + 1] === '}')) {
        const stop = braced ? k + 2 : k + 1;
        this.target.pushSynthetic((letter as string) + accent, i, stop);
        return stop;
      }
      return i + 2;
    }
    // `\-` (a hyphenation point), `\/`, `\@`, `\!`: nothing printed
    return i + 2;
  }

  private closeGroup(): void {
    const frame = this.frames.pop();
    if (!frame || frame.kind === 'plain') return;
    const text = this.target;
    this.target = frame.saved;
    if (frame.kind === 'heading') {
      const seg = this.emit('heading', text);
      if (seg) this.section = seg.text || this.section;
      return;
    }
    if (frame.kind === 'footnote') {
      // a directive before the paragraph is for the paragraph, not for its footnote
      this.emit('paragraph', text, undefined, false);
      return;
    }
    const seg = this.emit('paragraph', text);
    const env = this.innermost('table');
    if (seg && env) env.captions.push(seg);
  }

  private innermost(name: string): Environment | undefined {
    for (let k = this.environments.length - 1; k >= 0; k -= 1) {
      const env = this.environments[k] as Environment;
      if (env.name.replace(/\*$/, '') === name) return env;
    }
    return undefined;
  }

  /** `\begin{name}` or `\end{name}` at `i`; `j` is after the command's name. */
  private environment(i: number, j: number, which: 'begin' | 'end'): number {
    const src = this.src;
    const group = readGroup(src, skipBlanks(src, j, this.end), this.end);
    if (!group) return j;
    const name = group.text.trim();
    let k = group.end;
    if (which === 'end') {
      if (name === 'document') return this.end;
      if (this.table && this.table.environment === name) {
        if (this.table.inline) this.target.pushSynthetic(' ', i, k);
        this.finishTable();
        return k;
      }
      const at = this.environments.map((e) => e.name).lastIndexOf(name);
      if (at >= 0) {
        const [env] = this.environments.splice(at);
        if (env && name.replace(/\*$/, '') === 'table') {
          const table = env.tables[0];
          if (table !== undefined) for (const segment of env.captions) this.captionOf.push({ segment, table });
        }
      }
      if (this.target === this.para) this.flush();
      return k;
    }
    if (name === 'comment') return this.skipTo(src, k, name);
    if (MATH_ENVIRONMENT.test(name)) {
      const stop = src.indexOf(`\\end{${name}}`, k);
      const close = stop < 0 ? this.end : stop;
      this.mathSegment(k, close);
      return stop < 0 ? this.end : stop + `\\end{${name}}`.length;
    }
    if (CODE_ENVIRONMENT.test(name)) {
      k = skipOptional(src, k, this.end);
      if (name === 'minted' && src[k] === '{') k = skipGroup(src, k, this.end);
      const stop = src.indexOf(`\\end{${name}}`, k);
      const close = stop < 0 ? this.end : stop;
      if (this.target === this.para) this.flush();
      const code = new MappedText();
      code.pushVerbatim(src.slice(k, close), k);
      this.emit('code', code);
      return stop < 0 ? this.end : stop + `\\end{${name}}`.length;
    }
    const tableArgs = TABLE_ENVIRONMENT[name];
    if (tableArgs !== undefined) {
      // the column specification is the last argument (`tabular*{width}{spec}`)
      let spec: string | undefined;
      for (let n = 0; n < tableArgs; n += 1) {
        k = skipOptional(src, skipBlanks(src, k, this.end), this.end);
        const at = skipBlanks(src, k, this.end);
        if (src[at] === '{') {
          k = skipGroup(src, at, this.end);
          spec = src.slice(at + 1, Math.max(at + 1, k - 1));
        }
      }
      const outer = this.table;
      if (outer && spec !== undefined && spec.length <= SPEC_LIMIT && columnCount(spec) === 1) {
        // a cell's text broken over lines: read on in the same cell
        this.table = { index: -1, row: 0, column: 0, rowHasCells: false, cell: outer.cell, environment: name, outer, inline: true };
        this.target.pushSynthetic(' ', i, k);
        return k;
      }
      if (this.target === this.para) this.flush();
      const index = this.tables;
      this.tables += 1;
      for (const env of this.environments) env.tables.push(index);
      // a table inside a cell is a table of its own; the cell's own text reads on around it
      this.table = { index, row: 0, column: 0, rowHasCells: false, cell: new MappedText(), environment: name, ...(outer ? { outer } : {}) };
      this.target = this.table.cell;
      return k;
    }
    // any other environment: a block boundary; its options and arguments print nothing
    if (this.target === this.para) this.flush();
    k = skipOptional(src, k, this.end);
    for (let n = 0; n < (ENVIRONMENT_ARGUMENTS[name] ?? 0); n += 1) {
      const at = skipBlanks(src, k, this.end);
      if (src[at] === '{') k = skipOptional(src, skipGroup(src, at, this.end), this.end);
    }
    this.environments.push({ name, tables: [], captions: [] });
    return k;
  }

  private skipTo(src: string, from: number, name: string): number {
    const stop = src.indexOf(`\\end{${name}}`, from);
    return stop < 0 ? this.end : stop + `\\end{${name}}`.length;
  }

  /** `\input{name}`, `\input name`, `\include{name}`: listed; a block boundary. */
  private include(i: number, j: number, command: 'input' | 'include'): number {
    const src = this.src;
    const at = skipBlanks(src, j, this.end);
    let name: string;
    let stop: number;
    if (src[at] === '{') {
      const group = readGroup(src, at, this.end);
      if (!group) return j;
      name = group.text.trim();
      stop = group.end;
    } else {
      if (command === 'include' || at === j) return j;
      let e = at;
      while (e < this.end && !/[\s{}%\\]/.test(src[e] as string)) e += 1;
      name = src.slice(at, e);
      stop = e;
    }
    if (this.target === this.para) this.flush();
    if (name !== '') this.includes.push({ command, name, span: { start: i, end: stop } });
    return stop;
  }

  /** `$…$` or `$$…$$` at `i`. */
  private dollar(i: number): number {
    if (this.src[i + 1] === '$') return this.displayMath(i, i + 2, '$$');
    return this.inlineMath(i, i + 1, '$');
  }

  /** Inline math from `from` to `close`: read as the Markdown reader reads `$…$`. An unclosed `$` prints itself. */
  private inlineMath(i: number, from: number, close: string): number {
    const stop = this.findClose(from, close);
    if (stop < 0) {
      this.target.pushVerbatim(this.src.slice(i, from), i);
      return from;
    }
    this.target.append(readMath(this.mathText(from, stop)));
    return stop + close.length;
  }

  /** Display math: a segment of its own between the paragraphs around it. */
  private displayMath(i: number, from: number, close: string): number {
    const stop = this.findClose(from, close);
    if (stop < 0) {
      this.target.pushVerbatim(this.src.slice(i, from), i);
      return from;
    }
    this.mathSegment(from, stop);
    return stop + close.length;
  }

  private mathSegment(from: number, to: number): void {
    if (this.target === this.para) this.flush();
    this.emit('math', readMath(this.mathText(from, to)));
  }

  /**
   * Where `close` first stands after `from`, or -1. A failed search is remembered with where it
   * gave up: a later opening before that point fails too without a second scan (keeps the pass linear).
   */
  private findClose(from: number, close: string): number {
    const failed = this.failedClose.get(close);
    if (failed && from >= failed.from && from < failed.stop) return -1;
    const found = findClose(this.src, from, this.end, close);
    if (found.at < 0) this.failedClose.set(close, { from, stop: found.stop });
    return found.at;
  }

  /** The math source from `from` to `to`, comments left out, each character at its offset. */
  private mathText(from: number, to: number): MappedText {
    const src = this.src;
    const text = new MappedText();
    let run = from;
    for (let k = from; k < to; k += 1) {
      const c = src[k];
      if (c === '\\') {
        let e = k + 1;
        while (e < to && isLetter(src[e])) e += 1;
        const macro = e > k + 1 ? this.macro(src.slice(k + 1, e), k, e) : undefined;
        if (macro !== undefined) {
          // a defined command in math prints its text there, placed at the command
          text.pushVerbatim(src.slice(run, k), run);
          text.pushSynthetic(macro, k, e);
          run = Math.min(skipEmptyGroup(src, e), to);
          k = run - 1;
          continue;
        }
        k += 1;
        continue;
      }
      if (c === '%') {
        text.pushVerbatim(src.slice(run, k), run);
        const nl = src.indexOf('\n', k);
        k = nl < 0 || nl >= to ? to : nl;
        run = k;
      }
    }
    text.pushVerbatim(src.slice(run, to), run);
    return text;
  }

  /** The cell read so far ends (at `&` when `split`, else at the row's end): a segment when it printed anything. */
  private endCell(split: boolean): void {
    const t = this.table;
    if (!t) return;
    const place: TablePlace = { table: t.index, row: t.row, column: t.column, ...(t.rowSpan ? { rowSpan: t.rowSpan } : {}), ...(t.colSpan ? { colSpan: t.colSpan } : {}) };
    const seg = this.emit('tableCell', t.cell, place);
    if (seg || split) t.rowHasCells = true;
    t.column += t.colSpan ?? 1;
    t.colSpan = undefined;
    t.rowSpan = undefined;
    t.cell = new MappedText();
    this.target = t.cell;
  }

  private endRow(): void {
    const t = this.table;
    if (!t) return;
    this.endCell(false);
    if (t.rowHasCells) t.row += 1;
    t.column = 0;
    t.rowHasCells = false;
  }

  /** The innermost table ends; a table inside a cell gives the cell back to its outer table. */
  private finishTable(): void {
    const t = this.table;
    if (!t) return;
    if (!t.inline) this.endCell(false);
    this.table = t.outer;
    this.target = t.outer ? t.outer.cell : this.para;
  }

  private startBlock(claim: boolean): number {
    this.block += 1;
    if (!claim) return this.block;
    for (const d of this.pending) d.appliesToBlock = this.block;
    this.pending = [];
    return this.block;
  }

  private flush(): void {
    if (this.para.text !== '') this.emit('paragraph', this.para);
    this.para = new MappedText();
    this.target = this.para;
  }

  /** A segment of `raw`, its surrounding whitespace left out (as the Markdown reader's blocks and cells are); `claim`: pending directives apply to it. */
  private emit(kind: SegmentKind, raw: MappedText, table?: TablePlace, claim = true): Segment | undefined {
    const text = normalize(raw).trimmed();
    if (text.text === '') return undefined;
    const seg: Segment = {
      id: this.segments.length,
      block: this.startBlock(claim),
      kind,
      text: text.text,
      starts: offsetArray(text.starts),
      ends: offsetArray(text.ends),
      ...(table ? { table } : {}),
      ...(this.section !== undefined && kind !== 'heading' ? { section: this.section } : {}),
    };
    this.segments.push(seg);
    return seg;
  }
}

/**
 * How many columns a tabular's column specification declares (`lcr` 3, `@{}c@{}` 1, `p{3cm}l` 2,
 * `*{3}{c}` 3, `S[table-format=1.2]` 1): a letter is a column, `|`, `@{…}`, `!{…}`, `>{…}` and
 * `<{…}` are not, and a column's own arguments (`p{3cm}`, `S[…]`) are skipped. One pass.
 */
export function columnCount(spec: string): number {
  let count = 0;
  let i = 0;
  const end = spec.length;
  while (i < end) {
    const c = spec[i] as string;
    if (c === '@' || c === '!' || c === '>' || c === '<') {
      const at = skipBlanks(spec, i + 1, end);
      i = spec[at] === '{' ? skipGroup(spec, at, end) : at;
      continue;
    }
    if (c === '*') {
      // `*{n}{spec}`: n times the columns of spec
      const a = skipBlanks(spec, i + 1, end);
      const b = spec[a] === '{' ? skipBlanks(spec, skipGroup(spec, a, end), end) : -1;
      if (b < 0 || spec[b] !== '{') return count + 1;
      const close = skipGroup(spec, b, end);
      const n = Number.parseInt(spec.slice(a + 1, skipGroup(spec, a, end) - 1).trim(), 10);
      count += (Number.isFinite(n) && n > 0 ? Math.min(n, 1000) : 1) * columnCount(spec.slice(b + 1, Math.max(b + 1, close - 1)));
      i = close;
      continue;
    }
    if (isLetter(c)) {
      count += 1;
      i += 1;
      // the column's arguments: `p{3cm}`, `S[table-format=1.2]`, `w{c}{2cm}`
      for (;;) {
        const at = skipBlanks(spec, i, end);
        if (spec[at] === '{') i = skipGroup(spec, at, end);
        else if (spec[at] === '[') i = skipOptional(spec, at, end);
        else break;
      }
      continue;
    }
    i += 1;
  }
  return count;
}

/** The first match of a global `pattern` that is not inside a comment, or undefined. */
function findOutsideComments(src: string, pattern: RegExp): { index: number; length: number } | undefined {
  pattern.lastIndex = 0;
  for (let m = pattern.exec(src); m; m = pattern.exec(src)) {
    if (!inComment(src, m.index)) return { index: m.index, length: m[0].length };
  }
  return undefined;
}

/** Whether offset `at` lies in a `%` comment (an unescaped `%` before it on its line). */
function inComment(src: string, at: number): boolean {
  let k = at;
  while (k > 0 && src[k - 1] !== '\n' && src[k - 1] !== '\r') k -= 1;
  for (; k < at; k += 1) {
    if (src[k] === '\\') k += 1;
    else if (src[k] === '%') return true;
  }
  return false;
}

function skipBlanks(src: string, from: number, end: number): number {
  let k = from;
  while (k < end && isBlank(src[k])) k += 1;
  return k;
}

/** `{}` right after a command (`\ldots{}`): nothing printed. */
function skipEmptyGroup(src: string, at: number): number {
  return src[at] === '{' && src[at + 1] === '}' ? at + 2 : at;
}

/** Past an optional argument `[…]` opening at `at` (on one line, at most 400 characters), or `at`. */
function skipOptional(src: string, at: number, end: number): number {
  if (src[at] !== '[') return at;
  let depth = 0;
  const limit = Math.min(end, at + 400);
  for (let k = at; k < limit; k += 1) {
    const c = src[k];
    if (c === '\\') k += 1;
    else if (c === '{') depth += 1;
    else if (c === '}') depth -= 1;
    else if (c === '\n' && src[k + 1] === '\n') return at;
    else if (c === ']' && depth === 0) return k + 1;
  }
  return at;
}

/** Past the brace group opening at `at` (comments and escapes respected), or `end` when it never closes. */
function skipGroup(src: string, at: number, end: number): number {
  let depth = 0;
  for (let k = at; k < end; k += 1) {
    const c = src[k];
    if (c === '\\') k += 1;
    else if (c === '%') {
      const nl = src.indexOf('\n', k);
      if (nl < 0) return end;
      k = nl;
    } else if (c === '{') depth += 1;
    else if (c === '}') {
      depth -= 1;
      if (depth === 0) return k + 1;
    }
  }
  return end;
}

/**
 * The text of a short brace group at `at` (a name or a count: closed within NAME_LIMIT
 * characters) and the offset after it, or undefined when there is none.
 */
function readGroup(src: string, at: number, end: number): { text: string; end: number } | undefined {
  if (src[at] !== '{') return undefined;
  const limit = Math.min(end, at + NAME_LIMIT);
  for (let k = at + 1; k < limit; k += 1) {
    const c = src[k];
    if (c === '}') return { text: src.slice(at + 1, k), end: k + 1 };
    if (c === '{') return undefined;
  }
  return undefined;
}

/** How long an environment's name, a file name or a span count may be (keeps a stray `\begin{` from reading on). */
const NAME_LIMIT = 400;

/**
 * Where `close` (`$`, `$$`, `\)`, `\]`) first stands unescaped after `from` (`at`, or -1), and
 * where the search stopped: inline math ends at a blank line, display math at the end.
 */
function findClose(src: string, from: number, end: number, close: string): { at: number; stop: number } {
  const inline = close === '$' || close === '\\)';
  for (let k = from; k < end; k += 1) {
    const c = src[k];
    if (c === '\\') {
      if (src.startsWith(close, k)) return { at: k, stop: k };
      k += 1;
      continue;
    }
    if (c === '%') {
      const nl = src.indexOf('\n', k);
      if (nl < 0) return { at: -1, stop: end };
      k = nl - 1;
      continue;
    }
    if (inline && c === '\n' && BLANK_LINE_AHEAD.test(src.slice(k, k + 40))) return { at: -1, stop: k };
    if (src.startsWith(close, k)) return { at: k, stop: k };
  }
  return { at: -1, stop: end };
}

const BLANK_LINE_AHEAD = /^\n[ \t]*\r?\n/;
