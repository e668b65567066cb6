import { describe, expect, it } from 'vitest';
import { cli } from './harness.js';
import { readReport } from '../helpers.js';

/**
 * The reporting checklist through the real command line (run() in-process). Every manuscript
 * here is invented; the statistics are not the point (the items are), though each result is
 * printed as a real t-test would give it.
 */

interface JsonEntry {
  scope: 'document' | 'result';
  resultId?: string;
  status: 'found' | 'missing' | 'not-applicable';
  detail: string;
  place?: { start: { line: number } };
}
interface JsonFile {
  results: Array<{ id: string; printed: string; start: { line: number }; table?: { name: string; row?: string } }>;
  findings: Array<{ ruleId: string; message: string; check: string; reported: string; scope?: string; start: { line: number } }>;
  checklist: Array<{ ruleId: string; item: string; guidelines: Record<string, string>; entries: JsonEntry[] }>;
}

async function json(markdown: string): Promise<JsonFile> {
  const out = await cli(['--format', 'json', '--checklist', '-', '--stdin-name', 'paper.md'], { stdin: markdown });
  return (readReport(out.stdout) as { files: JsonFile[] }).files[0] as JsonFile;
}

const statusesOf = (file: JsonFile, ruleId: string) => file.checklist.find((c) => c.ruleId === ruleId)?.entries.map((e) => e.status);

describe('"The test is named" is judged per result, from its own words', () => {
  it.each([
    [
      "a paired result in the paragraph of a Welch's t is not credited by it",
      "Minutes standing differed between the departments, Welch's t(21.6) = 2.64, p = .015. Fatigue fell in the same staff, t(23) = 2.47, p = .021.",
      ['found', 'missing'],
    ],
    [
      "a result whose own clause says Welch's t is credited, and the result before it in the sentence is not",
      "Step counts differed, t(46) = 1.89, p = .064, and minutes standing differed, Welch's t(21.6) = 2.64, p = .015.",
      ['missing', 'found'],
    ],
    ["a name after the statistic, in its clause", 'Fatigue fell, t(23) = 2.47, p = .021 (paired t-test).', ['found']],
    ["a singular name in the result's lead", 'A paired t-test showed that fatigue fell, t(23) = 2.47, p = .021.', ['found']],
    [
      'a plural name names every result of its sentence',
      'Paired t-tests showed that fatigue fell, t(23) = 2.47, p = .021, and that alertness rose, t(23) = 2.10, p = .047.',
      ['found', 'found'],
    ],
    [
      'a name in the Methods names no particular result',
      '## Methods\n\nThe departments were compared with Welch\'s t-tests.\n\n## Results\n\nStep counts differed, t(40.2) = 2.31, p = .026.',
      ['missing'],
    ],
    [
      'a name in the next sentence about another analysis gives nothing',
      'Posture complaints dropped, t(23) = 5.90, p < .001. A paired t-test showed that the effect held at follow-up (p = .04).',
      ['missing'],
    ],
    ['independent samples without Student or Welch', 'An independent-samples t-test showed a difference, t(46) = 2.31, p = .025.', ['missing']],
    ["Student's t names an independent-samples test", "Student's t-test showed a difference, t(46) = 2.31, p = .025.", ['found']],
    [
      "a table whose header names Welch's t",
      "| Outcome | Welch's t | df | p |\n| --- | --- | --- | --- |\n| Step count | 2.31 | 40.2 | .026 |\n| Minutes standing | 2.64 | 21.6 | .015 |",
      ['found', 'found'],
    ],
    [
      'a table whose caption names paired t-tests',
      'Table 2. Paired t-tests of the outcomes, standing against seated weeks.\n\n| Outcome | t | df | p |\n| --- | --- | --- | --- |\n| Fatigue | 2.47 | 23 | .021 |',
      ['found'],
    ],
    ['a table that names no test', '| Outcome | t | df | p |\n| --- | --- | --- | --- |\n| Fatigue | 2.47 | 23 | .021 |', ['missing']],
    [
      "R's header above its output (Welch)",
      'The output read:\n\n```\n\tWelch Two Sample t-test\n\nt = 2.31, df = 40.2, p-value = 0.02612\n```',
      ['found'],
    ],
    [
      "R's header above each of two outputs in one block: each names its own",
      'The output read:\n\n```\n\tPaired t-test\n\nt = 2.47, df = 23, p-value = 0.02129\n\n\tTwo Sample t-test\n\nt = 2.31, df = 46, p-value = 0.02546\n```',
      ['found', 'found'],
    ],
  ])('%s', async (_name, markdown, expected) => {
    expect(statusesOf(await json(markdown), 'test-is-named')).toEqual(expected);
  });

  it('says what the name is and where it was said', async () => {
    const file = await json('The output read:\n\n```\n\tTwo Sample t-test\n\nt = 2.31, df = 46, p-value = 0.02546\n```');
    // R prints "Two Sample t-test" when var.equal = TRUE: Student's test (R's t.test output, from memory)
    expect(file.checklist.find((c) => c.ruleId === 'test-is-named')?.entries[0]?.detail).toBe(
      "Student's independent-samples t-test: \"Two Sample t-test\" in the software's output header",
    );
  });

  it("on the demo manuscript only the Welch's result and the R output are named (once every result was credited by line 27)", async () => {
    const out = await cli(['--format', 'json', '--checklist', 'fixtures/demo/standing-desks.md']);
    const file = (readReport(out.stdout) as { files: JsonFile[] }).files[0] as JsonFile;
    const found = file.checklist
      .find((c) => c.ruleId === 'test-is-named')
      ?.entries.flatMap((e, i) => (e.status === 'found' ? [`${file.results[i]?.start.line} ${e.detail}`] : []));
    expect(found).toEqual(["27 Welch's independent-samples t-test: \"Welch's t\" with the statistic", "41 Student's independent-samples t-test: \"Two Sample t-test\" in the software's output header"]);
  });
});

