"""Writes src/parse/pdf/texEncodings.ts: the code tables of the standard TeX fonts (encodings
OML for CMMI, OMS for CMSY, OT1 for CMR and its text kin), as Unicode.

Source: the font metrics of the AMS Type 1 Computer Modern fonts, cmmi10.afm, cmsy10.afm and
cmr10.afm, as Debian ships them in python-matplotlib-data (/usr/share/matplotlib/mpl-data/fonts/afm).
Each `C code ; ... ; N name ;` line gives a code and its glyph name; the glyph names are Adobe
Glyph List names (or AMS names for TeX's own symbols), read to Unicode with the table below
(Unicode code points by character name, checked here with unicodedata). A name not in the
table is left out: that code stays unread and the PDF reader says so.

Run: python3 scripts/make_tex_encodings.py  (no third-party module needed)
"""
import os
import sys
import unicodedata

AFM = '/usr/share/matplotlib/mpl-data/fonts/afm'
OUT = os.path.join(os.path.dirname(__file__), '..', 'src', 'parse', 'pdf', 'texEncodings.ts')

# glyph name -> Unicode character name (checked below with unicodedata.lookup)
NAMES = {
    'Gamma': 'GREEK CAPITAL LETTER GAMMA', 'Delta': 'GREEK CAPITAL LETTER DELTA', 'Theta': 'GREEK CAPITAL LETTER THETA',
    'Lambda': 'GREEK CAPITAL LETTER LAMDA', 'Xi': 'GREEK CAPITAL LETTER XI', 'Pi': 'GREEK CAPITAL LETTER PI',
    'Sigma': 'GREEK CAPITAL LETTER SIGMA', 'Upsilon': 'GREEK CAPITAL LETTER UPSILON', 'Phi': 'GREEK CAPITAL LETTER PHI',
    'Psi': 'GREEK CAPITAL LETTER PSI', 'Omega': 'GREEK CAPITAL LETTER OMEGA',
    'alpha': 'GREEK SMALL LETTER ALPHA', 'beta': 'GREEK SMALL LETTER BETA', 'gamma': 'GREEK SMALL LETTER GAMMA',
    'delta': 'GREEK SMALL LETTER DELTA', 'epsilon1': 'GREEK LUNATE EPSILON SYMBOL', 'zeta': 'GREEK SMALL LETTER ZETA',
    'eta': 'GREEK SMALL LETTER ETA', 'theta': 'GREEK SMALL LETTER THETA', 'iota': 'GREEK SMALL LETTER IOTA',
    'kappa': 'GREEK SMALL LETTER KAPPA', 'lambda': 'GREEK SMALL LETTER LAMDA', 'mu': 'GREEK SMALL LETTER MU',
    'nu': 'GREEK SMALL LETTER NU', 'xi': 'GREEK SMALL LETTER XI', 'pi': 'GREEK SMALL LETTER PI',
    'rho': 'GREEK SMALL LETTER RHO', 'sigma': 'GREEK SMALL LETTER SIGMA', 'tau': 'GREEK SMALL LETTER TAU',
    'upsilon': 'GREEK SMALL LETTER UPSILON', 'phi': 'GREEK PHI SYMBOL', 'chi': 'GREEK SMALL LETTER CHI',
    'psi': 'GREEK SMALL LETTER PSI', 'omega': 'GREEK SMALL LETTER OMEGA', 'epsilon': 'GREEK SMALL LETTER EPSILON',
    'theta1': 'GREEK THETA SYMBOL', 'pi1': 'GREEK PI SYMBOL', 'rho1': 'GREEK RHO SYMBOL',
    'sigma1': 'GREEK SMALL LETTER FINAL SIGMA', 'phi1': 'GREEK SMALL LETTER PHI',
    'period': 'FULL STOP', 'comma': 'COMMA', 'less': 'LESS-THAN SIGN', 'slash': 'SOLIDUS', 'greater': 'GREATER-THAN SIGN',
    'star': 'STAR OPERATOR', 'partialdiff': 'PARTIAL DIFFERENTIAL',
    'exclam': 'EXCLAMATION MARK', 'quotedblright': 'RIGHT DOUBLE QUOTATION MARK', 'numbersign': 'NUMBER SIGN',
    'dollar': 'DOLLAR SIGN', 'percent': 'PERCENT SIGN', 'ampersand': 'AMPERSAND', 'quoteright': 'RIGHT SINGLE QUOTATION MARK',
    'parenleft': 'LEFT PARENTHESIS', 'parenright': 'RIGHT PARENTHESIS', 'asterisk': 'ASTERISK', 'plus': 'PLUS SIGN',
    'hyphen': 'HYPHEN-MINUS', 'colon': 'COLON', 'semicolon': 'SEMICOLON', 'exclamdown': 'INVERTED EXCLAMATION MARK',
    'equal': 'EQUALS SIGN', 'questiondown': 'INVERTED QUESTION MARK', 'question': 'QUESTION MARK', 'at': 'COMMERCIAL AT',
    'bracketleft': 'LEFT SQUARE BRACKET', 'quotedblleft': 'LEFT DOUBLE QUOTATION MARK', 'bracketright': 'RIGHT SQUARE BRACKET',
    'quoteleft': 'LEFT SINGLE QUOTATION MARK', 'endash': 'EN DASH', 'emdash': 'EM DASH',
    'dotlessi': 'LATIN SMALL LETTER DOTLESS I', 'dotlessj': 'LATIN SMALL LETTER DOTLESS J',
    'germandbls': 'LATIN SMALL LETTER SHARP S', 'ae': 'LATIN SMALL LETTER AE', 'oe': 'LATIN SMALL LIGATURE OE',
    'oslash': 'LATIN SMALL LETTER O WITH STROKE', 'AE': 'LATIN CAPITAL LETTER AE', 'OE': 'LATIN CAPITAL LIGATURE OE',
    'Oslash': 'LATIN CAPITAL LETTER O WITH STROKE',
    'minus': 'MINUS SIGN', 'periodcentered': 'MIDDLE DOT', 'multiply': 'MULTIPLICATION SIGN', 'asteriskmath': 'ASTERISK OPERATOR',
    'divide': 'DIVISION SIGN', 'plusminus': 'PLUS-MINUS SIGN', 'minusplus': 'MINUS-OR-PLUS SIGN', 'bullet': 'BULLET',
    'equivalence': 'IDENTICAL TO', 'lessequal': 'LESS-THAN OR EQUAL TO', 'greaterequal': 'GREATER-THAN OR EQUAL TO',
    'similar': 'TILDE OPERATOR', 'approxequal': 'ALMOST EQUAL TO', 'lessmuch': 'MUCH LESS-THAN', 'greatermuch': 'MUCH GREATER-THAN',
    'arrowleft': 'LEFTWARDS ARROW', 'arrowright': 'RIGHTWARDS ARROW', 'similarequal': 'ASYMPTOTICALLY EQUAL TO',
    'proportional': 'PROPORTIONAL TO', 'prime': 'PRIME', 'infinity': 'INFINITY', 'element': 'ELEMENT OF',
    'braceleft': 'LEFT CURLY BRACKET', 'braceright': 'RIGHT CURLY BRACKET', 'bar': 'VERTICAL LINE', 'bardbl': 'DOUBLE VERTICAL LINE',
    'backslash': 'REVERSE SOLIDUS', 'radical': 'SQUARE ROOT', 'nabla': 'NABLA', 'integral': 'INTEGRAL', 'section': 'SECTION SIGN',
    'dagger': 'DAGGER', 'daggerdbl': 'DOUBLE DAGGER', 'paragraph': 'PILCROW SIGN', 'emptyset': 'EMPTY SET',
    'logicalnot': 'NOT SIGN', 'universal': 'FOR ALL', 'existential': 'THERE EXISTS',
}
for i, d in enumerate('zero one two three four five six seven eight nine'.split()):
    NAMES[d] = f'DIGIT {d.upper()}'
    NAMES[d + 'oldstyle'] = f'DIGIT {d.upper()}'
