/** Invented manuscripts and seeded random edits for the incremental re-read tests (test/parse, test/engine). */

/** An invented manuscript with every kind of block next to the others. */
export const RICH = `# Methods

Forty nurses were randomly assigned to the poster group or the no-poster group. Tests were two-tailed.

<!-- plumbline quiet p-follows-from-t: invented reason for the test -->
Compliance was higher with posters, t(38) = 2.10, p = .042, d = 0.66.

Table 2. Compliance by ward

| Ward | M | SD | t | df | p |
|---|---|---|---|---|---|
| North | 7.34 | 1.97 | 2.92 | 38 | .006 |
| South | 6.10 | 2.01 | 1.63 | 34 | .112 |

Note. Invented values. * p < .05.

- Recall was 12.5 (SD = 3.1) with posters and 10.2 (SD = 2.9) without, t(38) = 2.42, p = .020.
- The scores fell, t(19) = -2.30, p = .033.

> Quoted: t(28) = 2.10, p = .045.

## Results

Ratings were 49.5 ± 6.1 (SD) and 45.9 ± 8.2 (SD), t = 0.24, df = 12, p-value = .359. See [the note](https://example.org/note).

\`\`\`r
t.test(x, y)
\`\`\`

<table><tr><td>t(20) = 2.5</td><td>p = .02</td></tr></table>

Attention rose, *t*(44) = 3.01, *p* = .004, 95% CI [0.4, 1.9], with \`code\` beside it.

$$
t = 2.1
$$

Final words, F(2, 60) = 3.40, p = .040.
`;

/** The same with front matter and a link reference definition, which an edit is never read alone beside. */
export const WITH_DEFINITIONS = `---
title: An invented ward study
---

${RICH}
See [the note][n].

[n]: https://example.org/note
`;

/** mulberry32: a small seeded generator, so a failing edit can be replayed. */
export function seeded(seed: number): () => number {
  let a = seed;
  return () => {
    a = (a + 0x6d2b79f5) | 0;
    let t = Math.imul(a ^ (a >>> 15), a | 1);
    t = (t + Math.imul(t ^ (t >>> 7), t | 61)) ^ t;
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

const PIECES = ['0', '1', '7', '9', '.', ',', ' ', 'a', 'T', '\n', '\n\n', '|', '-', '#', '`', '<', '*', '[', ']', '$', '>', '=', 't(', '    ', '<!-- plumbline quiet p-follows-from-t: x -->', 'Table 3', 'Note', '---', '|---|'];

export function edit(text: string, random: () => number): string {
  const at = Math.floor(random() * (text.length + 1));
  const piece = PIECES[Math.floor(random() * PIECES.length)] as string;
  const kind = random();
  if (kind < 0.4) return text.slice(0, at) + piece + text.slice(at + 1); // replace one character
  if (kind < 0.75) return text.slice(0, at) + piece + text.slice(at); // insert
  return text.slice(0, at) + text.slice(at + 1 + Math.floor(random() * 3)); // delete one to three
}

/** Digits changed in place, as a person corrects a number: the edits most often read alone. */
export function digitEdit(text: string, random: () => number): string {
  let at = Math.floor(random() * text.length);
  while (at < text.length && !/[0-9]/.test(text[at] as string)) at += 1;
  if (at >= text.length) return text;
  const digit = String(Math.floor(random() * 10));
  return random() < 0.5 ? text.slice(0, at) + digit + text.slice(at + 1) : text.slice(0, at) + digit + text.slice(at);
}
