/**
 * Reading a sidecar: git conflict markers, YAML 1.2 syntax (https://yaml.org/spec/1.2.2/),
 * then schema v1 validation. Never throws on bad input; every problem becomes a diagnostic.
 */
import { LineCounter, parseDocument, type Document } from 'yaml';
import { DiagnosticSink } from './reader';
import type { Sidecar, SidecarDiagnostic } from './types';
import { validateDocument } from './validate';

export interface ParseOptions {
  /**
   * SHA-256 (hex) of the data file as it is now, computed by the caller (core does no I/O and
   * no hashing); when given, a different `data.sha256` is reported as `data-hash-mismatch`.
   */
  dataSha256?: string;
}

export interface ParseResult {
  /**
   * Null when the file cannot be read as schema v1 at all (syntax, conflict, schema, data).
   * Otherwise the picks and couplings that passed validation; the others are left out and reported.
   */
  sidecar: Sidecar | null;
  diagnostics: SidecarDiagnostic[];
  /** True when the file holds git conflict markers. */
  conflicted: boolean;
}

/** `<<<<<<<`, `|||||||` (diff3 base), `=======`, `>>>>>>>` at the start of a line, as git writes them. */
const CONFLICT_MARKER = /^(<{7}|\|{7}|={7}|>{7})(?:[ \t]|$)/;

export function parseSidecar(text: string, fileName: string, options: ParseOptions = {}): ParseResult {
  return readSidecarText(text, fileName, options).result;
}

/** The parse result together with the YAML document it came from (for the layout-keeping writer). */
export interface ParsedText {
  result: ParseResult;
  doc: Document | null;
  lines: LineCounter | null;
}

export function readSidecarText(text: string, fileName: string, options: ParseOptions = {}): ParsedText {
  const markers = conflictMarkers(text, fileName);
  if (markers.length > 0) return { result: { sidecar: null, diagnostics: markers, conflicted: true }, doc: null, lines: null };
  const { doc, sink, lines } = parseYaml(text, fileName);
  if (doc.errors.length > 0) return { result: { sidecar: null, diagnostics: sink.list, conflicted: false }, doc, lines };
  const sidecar = validateDocument(doc, sink);
  if (sidecar !== null && options.dataSha256 !== undefined) checkHash(sidecar, options.dataSha256, doc, sink);
  return { result: { sidecar, diagnostics: sink.list, conflicted: false }, doc, lines };
}

/** False when writing over the file could lose data or hide a problem: any error diagnostic. */
export function isWritable(diagnostics: readonly SidecarDiagnostic[]): boolean {
  return !diagnostics.some((d) => d.severity === 'error');
}

/** The YAML document with syntax errors and warnings already turned into diagnostics. */
export function parseYaml(text: string, fileName: string): { doc: Document; sink: DiagnosticSink; lines: LineCounter } {
  const lines = new LineCounter();
  const doc = parseDocument(text, { lineCounter: lines, version: '1.2', prettyErrors: true, uniqueKeys: true });
  const sink = new DiagnosticSink(fileName, lines);
  for (const e of doc.errors) {
    const at = e.code === 'MISSING_CHAR' ? openingQuote(text, e.pos[0], e.message) ?? e.pos[0] : e.pos[0];
    sink.at(at, 'error', 'yaml-syntax', undefined, `YAML: ${firstLine(e.message)}`);
  }
  for (const w of doc.warnings) sink.at(w.pos[0], 'warning', 'yaml-syntax', undefined, `YAML: ${firstLine(w.message)}`);
  return { doc, sink, lines };
}

/**
 * The parser notices an unclosed quoted scalar only where the file (or the flow) ends; the person
 * needs the line where the quote was opened: the last unescaped quote of that kind before `end`
 * (inside the scalar `""` is written `\"` and `''` doubled, YAML 1.2.2 §7.3.1-7.3.2).
 */
function openingQuote(text: string, end: number, message: string): number | undefined {
  const q = /closing "quote/.test(message) ? '"' : /closing 'quote/.test(message) ? "'" : undefined;
  if (q === undefined) return undefined;
  for (let i = Math.min(end, text.length) - 1; i >= 0; i--) {
    if (text[i] !== q) continue;
    if (q === '"' && text[i - 1] === '\\') continue;
    if (q === "'" && text[i - 1] === "'") {
      i--;
      continue;
    }
    return i;
  }
  return undefined;
}

/** The message without the position suffix and code excerpt that prettyErrors appends. */
function firstLine(message: string): string {
  return (message.split('\n')[0] ?? message).replace(/ at line \d+, column \d+:?$/, '');
}

function conflictMarkers(text: string, file: string): SidecarDiagnostic[] {
  const out: SidecarDiagnostic[] = [];
  text.split(/\r?\n/).forEach((lineText, i) => {
    const m = CONFLICT_MARKER.exec(lineText);
    if (m === null) return;
    const line = i + 1;
    out.push({
      file, line, column: 1, severity: 'error', code: 'conflict-marker',
      message: `${file}:${line}: git conflict marker "${m[1] ?? ''}": resolve the merge conflict before editing this file`,
    });
  });
  return out;
}

function checkHash(sidecar: Sidecar, actual: string, doc: Document, sink: DiagnosticSink): void {
  if (sidecar.data.sha256 === actual.toLowerCase()) return;
  const node = doc.getIn(['data', 'sha256'], true) as { range?: [number, number, number] } | undefined;
  sink.at(node?.range?.[0] ?? 0, 'error', 'data-hash-mismatch', 'data.sha256',
    `${sidecar.data.file} has changed since these picks were made (sha256 ${actual.toLowerCase()}, recorded ${sidecar.data.sha256})`);
}
