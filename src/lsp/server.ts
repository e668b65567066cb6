import { basename, dirname, isAbsolute, join, resolve as resolvePath } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import {
  CodeAction,
  CodeActionKind,
  createConnection,
  DiagnosticSeverity,
  DidChangeWatchedFilesNotification,
  StreamMessageReader,
  StreamMessageWriter,
  TextDocuments,
  TextDocumentSyncKind,
  type Diagnostic,
  type Connection,
} from 'vscode-languageserver/node';
import { TextDocument } from 'vscode-languageserver-textdocument';
import { ConfigError, ConfigFinder, configProblems, mergeConfig, readConfigFile, type Config } from '../config/index.js';
import { packageRoot, rulePageUrl } from '../engine/docs.js';
import { RULE_IDS, type CheckOptions, type FileReport, type Finding } from '../engine/index.js';
import { landFix } from '../fix/apply.js';
import { DEFAULT_BUDGET, type Budget } from '../cli/pool.js';
import { configMessage } from '../cli/runner.js';
import { IncludeFollower, realOrUndefined, type IncludedFile } from '../cli/includes.js';
import { readManuscript } from '../cli/read.js';
import { formatForPath } from '../engine/index.js';
import { Checker } from './checker.js';
import { hoverText } from './hover.js';

/** Quiet time after a keystroke before a document is checked again. */
export const DEBOUNCE_MS = 200;
/** An editor needs its answer soon: a document's default time budget in a server session. */
export const SERVER_BUDGET: Budget = { memoryMb: DEFAULT_BUDGET.memoryMb, seconds: 20 };
const EXPLAIN = 'plumbline.explainRule';

/** The last check published for a document: the version and text it was computed for. */
interface Published {
  version: number;
  snapshot: TextDocument;
  report: FileReport;
  /** The path it was checked as, and the options for a text of it (a quiet comment is tried with the same; notes placed in that text). */
  path: string;
  optionsFor: (text: string) => CheckOptions;
}

/**
 * What an editor may set for the server, in `initializationOptions` or as the `plumbline` key of
 * `workspace/didChangeConfiguration`'s settings: a configuration file used instead of the one
 * found beside each manuscript (as `--config` does), configuration keys applied over the file's
 * (front matter still wins over both), and the quiet time after a keystroke.
 */
export interface ClientSettings {
  configFile?: string;
  configuration?: Config;
  debounceMs?: number;
}

/** The longest quiet time after a keystroke a client may set. */
const MAX_DEBOUNCE_MS = 10_000;

/**
 * Client settings read and checked: `problems` says what is wrong (the documents are then not
 * checked, as with a configuration file that has problems). A relative `configFile` is read from
 * the workspace's root folder.
 */
export function readClientSettings(raw: unknown, root: string | undefined): { settings: ClientSettings; problems: string[] } {
  if (raw === undefined || raw === null) return { settings: {}, problems: [] };
  if (typeof raw !== 'object' || Array.isArray(raw)) return { settings: {}, problems: ['the settings are not an object'] };
  const r = raw as Record<string, unknown>;
  const problems: string[] = [];
  const settings: ClientSettings = {};
  for (const key of Object.keys(r)) if (key !== 'configFile' && key !== 'configuration' && key !== 'debounceMs') problems.push(`unknown setting "${key}" (known: configFile, configuration, debounceMs)`);
  if (r.configFile !== undefined) {
    if (typeof r.configFile !== 'string' || r.configFile === '') problems.push('"configFile" must be a path');
    else if (!isAbsolute(r.configFile) && root === undefined) problems.push(`"configFile" ${r.configFile} is relative and the workspace has no root folder`);
    else settings.configFile = isAbsolute(r.configFile) ? r.configFile : resolvePath(root as string, r.configFile);
  }
  if (r.configuration !== undefined) {
    const found = configProblems(r.configuration, RULE_IDS);
    if (found.length > 0) problems.push(...found.map((m) => `"configuration": ${m}`));
    else settings.configuration = r.configuration as Config;
  }
  if (r.debounceMs !== undefined) {
    if (typeof r.debounceMs !== 'number' || !Number.isInteger(r.debounceMs) || r.debounceMs < 0 || r.debounceMs > MAX_DEBOUNCE_MS) problems.push(`"debounceMs" must be a whole number of milliseconds from 0 to ${MAX_DEBOUNCE_MS}`);
    else settings.debounceMs = r.debounceMs;
  }
  return { settings, problems };
}