for c in 'ABCDEFGHIJKLMNOPQRSTUVWXYZ':
    NAMES[c] = f'LATIN CAPITAL LETTER {c}'
    NAMES[c.lower()] = f'LATIN SMALL LETTER {c}'
# ligatures are spelled out, as the PDF reader spells out ligature characters
SPELLED = {'ff': 'ff', 'fi': 'fi', 'fl': 'fl', 'ffi': 'ffi', 'ffl': 'ffl'}


def table(afm):
    codes = {}
    with open(os.path.join(AFM, afm + '.afm'), encoding='latin-1') as f:
        for line in f:
            if not line.startswith('C '):
                continue
            parts = [p.strip() for p in line.split(';')]
            code = int(parts[0].split()[1])
            name = next(p.split()[1] for p in parts if p.startswith('N '))
            if code < 0:
                continue
            if name in SPELLED:
                codes[code] = SPELLED[name]
            elif name in NAMES:
                codes[code] = unicodedata.lookup(NAMES[name])
    return codes


def ts_table(codes):
    cells = [json_char(codes.get(c)) for c in range(128)]
    rows = [', '.join(cells[i:i + 16]) for i in range(0, 128, 16)]
    return '[\n    ' + ',\n    '.join(rows) + ',\n  ]'


def json_char(c):
    if c is None:
        return 'undefined'
    return "'" + ''.join(ch if 0x20 <= ord(ch) < 0x7f and ch not in "'\\" else f'\\u{ord(ch):04X}' for ch in c) + "'"


def main():
    oml, oms, ot1 = table('cmmi10'), table('cmsy10'), table('cmr10')
    out = [
        '// Written by scripts/make_tex_encodings.py from the AMS Computer Modern font metrics',
        '// (cmmi10.afm, cmsy10.afm, cmr10.afm as Debian ships them); do not edit by hand.',
        '',
        '/** The code tables of the standard TeX fonts (TeX encodings OML, OMS, OT1), as Unicode; undefined: not read. */',
        'export const TEX_ENCODINGS: ReadonlyArray<{ encoding: string; fonts: RegExp; codes: readonly (string | undefined)[] }> = [',
        f"  {{ encoding: 'OML', fonts: /^CMMIB?[0-9]+$/, codes: {ts_table(oml)} }},",
        f"  {{ encoding: 'OMS', fonts: /^CMB?SY[0-9]+$/, codes: {ts_table(oms)} }},",
        # text italics put the pound sign at the dollar's code (common practice, no source); left out there
        f"  {{ encoding: 'OT1', fonts: /^CM(?:R|BX|SL|SS|SSBX|SSI|BXSL|B|SSDC|SSQ|SSQI|DUNH|FIB|FF)[0-9]+$/, codes: {ts_table(ot1)} }},",
        f"  {{ encoding: 'OT1 italic', fonts: /^CM(?:TI|BXTI|U)[0-9]+$/, codes: {ts_table({k: v for k, v in ot1.items() if k != 36})} }},",
        '];',
        '',
    ]
    with open(OUT, 'w', encoding='utf-8') as f:
        f.write('\n'.join(out))
    print(f'OML {len(oml)}, OMS {len(oms)}, OT1 {len(ot1)} codes read -> {os.path.relpath(OUT)}', file=sys.stderr)


main()
