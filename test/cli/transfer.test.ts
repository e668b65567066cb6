import { describe, expect, it } from 'vitest';
import { checkSource } from '../../src/engine/index.js';
import { postReport, receivedReport, type ReportMessage, type ReportPart } from '../../src/cli/transfer.js';

/**
 * A worker's report crosses as V8-serialised bytes (src/cli/transfer.ts), in parts: rebuilt, it
 * equals what structuredClone (the HTML standard's structured clone, which postMessage performs,
 * as Node implements it) makes of the report, keys and items in the same order; the bytes'
 * buffers are moved.
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
    if (!('parts' in message)) throw new Error('no parts');
    // no array longer than a slice: one part, the whole report
    expect(message.parts).toHaveLength(1);
    // the very buffers of the parts (toEqual would take any buffers of the same length)
    expect(transfer).toHaveLength(1);
    expect(transfer[0]).toBe(message.parts[0]?.bytes.buffer);
    const rebuilt = receivedReport(structuredClone(message.parts));
    expect(rebuilt).toStrictEqual(structuredClone(report));
    expect(JSON.stringify(rebuilt)).toBe(JSON.stringify(report));
  });

  it('long arrays cross in slices, rebuilt in order, every buffer moved and each part let go once read', () => {
    const { source: _source, ...report } = checkSource('a.md', text);
    const slice = 7;
    const sent: Array<{ message: ReportMessage; transfer: ArrayBuffer[] }> = [];
    postReport((message, transfer) => sent.push({ message, transfer }), 5, report, slice);
    const { message, transfer } = sent[0]!;
    if (!('parts' in message)) throw new Error('no parts');
    // the head, then ceil(n / slice) parts for each member longer than a slice
    const long = Object.entries(report).filter(([, v]) => Array.isArray(v) && v.length > slice) as Array<[string, unknown[]]>;
    expect(long.map(([k]) => k)).toEqual(expect.arrayContaining(['results', 'findings']));
    const expected = [undefined, ...long.flatMap(([k, v]) => Array.from({ length: Math.ceil(v.length / slice) }, () => k))];
    expect(message.parts.map((p) => p.member)).toEqual(expected);
    expect(transfer).toHaveLength(message.parts.length);
    for (const [i, p] of message.parts.entries()) expect(transfer[i], `part ${i}`).toBe(p.bytes.buffer);
    const parts = structuredClone(message.parts);
    const rebuilt = receivedReport(parts);
    expect(parts).toHaveLength(0);
    expect(rebuilt).toStrictEqual(structuredClone(report));
    expect(JSON.stringify(rebuilt)).toBe(JSON.stringify(report));
  });

  it('an array of exactly a slice crosses in the head; one item more makes two slices', () => {
    const { source: _source, ...report } = checkSource('a.md', text);
    const n = report.results.length;
    const members = (slice: number) => {
      let parts: ReportPart[] = [];
      postReport((m) => (parts = 'parts' in m ? m.parts : []), 0, report, slice);
      const rebuilt = receivedReport([...parts]);
      expect(rebuilt, `slice ${slice}`).toStrictEqual(structuredClone(report));
      return parts.map((p) => p.member).filter((m) => m === 'results').length;
    };
    expect(members(n)).toBe(0);
    expect(members(n - 1)).toBe(2);
  });

  it('parts out of shape are refused, not rebuilt into a wrong report', () => {
    const { source: _source, ...report } = checkSource('a.md', text);
    let parts: ReportPart[] = [];
    postReport((m) => (parts = 'parts' in m ? m.parts : []), 0, report, 7);
    expect(() => receivedReport(parts.slice(1))).toThrow(/starts with its head/);
    const renamed = parts.map((p, i) => (i === 1 ? { ...p, member: 'nothing' } : p));
    expect(() => receivedReport(renamed)).toThrow(/names no array member: nothing/);
  });

  it('unbounded ends (Infinity) and a report without results cross unchanged', () => {
    const { source: _s1, ...unbounded } = checkSource('b.md', 'Scores differed, ts(22) > 4.72, ps ≤ .0001.\n');
    const { source: _s2, ...empty } = checkSource('c.md', 'No statistics here.\n');
    for (const report of [unbounded, empty]) {
      let parts: ReportPart[] = [];
      postReport((m) => (parts = 'parts' in m ? m.parts : []), 0, report);
      expect(receivedReport(parts)).toStrictEqual(structuredClone(report));
    }
  });
});
