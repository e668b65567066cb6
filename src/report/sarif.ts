import { relative, resolve, sep } from 'node:path';
import { originalName, originalShort } from './places.js';
import { pathToFileURL } from 'node:url';
import type { ArtifactLocation, Log, ReportingDescriptor, Result } from 'sarif';
import type { Finding } from '../engine/types.js';
import { jsonChunks } from './jsonChunks.js';
import { CAUTIONS, SKIPPED_LINK_REASON, countRun, type RunReport } from './types.js';

/**
 * SARIF 2.1.0: one run; `tool.driver.rules` carry each rule's summary and its page as help;
 * results carry ruleId, level, message and a region (1-based columns in UTF-16 code units,
 * end column exclusive, as SARIF defines), plus the finding's data under `properties`.
 */
/** The base the artifact URIs are relative to: the folder plumbline ran in. */
export const SARIF_BASE_ID = 'SRCROOT';
/** The name of the finding fingerprint in `partialFingerprints` (versioned: a new way of computing it gets a new name). */
export const FINGERPRINT_NAME = 'plumbline/finding/v1';

export function formatSarif(run: RunReport, cwd: string): string {
  return `${JSON.stringify(sarifLog(run, cwd), finiteOrNull, 2)}\n`;
}

/** The same text as formatSarif, in chunks of about 64 KiB, for a log longer than any one string can be. */
export function formatSarifChunks(run: RunReport, cwd: string): Iterable<string> {
  return jsonChunks(sarifLog(run, cwd), finiteOrNull);
}

/** JSON has no Infinity: an unbounded end is written as null. */
function finiteOrNull(_key: string, v: unknown): unknown {
  return typeof v === 'number' && !Number.isFinite(v) ? null : v;
}

function sarifLog(run: RunReport, cwd: string): Log {
  const rules: ReportingDescriptor[] = run.rules.map((r) => ({
    id: r.id,
    shortDescription: { text: r.summary },
    fullDescription: { text: firstParagraph(r.doc, 'What it checks') ?? r.summary },
    help: { text: r.doc, markdown: r.doc },
    ...(r.helpUri ? { helpUri: r.helpUri } : {}),
    defaultConfiguration: { level: r.defaultLevel === 'off' ? 'none' : r.defaultLevel, enabled: r.defaultLevel !== 'off' },
    properties: { kind: r.kind },
  }));
  const index = new Map(run.rules.map((r, i) => [r.id, i]));
  const results: Result[] = [];
  for (const file of run.files) {
    const uri = artifactLocation(file.path, cwd);
    for (const f of file.findings) results.push(result(f, uri, index.get(f.ruleId)));
  }
  const counts = countRun(run);
  const log: Log = {
    $schema: 'https://json.schemastore.org/sarif-2.1.0.json',
    version: '2.1.0',
    runs: [
      {
        tool: { driver: { name: run.tool.name, version: run.tool.version, semanticVersion: run.tool.version, rules } },
        originalUriBaseIds: { [SARIF_BASE_ID]: { uri: pathToFileURL(cwd.endsWith(sep) ? cwd : `${cwd}${sep}`).href } },
        columnKind: 'utf16CodeUnits',
        results,
        invocations: [
          {
            executionSuccessful: run.failures.length === 0,
            toolExecutionNotifications: [
              ...run.failures.map((f) => ({
                level: 'error' as const,
                message: { text: f.message },
                locations: [
                  {
                    physicalLocation: {
                      artifactLocation: artifactLocation(f.path, cwd),
                      ...(f.line !== undefined ? { region: { startLine: f.line, ...(f.column !== undefined ? { startColumn: f.column } : {}) } } : {}),
                    },
                  },
                ],
              })),
              // a link a folder walk did not follow is a note: nothing failed, the run chose not to read it
              ...(run.skippedLinks ?? []).map((path) => ({
                level: 'note' as const,
                message: { text: SKIPPED_LINK_REASON },
                locations: [{ physicalLocation: { artifactLocation: artifactLocation(path, cwd) } }],
              })),
            ],
          },
        ],
        properties: { cautions: [...CAUTIONS], hiddenByQuietComments: counts.hiddenByQuiet, hiddenByBaseline: counts.hiddenByBaseline },
      },
    ],
  };
  return log;
}

function result(f: Finding, location: ArtifactLocation, ruleIndex: number | undefined): Result {
  return {
    ruleId: f.ruleId,
    ...(ruleIndex !== undefined ? { ruleIndex } : {}),
    level: f.level,
    message: { text: `${f.message} ${f.check}` },
    // a finding said of the whole document (a missing checklist item) has no region: it is about the file
    // a place in a Word or PDF file: lines and columns of the extracted text would point into the
    // binary file, so the place is a logical location (`¶34`, `p. 7 line 23`) with its data under properties
    locations: [
      f.original && f.scope !== 'document'
        ? { physicalLocation: { artifactLocation: location }, logicalLocations: [{ name: originalShort(f.original), fullyQualifiedName: originalName(f.original) }], properties: { original: f.original } }
        : { physicalLocation: { artifactLocation: location, ...(f.scope === 'document' ? {} : { region: region(f) }) } },
    ],
    partialFingerprints: { [FINGERPRINT_NAME]: f.fingerprint },
    ...(f.related?.length
      ? {
          relatedLocations: f.related.map((r, id) => ({
            id,
            message: { text: r.message },
            ...(r.original
              ? { physicalLocation: { artifactLocation: location }, logicalLocations: [{ name: originalShort(r.original), fullyQualifiedName: originalName(r.original) }], properties: { original: r.original } }
              : { physicalLocation: { artifactLocation: location, region: region(r) } }),
          })),
        }
      : {}),
    properties: {
      messageId: f.messageId,
      reported: f.reported,
      ...(f.recomputed ? { recomputed: f.recomputed } : {}),
      ...(f.gap ? { gap: f.gap } : {}),
      check: f.check,
    },
  };
}

function region(p: { start: { line: number; column: number }; end: { line: number; column: number }; span: { start: number; end: number } }) {
  return {
    startLine: p.start.line,
    startColumn: p.start.column,
    endLine: p.end.line,
    endColumn: p.end.column,
    charOffset: p.span.start,
    charLength: p.span.end - p.span.start,
  };
}

/** A file inside the working folder relative to SRCROOT; anything else as an absolute URI. */
function artifactLocation(path: string, cwd: string): ArtifactLocation {
  const uri = artifactUri(path, cwd);
  return /^[a-z][a-z0-9+.-]*:/i.test(uri) || path === '-' || path.startsWith('<') ? { uri } : { uri, uriBaseId: SARIF_BASE_ID };
}

/** A path relative to the working folder as a relative URI; anything else as a file: URI. */
export function artifactUri(path: string, cwd: string): string {
  if (path === '-' || path.startsWith('<')) return encodeURI(path);
  const rel = relative(cwd, resolve(cwd, path));
  if (rel === '' || rel.startsWith('..') || /^[A-Za-z]:/.test(rel) || rel.startsWith(sep)) return pathToFileURL(resolve(cwd, path)).href;
  return rel.split(sep).map(encodeURIComponent).join('/');
}

function firstParagraph(markdown: string, heading: string): string | undefined {
  const at = markdown.indexOf(`## ${heading}`);
  if (at < 0) return undefined;
  const rest = markdown.slice(at).split('\n').slice(1).join('\n').trim();
  return rest.split(/\n\s*\n/)[0]?.replace(/\s+/g, ' ').trim();
}