describe('"Assumption checks are mentioned" needs a statement that a check was made', () => {
  const result = '\n\nFatigue fell, paired t(23) = 2.47, p = .021.';
  it.each([
    ['a named test of normality', 'Normality of the differences was checked with Shapiro–Wilk tests.', 'found'],
    ["Levene's test for equal variances", "Equal variances were assessed with Levene's test.", 'found'],
    ['inspected Q–Q plots', 'We inspected Q–Q plots of the differences.', 'found'],
    ['histograms inspected', 'Histograms of the differences were inspected.', 'found'],
    ['an assumption said to be met', 'The assumption of normality was met.', 'found'],
    ['a check that found no violation (a negated outcome is still a check)', 'Normality was not violated.', 'found'],
    ["naming Welch's test", "Welch's t-test was used for the comparison of the departments.", 'missing'],
    ["what Welch's test assumes", "Welch's t-test, which does not assume equal variances, was used.", 'missing'],
    ['equal variances not assumed', 'Equal variances were not assumed.', 'missing'],
    ['a negated check', 'Normality was not checked.', 'missing'],
    ['a check not made', 'We did not test for equal variances.', 'missing'],
    ['a named check not run', 'No Shapiro–Wilk test was run.', 'missing'],
    ['the words alone', 'Fatigue scores are normally distributed in office workers.', 'missing'],
    ['what the t-test assumes', 'The t-test assumes normality of the differences.', 'missing'],
  ])('%s', async (_name, sentence, expected) => {
    expect(statusesOf(await json(sentence + result), 'assumptions-are-checked')).toEqual([expected]);
  });
});