/** Severity as the configuration sets it: error, warning, note → information. */
const SEVERITY = { error: DiagnosticSeverity.Error, warning: DiagnosticSeverity.Warning, note: DiagnosticSeverity.Information } as const;

/** A document's path for the engine: its file path, or a name that keeps its format for an unsaved buffer. */
function pathOf(uri: string, languageId: string): { path: string; onDisk: boolean } {
  if (uri.startsWith('file:')) return { path: fileURLToPath(uri), onDisk: true };
  const ext = languageId === 'rmd' || languageId === 'rmarkdown' ? '.Rmd' : languageId === 'quarto' ? '.qmd' : languageId === 'plaintext' ? '.txt' : languageId === 'latex' ? '.tex' : '.md';
  return { path: `untitled${ext}`, onDisk: false };
}

/** The page of a rule: its published address, else the page shipped in the package. */
function rulePage(id: string): string {
  return rulePageUrl(id) ?? pathToFileURL(join(packageRoot(), 'rules', `${id}.md`)).href;
}

/**
 * `plumbline lsp`: the Language Server Protocol over standard input and output. Resolves when
 * the client has asked the server to exit.
 */
export function serve(budget: Budget = SERVER_BUDGET, input: NodeJS.ReadableStream = process.stdin, output: NodeJS.WritableStream = process.stdout): Promise<number> {
  const connection = createConnection(new StreamMessageReader(input), new StreamMessageWriter(output));
  const documents = new TextDocuments(TextDocument);
  const checker = new Checker(budget, 2, (m) => connection.console.warn(m));
  const published = new Map<string, Published>();
  const timers = new Map<string, NodeJS.Timeout>();
  /** Documents with a check running, and whether another was asked for meanwhile. */
  const running = new Map<string, { again: boolean }>();
  let watchRegistration = false;
  let showDocument = false;
  let root: string | undefined;
  let client: { settings: ClientSettings; problems: string[] } = { settings: {}, problems: [] };
  const debounce = () => client.settings.debounceMs ?? DEBOUNCE_MS;

  connection.onInitialize((params) => {
    watchRegistration = params.capabilities.workspace?.didChangeWatchedFiles?.dynamicRegistration === true;
    showDocument = params.capabilities.window?.showDocument?.support === true;
    const rootUri = params.workspaceFolders?.[0]?.uri ?? params.rootUri ?? undefined;
    root = rootUri?.startsWith('file:') ? fileURLToPath(rootUri) : undefined;
    client = readClientSettings(params.initializationOptions, root);
    return {
      capabilities: {
        textDocumentSync: { openClose: true, change: TextDocumentSyncKind.Incremental, save: { includeText: false } },
        hoverProvider: true,
        codeActionProvider: { codeActionKinds: [CodeActionKind.QuickFix] },
        executeCommandProvider: { commands: [EXPLAIN] },
      },
      serverInfo: { name: 'plumbline' },
    };
  });
  connection.onInitialized(() => {
    // configuration files are read afresh on every check; a change to one re-checks what is open
    if (watchRegistration)
      void connection.client.register(DidChangeWatchedFilesNotification.type, {
        watchers: [...['.plumbline.json', '.plumbline.yaml', '.plumbline.yml'].map((n) => ({ globPattern: `**/${n}` })), ...(client.settings.configFile ? [{ globPattern: client.settings.configFile }] : [])],
      });
  });
  connection.onDidChangeWatchedFiles(() => {
    for (const d of documents.all()) schedule(d.uri, 0);
  });
  // settings changed in the editor: read again, and every open document checked again with them
  connection.onDidChangeConfiguration(({ settings }) => {
    const own = typeof settings === 'object' && settings !== null && 'plumbline' in settings ? (settings as { plumbline: unknown }).plumbline : undefined;
    client = readClientSettings(own, root);
    if (watchRegistration && client.settings.configFile)
      void connection.client.register(DidChangeWatchedFilesNotification.type, { watchers: [{ globPattern: client.settings.configFile }] });
    for (const d of documents.all()) schedule(d.uri, 0);
  });

  const schedule = (uri: string, delay: number) => {
    clearTimeout(timers.get(uri));
    timers.set(
      uri,
      setTimeout(() => {
        timers.delete(uri);
        void check(uri);
      }, delay),
    );
  };

  const check = async (uri: string): Promise<void> => {
    const state = running.get(uri);
    if (state) {
      state.again = true; // one check per document at a time; the newest text is checked next
      return;
    }
    const doc = documents.get(uri);
    if (!doc) return;
    running.set(uri, { again: false });
    try {
      const snapshot = TextDocument.create(uri, doc.languageId, doc.version, doc.getText());
      const { path, onDisk } = pathOf(uri, doc.languageId);
      const notChecked = (why: string) =>
        publishIfCurrent(uri, snapshot, [{ range: { start: { line: 0, character: 0 }, end: { line: 0, character: 0 } }, severity: DiagnosticSeverity.Error, source: 'plumbline', message: `Not checked: ${why}` }]);
      if (client.problems.length > 0) {
        notChecked(`the editor's plumbline settings: ${client.problems.join('; ')}`);
        return;
      }
      let options: CheckOptions;
      try {
        options = optionsFor(path, onDisk);
      } catch (e) {
        if (!(e instanceof ConfigError)) throw e;
        notChecked(configMessage(e));
        return;
      }
      // a LaTeX manuscript on disk: its \input and \include files, within its folder, as the command line follows them
      const latex = onDisk && formatForPath(path) === 'latex';
      const real = realOrUndefined(path) ?? path;
      const follower = latex ? new IncludeFollower(dirname(path), dirname(path), new Set([real])) : undefined;
      const base = options;
      const withNotes = (text: string): CheckOptions => {
        // a fresh follower: each text is followed as the first in its run
        const notes = latex ? new IncludeFollower(dirname(path), dirname(path), new Set([real])).follow(text, [real]).notes : [];
        return notes.length > 0 ? { ...base, readNotes: notes } : base;
      };
      const followed = follower?.follow(snapshot.getText(), [real]);
      if (followed && followed.notes.length > 0) options = { ...options, readNotes: followed.notes };
      const outcome = await checker.check({ key: uri, path, source: snapshot.getText(), options });
      if ('error' in outcome) {
        connection.console.warn(`plumbline: ${basename(path)}: ${outcome.error}`);
        return;
      }
      if (publishIfCurrent(uri, snapshot, outcome.report.findings.map((f) => diagnostic(f, snapshot)))) {
        published.set(uri, { version: snapshot.version, snapshot, report: outcome.report, path, optionsFor: withNotes });
        if (follower && followed) await checkIncluded(uri, follower, followed.files, [real]);
        else clearIncluded(uri, new Set());
      }
    } finally {
      const again = running.get(uri)?.again === true;
      running.delete(uri);
      if (again) void check(uri);
    }
  };

  /** The configuration for a document: the settings' file, else the one beside it, read afresh; the settings' keys over it. */
  const optionsFor = (path: string, onDisk: boolean): CheckOptions => {
    const file = client.settings.configFile !== undefined ? readConfigFile(client.settings.configFile, RULE_IDS) : onDisk ? new ConfigFinder(RULE_IDS).forFile(path).config : undefined;
    const config = client.settings.configuration ? mergeConfig(file ?? {}, client.settings.configuration) : file;
    return config ? { config } : {};
  };

  /** The files each open LaTeX manuscript's includes led to (not open themselves), whose diagnostics the server published. */
  const included = new Map<string, Set<string>>();
  const clearIncluded = (uri: string, keep: ReadonlySet<string>) => {
    for (const f of included.get(uri) ?? []) {
      if (keep.has(f) || documents.get(f)) continue;
      checker.forget(`include:${f}`);
      void connection.sendDiagnostics({ uri: f, diagnostics: [] });
    }
    if (keep.size > 0) included.set(uri, new Set(keep));
    else included.delete(uri);
  };
  /**
   * Checks the files a LaTeX manuscript includes, read from disk, and publishes their
   * diagnostics (with no version: they are not open). A file open in the editor is checked as
   * the editor has it, on its own.
   */
  const checkIncluded = async (uri: string, follower: IncludeFollower, files: IncludedFile[], chain: string[]): Promise<void> => {
    const seen = new Set<string>();
    const visit = async (list: IncludedFile[], chainHere: string[]): Promise<void> => {
      for (const f of list) {
        const fileUri = pathToFileURL(f.absolute).href;
        seen.add(fileUri);
        if (documents.get(fileUri)) continue;
        let options: CheckOptions;
        try {
          options = optionsFor(f.absolute, true);
        } catch (e) {
          if (!(e instanceof ConfigError)) throw e;
          continue;
        }
        const read = await readManuscript(f.absolute, options.config?.maxFileBytes);
        if (!read.ok) {
          connection.console.warn(`plumbline: ${f.path}: ${read.message}`);
          continue;
        }
        const next = follower.follow(read.text, [...chainHere, f.real]);
        const notes = [...read.notes, ...next.notes];
        const outcome = await checker.check({ key: `include:${fileUri}`, path: f.absolute, source: read.text, options: notes.length > 0 ? { ...options, readNotes: notes } : options });
        if ('report' in outcome) {
          const snapshot = TextDocument.create(fileUri, 'latex', 0, read.text);
          void connection.sendDiagnostics({ uri: fileUri, diagnostics: outcome.report.findings.map((x) => diagnostic(x, snapshot)) });
        } else connection.console.warn(`plumbline: ${f.path}: ${outcome.error}`);
        await visit(next.files, [...chainHere, f.real]);
      }
    };
    await visit(files, chain);
    clearIncluded(uri, seen);
  };

  /** Publish only what was computed for the document's current version: a stale result never replaces a newer one. */
  const publishIfCurrent = (uri: string, snapshot: TextDocument, diagnostics: Diagnostic[]): boolean => {
    const now = documents.get(uri);
    if (!now || now.version !== snapshot.version) return false;
    void connection.sendDiagnostics({ uri, version: snapshot.version, diagnostics });
    return true;
  };

  const diagnostic = (f: Finding, snapshot: TextDocument): Diagnostic => ({
    // engine offsets are JavaScript string indices, UTF-16 code units, as LSP positions count by default
    range: { start: snapshot.positionAt(f.span.start), end: snapshot.positionAt(f.span.end) },
    severity: SEVERITY[f.level],
    code: f.ruleId,
    codeDescription: { href: rulePage(f.ruleId) },
    source: 'plumbline',
    message: `${f.message} ${f.check}`,
    ...(f.related?.length
      ? { relatedInformation: f.related.map((r) => ({ location: { uri: snapshot.uri, range: { start: snapshot.positionAt(r.span.start), end: snapshot.positionAt(r.span.end) } }, message: r.message })) }
      : {}),
    data: { fingerprint: f.fingerprint },
  });

  // the library reports an opened document as changed too: its first version is checked once, at once
  const opened = new Map<string, number>();
  documents.onDidOpen((e) => {
    opened.set(e.document.uri, e.document.version);
    schedule(e.document.uri, 0);
  });
  documents.onDidChangeContent((e) => {
    if (opened.get(e.document.uri) === e.document.version) return;
    schedule(e.document.uri, debounce());
  });
  documents.onDidSave((e) => schedule(e.document.uri, 0));
  documents.onDidClose((e) => {
    clearTimeout(timers.get(e.document.uri));
    timers.delete(e.document.uri);
    published.delete(e.document.uri);
    opened.delete(e.document.uri);
    checker.forget(e.document.uri);
    checker.forget(`${e.document.uri}#quiet`);
    clearIncluded(e.document.uri, new Set());
    void connection.sendDiagnostics({ uri: e.document.uri, diagnostics: [] });
  });

  /** The last published check, when it was computed for the text the editor has now. */
  const current = (uri: string): Published | undefined => {
    const p = published.get(uri);
    const doc = documents.get(uri);
    return p && doc && doc.version === p.version ? p : undefined;
  };

  connection.onHover(({ textDocument, position }) => {
    const p = current(textDocument.uri);
    if (!p) return null;
    const offset = p.snapshot.offsetAt(position);
    const r = p.report.results.find((x) => x.span.start <= offset && offset <= x.span.end);
    if (!r) return null;
    return { contents: { kind: 'markdown', value: hoverText(r) }, range: { start: p.snapshot.positionAt(r.span.start), end: p.snapshot.positionAt(r.span.end) } };
  });

  connection.onCodeAction(async ({ textDocument, range }) => {
    const p = current(textDocument.uri);
    if (!p) return [];
    const from = p.snapshot.offsetAt(range.start);
    const to = p.snapshot.offsetAt(range.end);
    const text = p.snapshot.getText();
    const actions: CodeAction[] = [];
    const explained = new Set<string>();
    for (const f of p.report.findings) {
      if (f.scope === 'document' ? from !== 0 : f.span.end < from || f.span.start > to) continue;
      const d = diagnostic(f, p.snapshot);
      if (f.fix) {
        const landing = landFix(text, f.fix);
        if (typeof landing !== 'string') {
          const edits = landing.map((l) => ({ range: { start: p.snapshot.positionAt(l.start), end: p.snapshot.positionAt(l.end) }, newText: l.text }));
          actions.push({ title: f.fix.title, kind: CodeActionKind.QuickFix, diagnostics: [d], isPreferred: true, edit: { documentChanges: [{ textDocument: { uri: textDocument.uri, version: p.version }, edits }] } });
        }
      }
      if (f.ruleId !== 'quiet-directive-has-reason') {
        const place = await quietEdit(text, p.report.findings, f, p.report.format, async (filled) => {
          const outcome = await checker.check({ key: `${textDocument.uri}#quiet`, path: p.path, source: filled, options: p.optionsFor(filled) });
          return 'report' in outcome ? outcome.report : undefined;
        });
        const pos = place && p.snapshot.positionAt(place.at);
        if (place && pos) actions.push({
          title: `Add a quiet comment for ${f.ruleId} (then write its reason after the colon)`,
          kind: CodeActionKind.QuickFix,
          diagnostics: [d],
          edit: { documentChanges: [{ textDocument: { uri: textDocument.uri, version: p.version }, edits: [{ range: { start: pos, end: pos }, newText: place.text }] }] },
        });
      }
      if (!explained.has(f.ruleId)) {
        explained.add(f.ruleId);
        actions.push({ title: `Explain the rule ${f.ruleId}`, kind: CodeActionKind.Empty, diagnostics: [d], command: { title: `Explain the rule ${f.ruleId}`, command: EXPLAIN, arguments: [f.ruleId] } });
      }
    }
    return actions;
  });

  connection.onExecuteCommand(async ({ command, arguments: args }) => {
    if (command !== EXPLAIN) return null;
    const id = String(args?.[0] ?? '');
    if (!RULE_IDS.includes(id)) return null;
    const uri = rulePage(id);
    if (showDocument) await connection.window.showDocument({ uri, external: uri.startsWith('http') });
    else connection.window.showInformationMessage(`${id}: ${uri}`);
    return uri;
  });

  documents.listen(connection);
  return new Promise<number>((resolve) => {
    connection.onShutdown(async () => {
      for (const t of timers.values()) clearTimeout(t);
      await checker.close();
    });
    connection.onExit(() => resolve(0));
    connection.listen();
  });
}

