/** Bidirectional embedding, override and isolate controls: they reorder what is shown around them. */
// eslint-disable-next-line no-control-regex
const BIDI = /[\u202A-\u202E\u2066-\u2069]/g;
// eslint-disable-next-line no-control-regex
const CONTROLS = /[\u0000-\u0008\u000B-\u001F\u007F-\u009F]/g;
// eslint-disable-next-line no-control-regex
const LINE_BREAKS = /[\t\n\u2028\u2029]/g;

/** A bidi control as a visible escape, `<U+202E>`, so it is shown, not obeyed. */
export function showBidi(s: string): string {
  return s.replace(BIDI, (c) => `<U+${(c.codePointAt(0) as number).toString(16).toUpperCase()}>`);
}

/**
 * Text made safe for a terminal: C0/C1 control characters (escape sequences among them) become
 * a visible "?" so a hostile file cannot move the cursor, recolour or retitle the terminal, and
 * bidi controls are shown as `<U+202E>`. Tabs and line breaks stay (the caller lays them out).
 */
export function terminalSafe(s: string): string {
  return showBidi(s.replace(CONTROLS, '?'));
}

/**
 * A name or message that must stay on its line (a file name, a configuration key): as
 * `terminalSafe`, and tabs and line breaks become "?" too, so a name cannot start a line of
 * its own and forge a finding.
 */
export function terminalLine(s: string): string {
  return terminalSafe(s).replace(LINE_BREAKS, '?');
}

/**
 * A diagnostic for standard error, built as a template: every interpolated value (a path, a
 * message, an option's value) is made safe with `terminalLine`; the literal text keeps its line
 * breaks. `say\`plumbline: ${path}: ${message}\n\``.
 */
export function say(literals: TemplateStringsArray, ...values: ReadonlyArray<string | number>): string {
  let out = literals[0] as string;
  values.forEach((v, i) => {
    out += terminalLine(String(v)) + (literals[i + 1] as string);
  });
  return out;
}