describe('outputs for people', () => {
  const demo = 'fixtures/demo/standing-desks.md';
  const run = async (format: string) => (await cli(['--format', format, '--checklist', demo])).stdout;

  it('carry no "(from memory)" and no internal result id, in any format', async () => {
    const data = readReport(await run('json')) as { files: JsonFile[] };
    const file = data.files[0] as JsonFile;
    const ids = file.results.map((r) => r.id);
    expect(ids.length).toBe(13);
    const visibleHtml = (await run('html')).replace(/<[^>]*>/g, ' ');
    const jsonForPeople = [
      ...file.findings.flatMap((f) => [f.message, f.check, f.reported]),
      ...file.checklist.flatMap((c) => [c.item, ...Object.values(c.guidelines), ...c.entries.map((e) => e.detail)]),
    ].join('\n');
    const sarif = JSON.parse(await run('sarif')) as { runs: Array<{ results: Array<{ message: { text: string } }> }> };
    const sarifMessages = (sarif.runs[0]?.results ?? []).map((r) => r.message.text).join('\n');
    const texts: Record<string, string> = { human: await run('human'), checklist: await run('checklist'), html: visibleHtml, json: jsonForPeople, sarif: sarifMessages };
    for (const [format, text] of Object.entries(texts)) {
      expect(text, format).not.toMatch(/from memory/i);
      expect(text, format).not.toMatch(/result \d+:\d+/);
      // result ids are segment:offset; positions in the human format are line:column, so only the others are searched for ids
      if (format !== 'human') for (const id of ids) expect(text, `${format} shows ${id}`).not.toMatch(new RegExp(`(?<![\\d.:])${id}(?![\\d:])`));
    }
  });

  it('cite each guideline item precisely: CONSORT by item number, SAMPL and JARS-Quant by section', async () => {
    const md = await run('checklist');
    expect(md).toContain('CONSORT 2010: item 12a');
    expect(md).toContain('CONSORT 2010: item 17a');
    expect(md).toContain('SAMPL: section "Reporting hypothesis tests"');
    expect(md).toContain('APA JARS-Quant: Table 1, Results, "Statistics and data analysis"');
  });

  it('give a missing document item no line number, in every format', async () => {
    const md = await run('checklist');
    // found items keep their line; missing ones have an empty "Where"
    expect(md).toMatch(/\| Alpha \(the significance level\) is stated \| [^\n]* \| found \| line 15 \| α = \.05 \|/);
    expect(md).toMatch(/\| Multiple comparisons are addressed \| [^\n]* \| \*\*missing\*\* \|  \| how the 13 t-tests were corrected/);
    const human = await run('human');
    expect(human).toMatch(/\n {2}document note {4}multiple-comparisons-addressed\n {4}Multiple comparisons are addressed — not said anywhere in the document: how the 13/);
    const html = await run('html');
    const row = html.match(/<tr><td>Multiple comparisons are addressed<\/td>.*?<\/tr>/)?.[0] ?? '';
    expect(row).toContain('missing');
    expect(row).not.toMatch(/line \d/);
    const sarif = JSON.parse(await run('sarif')) as { runs: Array<{ results: Array<{ ruleId: string; locations: Array<{ physicalLocation: { region?: unknown } }> }> }> };
    const documentResult = sarif.runs[0]?.results.find((r) => r.ruleId === 'multiple-comparisons-addressed');
    expect(documentResult?.locations[0]?.physicalLocation.region).toBeUndefined();
    const data = readReport(await run('json')) as { files: JsonFile[] };
    expect(data.files[0]?.findings.find((f) => f.ruleId === 'multiple-comparisons-addressed')?.scope).toBe('document');
  });

  it('name table-row results by their table and row, not by their cells', async () => {
    const md = await run('checklist');
    expect(md).toContain("12. Table 1, row 'Eye strain': t(23) = 2.20, p = .38");
    expect(md).toContain("Table 1, rows 'Eye strain' and 'Back pain'");
    expect(md).not.toMatch(/2\.20 \\\| 23/);
    const html = await run('html');
    expect(html).toContain('Table 1, row &#39;Eye strain&#39;');
  });

  it("take a table's name from its caption", async () => {
    const file = await json('Table 3. Outcomes after four weeks.\n\n| Outcome | t | df | p |\n| --- | --- | --- | --- |\n| Fatigue | 2.47 | 23 | .021 |');
    expect(file.results[0]?.table).toEqual({ name: 'Table 3', row: 'Fatigue' });
  });
});

describe('repeated per-result notes are summarised: one line per item with its count and its places', () => {
  // forty invented results, one per line; every fourth names its test
  const lines = Array.from({ length: 40 }, (_, i) => `Measure ${i + 1} fell, ${i % 4 === 0 ? 'paired ' : ''}t(23) = 2.47, p = .021.`);
  const manuscript = `# Forty measures\n\n${lines.join('\n\n')}\n`;
  const unnamed = Array.from({ length: 40 }, (_, i) => i).filter((i) => i % 4 !== 0).map((i) => String(3 + 2 * i));

  it('in the checklist report', async () => {
    const out = await cli(['--format', 'checklist', '-', '--stdin-name', 'forty.md'], { stdin: manuscript });
    const each = out.stdout.slice(out.stdout.indexOf('## Each result'), out.stdout.indexOf('### Results read'));
    expect(each.split('\n').filter((l) => l.startsWith('| The test is named'))).toEqual([expect.stringContaining(`| 10 of 40 | lines ${unnamed.join(', ')} |`)]);
    expect(each).toMatch(/\| Descriptives with n are given for each group \| [^\n]* \| 0 of 40 \| all 40 results it applies to \|/);
    // one row per per-result item, not a card per result
    expect(each.split('\n').filter((l) => l.startsWith('| ') && !l.startsWith('| Item') && !l.startsWith('| ---'))).toHaveLength(7);
    expect(out.stdout).not.toMatch(/^### \d+\./m);
  });

  it('in the terminal report', async () => {
    const out = await cli(['--checklist', '-', '--stdin-name', 'forty.md'], { stdin: manuscript });
    expect(out.stdout.split('\n').filter((l) => l.includes('test-is-named'))).toEqual(['  results  note    test-is-named']);
    const unwrapped = out.stdout.replace(/\n {4}(?=\S)/g, ' ');
    expect(unwrapped).toContain(`missing for 30 of 40 results: lines ${unnamed.join(', ')}.`);
    expect(unwrapped).toContain('Descriptives with n are given for each group — missing for all 40 results it applies to.');
    // the summary still counts every finding: the exit status and --max-warnings see them all
    expect(out.stdout).toMatch(/40 results found/);
  });
});
