import { readFileSync, realpathSync, statSync } from 'node:fs';
import { isAbsolute, join, relative, resolve, sep } from 'node:path';
import { decodeBytes, formatForPath, includeCandidates, includeNameProblem, INCLUDE_DEPTH_LIMIT, readLatexIncludes, type IncludeReader, type LatexInclude, type ReadNote } from '../engine/index.js';

export { INCLUDE_DEPTH_LIMIT };

/** A file an `\input`/`\include` leads to, to be checked as a document of its own. */
export interface IncludedFile {
  /** Named as the manuscripts are: the manuscript's folder as given, joined with the name. */
  path: string;
  /** Absolute path, to read it by. */
  absolute: string;
  /** Real path (symbolic links resolved): the identity of the file in the run and on the chain. */
  real: string;
}

/**
 * Follows a LaTeX manuscript's `\input{…}` and `\include{…}` within its folder. TeX looks names
 * up from the folder of the main file (the one compiled), so every file of a chain is looked up
 * from `root`, the main manuscript's folder; a name without an extension gets `.tex` (as TeX
 * tries it first; `\include` always adds it). Refused, with a note at the command: an absolute
 * name or one with a `..` part, a path whose real location (symbolic links resolved) is outside
 * the folder, a missing file, a file already on the chain that leads to it (a cycle), and a chain
 * deeper than INCLUDE_DEPTH_LIMIT. A file already in the run (named, walked or included before)
 * is not read twice and needs no note.
 */
export class IncludeFollower {
  private readonly rootReal: string | undefined;

  /**
   * `root` is the main manuscript's folder (absolute); `shownRoot` the same folder as the
   * manuscripts are named (relative to the working folder when given so); `inRun` holds the real
   * paths already checked in this run (updated as files are added).
   */
  constructor(
    private readonly root: string,
    private readonly shownRoot: string,
    private readonly inRun: Set<string>,
  ) {
    this.rootReal = realOrUndefined(root);
  }

  /**
   * The includes of `source` (the text of the file at real path `real`, `chain` the real paths
   * that led to it, itself last): the files to read next, and notes for those not read.
   */
  follow(source: string, chain: readonly string[]): { files: Array<IncludedFile>; notes: ReadNote[] } {
    const files: Array<IncludedFile> = [];
    const notes: ReadNote[] = [];
    for (const inc of readLatexIncludes(source)) {
      const r = this.resolve(inc, chain);
      if ('why' in r) notes.push({ kind: 'include-not-read', message: `\\${inc.command}{${inc.name}} (${r.why})`, span: inc.span });
      else if (r.file && !this.inRun.has(r.file.real)) {
        this.inRun.add(r.file.real);
        files.push(r.file);
      }
    }
    return { files, notes };
  }

  private resolve(inc: LatexInclude, chain: readonly string[]): { file?: IncludedFile } | { why: string } {
    const problem = includeNameProblem(inc.name);
    if (problem !== undefined) return { why: problem };
    if (this.rootReal === undefined) return { why: 'the manuscript\'s folder could not be resolved' };
    if (chain.length > INCLUDE_DEPTH_LIMIT) return { why: `includes nest more than ${INCLUDE_DEPTH_LIMIT} deep here; the chain was not followed further` };
    const candidates = includeCandidates(inc);
    let chosen: string | undefined;
    for (const c of candidates) {
      try {
        if (statSync(resolve(this.root, c)).isFile()) {
          chosen = c;
          break;
        }
      } catch {
        // missing: the next spelling, or a note below
      }
    }
    if (chosen === undefined) return { why: `no such file in the manuscript's folder (looked for ${candidates.join(' and ')})` };
    const absolute = resolve(this.root, chosen);
    const real = realOrUndefined(absolute);
    if (real === undefined || !isInside(real, this.rootReal)) return { why: 'it leads outside the manuscript\'s folder (through a symbolic link); only files inside it are followed' };
    if (chain.includes(real)) return { why: `it leads back to ${chain.length === 1 ? 'this file' : 'a file that includes this one'} (a cycle); it was not read again` };
    // `\input{plot.pgf}`, `\input{table.csv}`: drawing code or data, not prose
    if (formatForPath(absolute) !== 'latex') return {};
    return { file: { path: this.shownRoot === '' || this.shownRoot === '.' ? chosen.split(/[\\/]/).join(sep) : join(this.shownRoot, chosen), absolute, real } };
  }
}

/** The real path, or undefined when it cannot be resolved. */
export function realOrUndefined(path: string): string | undefined {
  try {
    return realpathSync(path);
  } catch {
    return undefined;
  }
}

function isInside(real: string, root: string): boolean {
  const rel = relative(root, real);
  return rel === '' || (!rel.startsWith('..') && !isAbsolute(rel));
}

/**
 * An IncludeReader (for checkWithIncludes) over the folder `folder` on disk: a name that leads to
 * no file is missing; one whose real path (symbolic links resolved) is outside the folder is
 * refused; a file that cannot be decoded as text is refused with the reason.
 */
export function folderIncludeReader(folder: string): IncludeReader {
  const root = resolve(folder);
  const rootReal = realOrUndefined(root);
  return {
    read(name) {
      const absolute = resolve(root, name);
      try {
        if (!statSync(absolute).isFile()) return undefined;
      } catch {
        return undefined;
      }
      const real = realOrUndefined(absolute);
      if (rootReal === undefined || real === undefined || !isInside(real, rootReal)) return { refused: 'it leads outside the manuscript\'s folder (through a symbolic link); only files inside it are followed' };
      const decoded = decodeBytes(new Uint8Array(readFileSync(absolute)));
      return decoded.ok ? decoded.text : { refused: decoded.reason };
    },
  };
}
