/** Escaping and number display shared by the HTML report and its pictures. */
import { showBidi } from './text.js';

// eslint-disable-next-line no-control-regex
const CONTROL = /[\u0000-\u0008\u000b\u000c\u000e-\u001f\u007f-\u009f\u2028\u2029]/g;

/**
 * Text into HTML text or attribute content: control characters dropped, bidi controls shown as
 * `<U+202E>` (a browser would obey them and reorder the text around them), the five specials escaped.
 */
export function escapeHtml(s: string): string {
  return showBidi(s.replace(CONTROL, '')).replace(/[&<>"']/g, (c) => (c === '&' ? '&amp;' : c === '<' ? '&lt;' : c === '>' ? '&gt;' : c === '"' ? '&quot;' : '&#39;'));
}

/** A number for people: four significant digits, exponent form below 1e-4. */
export function shortNumber(x: number): string {
  if (!Number.isFinite(x)) return String(x);
  if (x !== 0 && Math.abs(x) < 1e-4) return x.toExponential(2);
  return String(Number(x.toPrecision(4)));
}
