import { TEX_ENCODINGS } from './texEncodings.js';

/**
 * Characters pdf.js could not read, recovered from what the font itself says.
 *
 * pdf.js gives each character of a simple (one byte a code) font the Unicode of the font's
 * ToUnicode map, else of its glyph name when the Adobe Glyph List knows it. When neither says
 * anything (a ToUnicode map without an entry for the code, a glyph name of the font maker's own
 * scheme), it hands out the character whose number is the code: `=` set in a symbol font at code
 * 33 reads `!`. What can still be known, read from pdf.js's own record of the font (its
 * `/Differences` glyph names, its built-in or base encoding, its name):
 * - glyph names of a scheme of their own whose meaning is known (GLYPH_NAMES);
 * - the standard TeX fonts by name (CMMI, CMSY, CMR and kin), whose code tables are the TeX
 *   encodings OML, OMS and OT1 (texEncodings.ts), when the glyph names say nothing.
 * A code is recovered only when the character pdf.js shows for it is shown for no other code of
 * the font (otherwise which code printed it is not known) and is not a space (pdf.js inserts
 * spaces between words); a code the font names but that nothing here reads is unreadable, and
 * the pages where such characters are printed get a note.
 */

/**
 * Glyph names outside the Adobe Glyph List, as the Mathematical Pi symbol fonts (and the
 * "Universal … with Math Pi" fonts built on them) name their glyphs, some of them set in
 * published articles without a ToUnicode entry. There is no published table of these names:
 * common practice, no source (from memory). Only the operators whose reading is beyond doubt are
 * kept; the five set in a measured article (`=`, `>`, `−`, `<`, `×`) agree with its printed page.
 */
export const GLYPH_NAMES: Readonly<Record<string, string>> = {
  H11001: '+',
  H11002: '\u2212',
  H11003: '\u00D7',
  H11005: '=',
  H11006: '\u00B1',
  H11021: '<',
  H11022: '>',
};

/** A subset font's name starts with six capitals and `+` (ISO 32000-1, 9.6.4). */
const SUBSET_PREFIX = /^[A-Z]{6}\+/;

/** The TeX encoding of a font named as one of the standard TeX fonts, if any. */
export function texEncodingOf(fontName: string): readonly (string | undefined)[] | undefined {
  const bare = fontName.replace(SUBSET_PREFIX, '').toUpperCase();
  for (const e of TEX_ENCODINGS) if (e.fonts.test(bare)) return e.codes;
  return undefined;
}

/** What pdf.js records of a font (with `fontExtraProperties`), the parts read here. */
export interface FontRecord {
  name?: string;
  composite?: boolean;
  isType3Font?: boolean;
  differences?: ArrayLike<string | undefined> | Record<string, string>;
  defaultEncoding?: ArrayLike<string | undefined>;
  toUnicode?: { _map?: ArrayLike<string | undefined | null> } | Record<string, unknown>;
}

/** How one font's characters as pdf.js shows them are read. */
export interface FontRepair {
  /** The font's name without its subset prefix, for notes. */
  name: string;
  /** Character pdf.js shows → the character the font says it is. */
  recovered: Map<string, string>;
  /** Characters pdf.js shows for codes that nothing here reads. */
  unreadable: Set<string>;
}

/**
 * How the characters pdf.js shows for `font` are to be read, or undefined when pdf.js read them
 * all (nothing to repair). Composite fonts (two-byte codes) are left as pdf.js reads them.
 */
export function repairOf(font: FontRecord): FontRepair | undefined {
  if (font.composite) return undefined;
  const map = (font.toUnicode as { _map?: ArrayLike<string | undefined | null> } | undefined)?._map;
  // an identity map (`firstChar`/`lastChar`): every code has its character
  if (font.toUnicode !== undefined && map === undefined) return undefined;
  const differences = font.differences as Record<string, string | undefined> | undefined;
  const base = font.defaultEncoding;
  const tex = texEncodingOf(font.name ?? '');
  const shownByMapped = new Set<string>();
  const unmapped: Array<{ code: number; name: string | undefined; named: boolean }> = [];
  for (let code = 0; code < 256; code += 1) {
    const u = map?.[code];
    if (typeof u === 'string' && u !== '') {
      shownByMapped.add(u);
      continue;
    }
    const own = differences?.[code];
    const name = own ?? base?.[code] ?? undefined;
    if ((name === undefined || name === '' || name === '.notdef') && tex?.[code] === undefined) continue;
    unmapped.push({ code, name: name === '' ? undefined : name, named: own !== undefined && own !== '' && own !== '.notdef' });
  }
  if (unmapped.length === 0) return undefined;
  const recovered = new Map<string, string>();
  const unreadable = new Set<string>();
  for (const { code, name, named } of unmapped) {
    const shown = String.fromCharCode(code);
    // pdf.js also puts spaces of its own between words, in the font of the text around them: a
    // space is never read as a glyph (OML's code 32 is ψ, rarely set; it stays a space)
    if (shownByMapped.has(shown) || shown === ' ' || shown === '\u00A0') continue;
    const read = (name !== undefined ? GLYPH_NAMES[name] : undefined) ?? tex?.[code];
    if (read !== undefined) recovered.set(shown, read);
    // Unreadable: a code the font's own /Differences names with a name nothing reads. A name of
    // a standard base encoding (a code the font may not even use) is left as pdf.js shows it.
    else if (named) unreadable.add(shown);
  }
  if (recovered.size === 0 && unreadable.size === 0) return undefined;
  return { name: (font.name ?? '').replace(SUBSET_PREFIX, ''), recovered, unreadable };
}

/** A run's text read with its font's repair: recovered characters replaced, and whether any stayed unreadable. */
export function repairText(str: string, repair: FontRepair): { text: string; unreadable: number } {
  let text = '';
  let unreadable = 0;
  for (const c of str) {
    const r = repair.recovered.get(c);
    if (r !== undefined) text += r;
    else {
      if (repair.unreadable.has(c)) unreadable += 1;
      text += c;
    }
  }
  return { text, unreadable };
}
