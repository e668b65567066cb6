import { describe, expect, it } from 'vitest';
import { checkSource } from '../../src/engine/index.js';
import { postReport, receivedReport, type ReportMessage } from '../../src/cli/transfer.js';

/**
 * A worker's report crosses as V8-serialised bytes (src/cli/transfer.ts): rebuilt, it equals what
 * structuredClone (the HTML standard's structured clone, which postMessage performs, as Node
 * implements it) makes of the report, keys in the same order; the bytes' buffer is moved.
 */
const text = `# Invented\n\n${Array.from({ length: 40 }, (_, i) => `Scores differed, t(${20 + i}) = ${(1 + i / 10).toFixed(2)}, p = .${String(100 + i * 17).padStart(3, '0')}.`).join(' ')}\n\nGroups differed, F(2, 40) = 3.10, p = .056, and ratings were 4.2 ± 1.1 (SD).\n`;

describe('a report sent as bytes', () => {
  it('is rebuilt equal to its structured clone, keys in order, the buffer moved', () => {
    const { source: _source, ...report } = checkSource('a.md', text);
    expect(report.results.length).toBe(40);
    expect(report.findings.length).toBeGreaterThan(0);
    const sent: Array<{ message: ReportMessage; transfer: ArrayBuffer[] }> = [];
    postReport((message, transfer) => sent.push({ message, transfer }), 3, report);
    expect(sent).toHaveLength(1);
    const { message, transfer } = sent[0]!;
    expect(message.index).toBe(3);
    if (!('bytes' in message)) throw new Error('no bytes');
    expect(transfer).toEqual([message.bytes.buffer]);
    const rebuilt = receivedReport(structuredClone(message.bytes));
    expect(rebuilt).toStrictEqual(structuredClone(report));
    expect(JSON.stringify(rebuilt)).toBe(JSON.stringify(report));
  });

  it('unbounded ends (Infinity) and a report without results cross unchanged', () => {
    const { source: _s1, ...unbounded } = checkSource('b.md', 'Scores differed, ts(22) > 4.72, ps ≤ .0001.\n');
    const { source: _s2, ...empty } = checkSource('c.md', 'No statistics here.\n');
    for (const report of [unbounded, empty]) {
      let bytes: Uint8Array | undefined;
      postReport((m) => (bytes = 'bytes' in m ? m.bytes : undefined), 0, report);
      expect(receivedReport(bytes as Uint8Array)).toStrictEqual(structuredClone(report));
    }
  });
});