/**
 * Where a quiet comment for the block holding `offset` goes: the start of its first line, after
 * the last blank line above it (a comment right above a paragraph belongs to it).
 */
export function blockStart(text: string, offset: number): number {
  let lineStart = text.lastIndexOf('\n', offset - 1) + 1;
  while (lineStart > 0) {
    const prevStart = text.lastIndexOf('\n', lineStart - 2) + 1;
    if (text.slice(prevStart, lineStart - 1).trim() === '') break;
    lineStart = prevStart;
  }
  return lineStart;
}

/** A place a quiet comment may go, and the comment as written there (`REASON` marks where its reason goes). */
export interface QuietPlace {
  at: number;
  text: string;
}

/** A line's container marks (block-quote `>`, list markers, their spaces) before its content. */
const CONTAINER_PREFIX = /^(?:[ \t]{0,3}(?:>[ \t]?|[-+*][ \t]+|[0-9]{1,9}[.)][ \t]+))*/;
/** A list marker in such a prefix. */
const LIST_MARK = /[-+*]|[0-9][.)]/;
const LIST_MARKS = /[-+*]|[0-9]{1,9}[.)]/g;

/**
 * Where a quiet comment for a finding at `offset` might go, most likely first; which of them
 * reaches the finding's block is for the engine to say (quietEdit checks each). Markdown: above
 * the paragraph (after the blank line above it); on a line of its own at the start of a list
 * item's or quoted paragraph's content, the next line continued with the item's indentation or
 * the quote's marks; in a table, at the end of the cell before the finding's cell (a comment
 * applies to the block after it, and each cell is one). LaTeX: a `%` line above the paragraph, or
 * above one of its first lines when commands open it.
 * Plain text has no comments.
 */
