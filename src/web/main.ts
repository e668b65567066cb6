/// <reference lib="dom" />
/**
 * The browser page: paste a manuscript or drop a file, see the numbers checked beside the text.
 * Everything runs in this tab: the page loads nothing after it opens (its Content-Security-Policy
 * forbids it), and the manuscript is kept only in the page's memory, never in storage.
 */
import { binaryKindOf, checkSource, decodeBytes, readBinaryDocument, RULES, type CheckOptions, type FileReport, type ParsedDocument } from '../engine/index.js';
import { cautionsHtml, fileSection } from '../report/html.js';
import { countRun } from '../report/types.js';

const $ = <T extends HTMLElement>(id: string): T => {
  const el = document.getElementById(id);
  if (!el) throw new Error(`missing #${id}`);
  return el as T;
};

const text = $<HTMLTextAreaElement>('manuscript');
const name = $<HTMLInputElement>('name');
const alpha = $<HTMLInputElement>('alpha');
const tails = $<HTMLSelectElement>('tails');
const checklist = $<HTMLInputElement>('checklist');
const guidelines = $<HTMLSelectElement>('guidelines');
const output = $<HTMLDivElement>('output');
const status = $<HTMLParagraphElement>('status');
const file = $<HTMLInputElement>('file');
const drop = $<HTMLDivElement>('drop');

$('cautions').innerHTML = cautionsHtml();

type LevelSetting = NonNullable<NonNullable<CheckOptions['config']>['rules']>[string];

// One level choice per rule, built with DOM calls; "default" leaves the rule as configured.
const levels = $<HTMLDivElement>('levels');
const levelChoices = new Map<string, HTMLSelectElement>();
for (const rule of RULES) {
  const label = document.createElement('label');
  const title = document.createElement('span');
  title.textContent = rule.id;
  title.title = rule.summary;
  const select = document.createElement('select');
  select.name = `level-${rule.id}`;
  select.dataset.rule = rule.id;
  for (const [value, shown] of [['', `default (${rule.defaultLevel})`], ['off', 'off'], ['note', 'note'], ['warning', 'warning'], ['error', 'error']] as const) {
    const option = document.createElement('option');
    option.value = value;
    option.textContent = shown;
    select.append(option);
  }
  label.append(title, select);
  levels.append(label);
  levelChoices.set(rule.id, select);
}

function ruleLevels(): Record<string, LevelSetting> {
  const chosen: Record<string, LevelSetting> = {};
  for (const [id, select] of levelChoices) {
    const v = select.value;
    if (v === 'off' || v === 'note' || v === 'warning' || v === 'error') chosen[id] = v;
  }
  return chosen;
}

function options(): CheckOptions {
  const a = Number(alpha.value);
  const g = guidelines.value;
  return {
    ...(alpha.value.trim() !== '' && a > 0 && a < 1 ? { alpha: a } : {}),
    ...(tails.value === 'one' || tails.value === 'two' ? { sidedness: tails.value } : {}),
    checklist: checklist.checked,
    config: { guidelines: g === 'all' ? 'all' : [g as 'sampl' | 'jars-quant' | 'consort'], rules: ruleLevels() },
  };
}

/**
 * A Word (or PDF) file read by its front end: the text box shows its extracted text, and while
 * that text is unchanged the check uses the document itself, so places are Word paragraphs
 * (¶34, char 112) or PDF pages and lines (p. 7 line 23). Editing the text checks it as text.
 */
let binary: ParsedDocument | undefined;

let timer: ReturnType<typeof setTimeout> | undefined;
function schedule(): void {
  if (timer !== undefined) clearTimeout(timer);
  timer = setTimeout(check, 150);
}

function check(): void {
  timer = undefined;
  const a = Number(alpha.value);
  if (alpha.value.trim() !== '' && !(a > 0 && a < 1)) {
    status.textContent = 'Alpha must be a number between 0 and 1.';
    return;
  }
  const source = text.value;
  if (source.trim() === '') {
    output.innerHTML = '';
    status.textContent = 'Paste a manuscript (Markdown, LaTeX or plain text) or drop a .md, .tex, .txt, Word .docx or .pdf file.';
    return;
  }
  let report: FileReport;
  try {
    const doc = binary && binary.source === source ? binary : undefined;
    report = checkSource(doc ? doc.path : name.value || 'manuscript.md', source, { ...options(), ...(doc ? { document: doc } : {}) });
  } catch (e) {
    status.textContent = `plumbline could not check this text: ${e instanceof Error ? e.message : String(e)}`;
    return;
  }
  const c = countRun({ tool: { name: 'plumbline', version: '' }, files: [report], failures: [], rules: [] });
  status.textContent = `${c.results} result${c.results === 1 ? '' : 's'} found, ${c.checked} with p recomputed; ${c.error} error${c.error === 1 ? '' : 's'}, ${c.warning} warning${c.warning === 1 ? '' : 's'}, ${c.note} note${c.note === 1 ? '' : 's'}.`;
  // every piece of manuscript text in this HTML is escaped by the report's renderer
  output.innerHTML = fileSection(report, 0);
}

async function load(f: File): Promise<void> {
  if (f.size > 50 * 1024 * 1024) {
    status.textContent = `${f.name} is larger than 50 MiB; not read.`;
    return;
  }
  const bytes = new Uint8Array(await f.arrayBuffer());
  // a Word or PDF file by its name or first bytes, read by its front end as the command line reads it
  const kind = binaryKindOf(f.name, bytes);
  if (kind) {
    const read = await readBinaryDocument(f.name, bytes, kind);
    if (!read.ok) {
      status.textContent = `${f.name}: ${read.message}; not read.`;
      return;
    }
    binary = read.document;
    text.value = read.document.source;
    name.value = f.name;
    check();
    return;
  }
  // the command line's decoding: UTF-8 or UTF-16 with BOM, binary files refused
  const decoded = decodeBytes(bytes);
  if (!decoded.ok) {
    status.textContent = `${f.name}: ${decoded.reason}; not read.`;
    return;
  }
  binary = undefined;
  text.value = decoded.text;
  name.value = f.name;
  check();
}

for (const el of [text, alpha]) el.addEventListener('input', schedule);
for (const el of [tails, checklist, guidelines, name, levels]) el.addEventListener('change', check);
file.addEventListener('change', () => {
  const f = file.files?.[0];
  if (f) void load(f);
});
drop.addEventListener('dragover', (e) => {
  e.preventDefault();
  drop.classList.add('over');
});
drop.addEventListener('dragleave', () => drop.classList.remove('over'));
drop.addEventListener('drop', (e) => {
  e.preventDefault();
  drop.classList.remove('over');
  const f = e.dataTransfer?.files[0];
  if (f) void load(f);
});
$('rule-count').textContent = String(RULES.length);
check();
