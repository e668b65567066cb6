import { formatForPath, readLatexIncludes, type LatexInclude } from '../parse/index.js';
import type { ReadNote } from '../parse/types.js';

/** How many `\input`/`\include` deep a chain is followed. */
export const INCLUDE_DEPTH_LIMIT = 8;

const DRIVE = /^[A-Za-z]:/;
const SEPARATOR = /[\\/]/;

/**
 * Why an `\input`/`\include` name is not followed before any file is looked at, or undefined:
 * only names inside the manuscript's folder are (an absolute name, a drive, `~`, a leading
 * backslash, or a `..` part are refused). The command line and the library share it.
 */
export function includeNameProblem(name: string): string | undefined {
  if (name.startsWith('/') || DRIVE.test(name) || name.startsWith('~') || name.startsWith('\\')) return 'an absolute path; only files inside the manuscript\'s folder are followed';
  if (name.split(SEPARATOR).includes('..')) return 'the name climbs out of the manuscript\'s folder with ".."; only files inside it are followed';
  return undefined;
}

/** The file names TeX tries for an include, in its order: `name.tex` first (always for `\include`), then `name` when it has an extension of its own. */
export function includeCandidates(inc: LatexInclude): string[] {
  const last = inc.name.split(SEPARATOR).at(-1) ?? '';
  const withTex = `${inc.name}.tex`;
  // an extension as Node's extname sees one: a dot after the name's first character
  return inc.command === 'include' || last.lastIndexOf('.') <= 0 ? [withTex, inc.name] : [inc.name];
}

/**
 * Reads the files a LaTeX manuscript includes, for `checkWithIncludes`. The library has no file
 * system of its own (the browser page has none): the caller says where names lead.
 */
export interface IncludeReader {
  /**
   * The text of the file `name`: a path relative to the main manuscript's folder, `/` between
   * its parts, never absolute and never climbing out with `..` (those are refused before the
   * reader is asked). Undefined when there is no such file; `{ refused }`, with the reason in
   * words, when the file must not be read (a reader over a file system refuses a name whose real
   * path, symbolic links resolved, leaves the folder: see `folderIncludeReader`).
   */
  read(name: string): string | { refused: string } | undefined;
}

/** A file an include leads to: its name as the report gives it and its text. */
export interface IncludedSource {
  /** The main manuscript's folder (as its path gives it) joined with the name, `/` between. */
  path: string;
  source: string;
  /** Notes on its own includes that were not followed. */
  notes: ReadNote[];
}

/**
 * Follows the `\input`/`\include` of a LaTeX manuscript through `reader`, as the command line
 * does on disk: names looked up from the main file's folder (TeX's rule), each file once, a
 * cycle or a chain past INCLUDE_DEPTH_LIMIT stopped, names outside the folder refused, files not
 * LaTeX (`\input{plot.pgf}`) left alone. Returns the main file's notes and the included files in
 * reading order (each right after the file that includes it).
 */
export function followIncludes(path: string, source: string, reader: IncludeReader): { notes: ReadNote[]; files: IncludedSource[] } {
  const cut = Math.max(path.lastIndexOf('/'), path.lastIndexOf('\\'));
  const folder = cut >= 0 ? path.slice(0, cut) : '';
  const seen = new Set<string>();
  const files: IncludedSource[] = [];
  const visit = (text: string, chain: readonly string[]): ReadNote[] => {
    const notes: ReadNote[] = [];
    for (const inc of readLatexIncludes(text)) {
      const note = (why: string) => notes.push({ kind: 'include-not-read', message: `\\${inc.command}{${inc.name}} (${why})`, span: inc.span });
      const problem = includeNameProblem(inc.name);
      if (problem !== undefined) {
        note(problem);
        continue;
      }
      if (chain.length > INCLUDE_DEPTH_LIMIT) {
        note(`includes nest more than ${INCLUDE_DEPTH_LIMIT} deep here; the chain was not followed further`);
        continue;
      }
      const candidates = includeCandidates(inc).map(normalName);
      let found: { name: string; text: string } | undefined;
      let refused: string | undefined;
      let cycle = false;
      for (const name of candidates) {
        // a file on the chain (the main one too, which the reader may not hold) is not read again
        if (chain.includes(name)) {
          cycle = true;
          break;
        }
        let got: ReturnType<IncludeReader['read']>;
        try {
          got = reader.read(name);
        } catch (e) {
          got = { refused: `it could not be read: ${e instanceof Error ? e.message : String(e)}` };
        }
        if (got === undefined) continue;
        if (typeof got === 'string') found = { name, text: got };
        else refused = got.refused;
        break;
      }
      if (cycle) {
        note(`it leads back to ${chain.length === 1 ? 'this file' : 'a file that includes this one'} (a cycle); it was not read again`);
        continue;
      }
      if (refused !== undefined) {
        note(refused);
        continue;
      }
      if (!found) {
        note(`no such file in the manuscript's folder (looked for ${candidates.join(' and ')})`);
        continue;
      }
      // drawing code or data (`\input{plot.pgf}`), or a file already read: nothing to say
      if (formatForPath(found.name) !== 'latex' || seen.has(found.name)) continue;
      seen.add(found.name);
      const file: IncludedSource = { path: folder === '' ? found.name : `${folder}/${found.name}`, source: found.text, notes: [] };
      files.push(file);
      file.notes = visit(found.text, [...chain, found.name]);
    }
    return notes;
  };
  const main = normalName(path.slice(cut + 1));
  seen.add(main);
  return { notes: visit(source, [main]), files };
}

/** `a/./b//c.tex` as `a/b/c.tex`: one spelling per file, to tell files apart. */
function normalName(name: string): string {
  return name
    .split(SEPARATOR)
    .filter((p) => p !== '' && p !== '.')
    .join('/');
}