export function quietPlaces(text: string, offset: number, format: 'markdown' | 'latex' | 'text'): QuietPlace[] {
  if (format === 'text') return [];
  const start = blockStart(text, offset);
  if (format === 'latex') {
    // above the paragraph; where a command line (\begin{document}, \section{…}) sits right above
    // it, the lines after that, nearest the paragraph's top first (at most five tried)
    const places: QuietPlace[] = [];
    for (let at = start; at <= offset && places.length < 5; at = text.indexOf('\n', at) + 1) {
      places.push({ at, text: '% plumbline quiet RULE: REASON\n' });
      if (text.indexOf('\n', at) < 0) break;
    }
    return places;
  }
  const places: QuietPlace[] = [];
  const prefixAt = (lineStart: number) => CONTAINER_PREFIX.exec(text.slice(lineStart, ((e) => (e < 0 ? text.length : e))(text.indexOf('\n', lineStart))))?.[0] ?? '';
  let indent = 0;
  while (text[start + indent] === ' ') indent += 1;
  if (prefixAt(start).trim() === '' && indent < 4) places.push({ at: start, text: '<!-- plumbline quiet RULE: REASON -->\n' });
  // the first line of the finding's list item or quoted paragraph: up from its line to one with a list marker
  let first = text.lastIndexOf('\n', offset - 1) + 1;
  while (first > start && !LIST_MARK.test(prefixAt(first))) first = text.lastIndexOf('\n', first - 2) + 1;
  const prefix = prefixAt(first);
  if (prefix.trim() !== '') {
    // the item's content column in spaces, the quote's marks kept
    const continued = prefix.replace(LIST_MARKS, (m) => ' '.repeat(m.length));
    places.push({ at: first + prefix.length, text: `<!-- plumbline quiet RULE: REASON -->\n${continued}` });
  }
  // a table row: the end of a cell before the finding (the one whose block the finding has is
  // not known here: nearest first), and for the row's first cell, the end of the row above
  const line = text.lastIndexOf('\n', offset - 1) + 1;
  const rowStart = line + (/^[ \t>]*/.exec(text.slice(line, offset))?.[0].length ?? 0);
  for (let pipe = text.lastIndexOf('|', offset - 1); pipe >= line; pipe = text.lastIndexOf('|', pipe - 1)) {
    if (pipe > rowStart) places.push({ at: pipe, text: `${text[pipe - 1] === ' ' ? '' : ' '}<!-- plumbline quiet RULE: REASON --> ` });
    else if (line > 0) {
      const above = text.lastIndexOf('\n', line - 2) + 1;
      const trailing = text.slice(above, line - 1).trimEnd();
      places.push({ at: above + (trailing.endsWith('|') ? trailing.length - 1 : trailing.length), text: ' <!-- plumbline quiet RULE: REASON --> ' });
    }
    if (pipe === 0) break;
  }
  return places;
}

