// Written by scripts/make_tex_encodings.py from the AMS Computer Modern font metrics
// (cmmi10.afm, cmsy10.afm, cmr10.afm as Debian ships them); do not edit by hand.

/** The code tables of the standard TeX fonts (TeX encodings OML, OMS, OT1), as Unicode; undefined: not read. */
export const TEX_ENCODINGS: ReadonlyArray<{ encoding: string; fonts: RegExp; codes: readonly (string | undefined)[] }> = [
  { encoding: 'OML', fonts: /^CMMIB?[0-9]+$/, codes: [
    '\u0393', '\u0394', '\u0398', '\u039B', '\u039E', '\u03A0', '\u03A3', '\u03A5', '\u03A6', '\u03A8', '\u03A9', '\u03B1', '\u03B2', '\u03B3', '\u03B4', '\u03F5',
    '\u03B6', '\u03B7', '\u03B8', '\u03B9', '\u03BA', '\u03BB', '\u03BC', '\u03BD', '\u03BE', '\u03C0', '\u03C1', '\u03C3', '\u03C4', '\u03C5', '\u03D5', '\u03C7',
    '\u03C8', '\u03C9', '\u03B5', '\u03D1', '\u03D6', '\u03F1', '\u03C2', '\u03C6', undefined, undefined, undefined, undefined, undefined, undefined, undefined, undefined,
    '0', '1', '2', '3', '4', '5', '6', '7', '8', '9', '.', ',', '<', '/', '>', '\u22C6',
    '\u2202', 'A', 'B', 'C', 'D', 'E', 'F', 'G', 'H', 'I', 'J', 'K', 'L', 'M', 'N', 'O',
    'P', 'Q', 'R', 'S', 'T', 'U', 'V', 'W', 'X', 'Y', 'Z', undefined, undefined, undefined, undefined, undefined,
    undefined, 'a', 'b', 'c', 'd', 'e', 'f', 'g', 'h', 'i', 'j', 'k', 'l', 'm', 'n', 'o',
    'p', 'q', 'r', 's', 't', 'u', 'v', 'w', 'x', 'y', 'z', '\u0131', '\u0237', undefined, undefined, undefined,
  ] },
  { encoding: 'OMS', fonts: /^CMB?SY[0-9]+$/, codes: [
    '\u2212', '\u00B7', '\u00D7', '\u2217', '\u00F7', undefined, '\u00B1', '\u2213', undefined, undefined, undefined, undefined, undefined, undefined, undefined, '\u2022',
    undefined, '\u2261', undefined, undefined, '\u2264', '\u2265', undefined, undefined, '\u223C', '\u2248', undefined, undefined, '\u226A', '\u226B', undefined, undefined,
    '\u2190', '\u2192', undefined, undefined, undefined, undefined, undefined, '\u2243', undefined, undefined, undefined, undefined, undefined, undefined, undefined, '\u221D',
    '\u2032', '\u221E', '\u2208', undefined, undefined, undefined, undefined, undefined, '\u2200', '\u2203', '\u00AC', '\u2205', undefined, undefined, undefined, undefined,
    undefined, 'A', 'B', 'C', 'D', 'E', 'F', 'G', 'H', 'I', 'J', 'K', 'L', 'M', 'N', 'O',
    'P', 'Q', 'R', 'S', 'T', 'U', 'V', 'W', 'X', 'Y', 'Z', undefined, undefined, undefined, undefined, undefined,
    undefined, undefined, undefined, undefined, undefined, undefined, '{', '}', undefined, undefined, '|', '\u2016', undefined, undefined, '\u005C', undefined,
    '\u221A', undefined, '\u2207', '\u222B', undefined, undefined, undefined, undefined, '\u00A7', '\u2020', '\u2021', '\u00B6', undefined, undefined, undefined, undefined,
  ] },
  { encoding: 'OT1', fonts: /^CM(?:R|BX|SL|SS|SSBX|SSI|BXSL|B|SSDC|SSQ|SSQI|DUNH|FIB|FF)[0-9]+$/, codes: [
    '\u0393', '\u0394', '\u0398', '\u039B', '\u039E', '\u03A0', '\u03A3', '\u03A5', '\u03A6', '\u03A8', '\u03A9', 'ff', 'fi', 'fl', 'ffi', 'ffl',
    '\u0131', '\u0237', undefined, undefined, undefined, undefined, undefined, undefined, undefined, '\u00DF', '\u00E6', '\u0153', '\u00F8', '\u00C6', '\u0152', '\u00D8',
    undefined, '!', '\u201D', '#', '$', '%', '&', '\u2019', '(', ')', '*', '+', ',', '-', '.', '/',
    '0', '1', '2', '3', '4', '5', '6', '7', '8', '9', ':', ';', '\u00A1', '=', '\u00BF', '?',
    '@', 'A', 'B', 'C', 'D', 'E', 'F', 'G', 'H', 'I', 'J', 'K', 'L', 'M', 'N', 'O',
    'P', 'Q', 'R', 'S', 'T', 'U', 'V', 'W', 'X', 'Y', 'Z', '[', '\u201C', ']', undefined, undefined,
    '\u2018', 'a', 'b', 'c', 'd', 'e', 'f', 'g', 'h', 'i', 'j', 'k', 'l', 'm', 'n', 'o',
    'p', 'q', 'r', 's', 't', 'u', 'v', 'w', 'x', 'y', 'z', '\u2013', '\u2014', undefined, undefined, undefined,
  ] },
  { encoding: 'OT1 italic', fonts: /^CM(?:TI|BXTI|U)[0-9]+$/, codes: [
    '\u0393', '\u0394', '\u0398', '\u039B', '\u039E', '\u03A0', '\u03A3', '\u03A5', '\u03A6', '\u03A8', '\u03A9', 'ff', 'fi', 'fl', 'ffi', 'ffl',
    '\u0131', '\u0237', undefined, undefined, undefined, undefined, undefined, undefined, undefined, '\u00DF', '\u00E6', '\u0153', '\u00F8', '\u00C6', '\u0152', '\u00D8',
    undefined, '!', '\u201D', '#', undefined, '%', '&', '\u2019', '(', ')', '*', '+', ',', '-', '.', '/',
    '0', '1', '2', '3', '4', '5', '6', '7', '8', '9', ':', ';', '\u00A1', '=', '\u00BF', '?',
    '@', 'A', 'B', 'C', 'D', 'E', 'F', 'G', 'H', 'I', 'J', 'K', 'L', 'M', 'N', 'O',
    'P', 'Q', 'R', 'S', 'T', 'U', 'V', 'W', 'X', 'Y', 'Z', '[', '\u201C', ']', undefined, undefined,
    '\u2018', 'a', 'b', 'c', 'd', 'e', 'f', 'g', 'h', 'i', 'j', 'k', 'l', 'm', 'n', 'o',
    'p', 'q', 'r', 's', 't', 'u', 'v', 'w', 'x', 'y', 'z', '\u2013', '\u2014', undefined, undefined, undefined,
  ] },
];