/** What a finding is, for telling it from the others after a comment is inserted: its rule and the text it stands on. */
const findingKey = (f: Finding, source: string) => `${f.ruleId}\u0000${source.slice(f.span.start, f.span.end)}`;

/**
 * The quiet comment for `finding` (its reason left to the author) at the first of quietPlaces
 * that the engine confirms: with a reason written in, the document checked again loses that
 * finding and only it. `undefined` when no place does (the action is then not offered).
 */
export async function quietEdit(
  source: string,
  findings: readonly Finding[],
  finding: Finding,
  format: FileReport['format'],
  check: (text: string) => Promise<FileReport | undefined>,
): Promise<QuietPlace | undefined> {
  // a Word or PDF file's text is extracted: a comment cannot be written into it
  if (format === 'docx' || format === 'pdf') return undefined;
  const count = (list: readonly Finding[], text: string) => {
    const m = new Map<string, number>();
    for (const f of list) m.set(findingKey(f, text), (m.get(findingKey(f, text)) ?? 0) + 1);
    return m;
  };
  const before = count(findings, source);
  const target = findingKey(finding, source);
  for (const place of quietPlaces(source, finding.scope === 'document' ? 0 : finding.span.start, format)) {
    const comment = place.text.replace('RULE', finding.ruleId);
    const filled = `${source.slice(0, place.at)}${comment.replace('REASON', 'reason')}${source.slice(place.at)}`;
    const report = await check(filled);
    if (!report) return undefined;
    const after = count(report.findings, filled);
    const silenced = [...before].every(([k, n]) => (after.get(k) ?? 0) === (k === target ? n - 1 : n)) && [...after.keys()].every((k) => before.has(k));
    if (silenced) return { at: place.at, text: comment.replace(' REASON', '') };
  }
  return undefined;
}

export type { Connection };
